/**
 * Invented statement models for the fictional Vellmar Nitrogen Co. (Estuary works). The figures
 * are display strings made up for layout and signing tests, not engine output.
 */
import { STATEMENT_CAUTIONS, type AnnualStatementModel, type MonthlyStatementModel, type StatementHeader } from "@/reports/model";

const header: StatementHeader = {
  organisation: "Vellmar Nitrogen Co.",
  siteName: "Estuary works",
  siteCode: "EST",
  period: "2026-03",
  periodLabel: "March 2026",
  revision: "2",
  statementRef: "5d0c2a4e-7f11-4b8e-9a36-2c1f0e9b7a51",
  meteringReference: "15 °C, 101.325 kPa (Sm³)",
  preparedBy: "Ines Okafor, environmental officer",
  preparedAt: "2026-04-09",
};

const method: MonthlyStatementModel["method"] = {
  method: "Carbon mass balance (feed and fuel carbon in, exported and vented carbon out)",
  factorSet: "IPCC 2006 Guidelines, volume 3 chapter 3 (built-in set ipcc-2006 v1)",
  gwpSet: "AR5, 100-year horizon",
  sources: [
    { item: "Carbon content of natural gas", value: { value: "0.7342", unit: "t C / t gas" }, source: "Monthly analysis GA-03, laboratory Kestrel Labs" },
    { item: "CH4 from stationary combustion", value: { value: "1", unit: "kg / TJ" }, source: "IPCC 2006 vol. 2 table 2.2" },
    { item: "N2O from stationary combustion", value: { value: "0.1", unit: "kg / TJ" }, source: "IPCC 2006 vol. 2 table 2.2" },
    { item: "GWP of CH4 / N2O", value: { value: "28 / 265", unit: "" }, source: "IPCC AR5 WG1 table 8.7" },
  ],
  notes: ["CO2 sent to the urea unit is shown separately and deducted because the factor set's rules allow it."],
};

const signOff: MonthlyStatementModel["signOff"] = {
  signer: "Tomasz Ferreira",
  role: "Signatory (plant manager)",
  date: "2026-04-11 14:32 UTC",
  revision: "2",
  certificateSubject: "CN=Vellmar Estuary statements, O=Vellmar Nitrogen Co.",
  certificateFingerprint: "3f9a1c0e5b7d2a4c6e8f0a1b3c5d7e9f1a2b3c4d5e6f708192a3b4c5d6e7f809",
  verifyAt: "https://ledger.vellmar.example/verify",
};

export const sampleMonthly: MonthlyStatementModel = {
  header,
  method,
  evidence: {
    documentSha256: "4d2b6f8a0c1e3a5b7d9f1c3e5a7b9d0f2a4c6e8b0d1f3a5c7e9b1d3f5a7c9e0b",
    resultSha256: "e1c3a5b7d9f0a2c4e6b8d0f1a3c5e7b9d2f4a6c8e0b1d3f5a7c9e2b4d6f8a0c1",
    engineVersion: "synledger-engine/2026.12.1",
    frozenAt: "2026-04-08 09:12 UTC",
    files: [
      { name: "synledger-estuary-2026-03-r2.plant-month.json", what: "plant-month document" },
      { name: "synledger-estuary-2026-03-r2.result.json", what: "result document" },
    ],
  },
  inputs: [
    { stream: "Feed gas to primary reformer", kind: "feed gas", quantity: { value: "31 482 600", unit: "Sm³" }, dataSource: "meter FT-101, calibrated 2025-11-04", uncertainty: "± 1.0 %" },
    { stream: "Fuel gas to reformer burners", kind: "fuel gas", quantity: { value: "12 904 350", unit: "Sm³" }, dataSource: "meter FT-114, calibrated 2025-09-18", uncertainty: "± 1.5 %" },
    { stream: "Auxiliary boiler fuel", kind: "fuel gas", quantity: { value: "2 116 080", unit: "Sm³" }, dataSource: "invoice VNG-2026-03-118", uncertainty: "± 2.0 %" },
    { stream: "Process air to secondary reformer", kind: "process air", quantity: { value: "58 220", unit: "t" }, dataSource: "meter FT-205, calibrated 2026-01-12", uncertainty: "± 2.5 %" },
    { stream: "Ammonia product", kind: "ammonia", quantity: { value: "37 905.4", unit: "t" }, dataSource: "tank gauging TG-401", uncertainty: "± 0.5 %" },
    { stream: "CO2 to urea unit", kind: "CO2 export", quantity: { value: "41 870.2", unit: "t" }, dataSource: "meter FT-512, calibrated 2025-12-02", uncertainty: "± 1.5 %" },
    { stream: "CO2 stripper vent", kind: "CO2 vent", quantity: { value: "9 412.8", unit: "t" }, dataSource: "meter FT-520, calibrated 2025-10-21", uncertainty: "± 5.0 %" },
    { stream: "Purge gas to fuel header", kind: "purge gas", quantity: { value: "1 644 900", unit: "Sm³" }, dataSource: "estimate: design ratio, meter FT-330 out of service", uncertainty: "± 10 %" },
    { stream: "Imported electricity", kind: "electricity", quantity: { value: "4 318", unit: "MWh" }, dataSource: "grid invoice EL-0326", uncertainty: "± 0.5 %" },
  ],
  balances: [
    { element: "Carbon", inflow: { value: "17 036.9", unit: "t C" }, outflow: { value: "16 878.1", unit: "t C" }, closure: { value: "−0.93", unit: "%" }, tolerance: { value: "2.0", unit: "%" }, mark: "ok", status: "Closed within tolerance" },
    { element: "Nitrogen", inflow: { value: "31 402.7", unit: "t N" }, outflow: { value: "31 205.4", unit: "t N" }, closure: { value: "−0.63", unit: "%" }, tolerance: { value: "2.0", unit: "%" }, mark: "ok", status: "Closed within tolerance" },
    { element: "Hydrogen equivalents", inflow: { value: "3 402.5", unit: "t H2" }, outflow: { value: "3 311.9", unit: "t H2" }, closure: { value: "−2.66", unit: "%" }, tolerance: { value: "2.0", unit: "%" }, mark: "attention", status: "Outside tolerance, reason written" },
  ],
  reconciliation: [
    "Reconciliation global test: chi-square 9.84 against 7.81 (3 degrees of freedom, 95 %): failed.",
    "Most likely faulty meter: FT-330 purge gas (estimate), adjusted by +6.2 %.",
  ],
  emissionsUnit: "t",
  emissionsBySource: [
    { source: "Process CO2 (carbon balance)", basis: "feed carbon less carbon exported, as CO2", co2: "51 283.0", ch4: "—", n2o: "—", co2e: "51 283.0" },
    { source: "Reformer burners", basis: "fuel gas × analysed carbon × 44/12", co2: "24 611.4", ch4: "0.45", n2o: "0.045", co2e: "24 636.9" },
    { source: "Auxiliary boiler", basis: "invoice quantity × factor-set factor", co2: "4 035.7", ch4: "0.07", n2o: "0.007", co2e: "4 039.6" },
    { source: "Purge gas burnt", basis: "estimated purge × analysed carbon × 44/12", co2: "1 102.6", ch4: "0.02", n2o: "0.002", co2e: "1 103.7" },
  ],
  emissionsByGas: [
    { gas: "CO2", mass: { value: "81 032.7", unit: "t" }, gwp: "1", co2e: { value: "81 032.7", unit: "t CO2e" } },
    { gas: "CH4", mass: { value: "0.54", unit: "t" }, gwp: "28", co2e: { value: "15.1", unit: "t CO2e" } },
    { gas: "N2O", mass: { value: "0.054", unit: "t" }, gwp: "265", co2e: { value: "14.3", unit: "t CO2e" } },
  ],
  co2: {
    gross: { value: "81 032.7", unit: "t CO2" },
    deducted: { value: "41 870.2", unit: "t CO2" },
    net: { value: "39 162.5", unit: "t CO2" },
    deductionNote: "Deducted: CO2 metered to the urea unit (FT-512). Vented CO2 (FT-520) is not deducted.",
  },
  intensities: [
    { measure: "Direct CO2e per tonne NH3 (gross)", value: { value: "2.139", unit: "t CO2e/t NH3" }, benchmark: { value: "1.619", unit: "t CO2e/t NH3" }, benchmarkSource: "set benchmark, ammonia (from memory)", mark: "attention", position: "Above benchmark by 32 %" },
    { measure: "Net CO2e per tonne NH3", value: { value: "1.034", unit: "t CO2e/t NH3" }, benchmark: { value: "1.619", unit: "t CO2e/t NH3" }, benchmarkSource: "set benchmark, ammonia (from memory)", mark: "ok", position: "Below benchmark" },
    { measure: "Energy per tonne NH3 (net CV)", value: { value: "29.84", unit: "GJ/t NH3" }, benchmark: { value: "28.0", unit: "GJ/t NH3" }, benchmarkSource: "common practice, no source", mark: "info", position: "For information" },
  ],
  uncertainty: [
    { figure: "Gross CO2", value: { value: "81 032.7", unit: "t CO2" }, expanded: "± 1.9 %", note: "meters FT-101, FT-114, invoice, FT-330; factor uncertainties correlated per factor" },
    { figure: "Net CO2", value: { value: "39 162.5", unit: "t CO2" }, expanded: "± 4.4 %", note: "gross CO2 together with export meter FT-512" },
  ],
  flags: [
    { mark: "attention", stream: "", code: "H_CLOSURE", message: "Hydrogen balance outside tolerance", explanation: "FT-330 purge meter out of service 3–17 March; purge taken from the design ratio, which under-reads at reduced rate.", explainedBy: "Arvid Lindqvist, process engineer" },
    { mark: "info", stream: "", code: "ESTIMATE_USED", message: "An input is an estimate, not a meter reading", explanation: "", explainedBy: "" },
  ],
  revisions: [
    { revision: "1", signedAt: "2026-04-06 10:05 UTC", signer: "Tomasz Ferreira", reason: "First issue" },
    { revision: "2", signedAt: "2026-04-11 14:32 UTC", signer: "Tomasz Ferreira", reason: "Reopened: boiler fuel corrected from the final invoice" },
  ],
  cautions: [...STATEMENT_CAUTIONS],
  signOff,
};

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

export const sampleAnnual: AnnualStatementModel = {
  header: { ...header, period: "2026", periodLabel: "Calendar year 2026", revision: "1", statementRef: "a1e5b7c9-3d2f-4e6a-8b0c-9f1e2d3c4b5a" },
  method,
  sources: [
    { month: "January 2026", revision: "1", statementRef: "5b1f0c3e-2a4d-4e6f-8a0b-1c2d3e4f5a6b", resultSha256: "9c1e7a3b5d0f2e4a6c8b0d1f3a5c7e9b2d4f6a8c0e1b3d5f7a9c2e4b6d8f0a1c" },
  ],
  units: { ammonia: "t", co2: "t", co2e: "t", intensity: "t CO2e/t NH3" },
  months: MONTHS.map((m, i) => ({
    month: `${m} 2026`,
    revision: i === 2 ? "2" : "1",
    ammonia: (36_000 + i * 137.5).toFixed(1).replace(/\B(?=(\d{3})+(?!\d))/g, " "),
    grossCo2: (79_000 + i * 211.3).toFixed(1).replace(/\B(?=(\d{3})+(?!\d))/g, " "),
    deducted: (41_000 + i * 55.2).toFixed(1).replace(/\B(?=(\d{3})+(?!\d))/g, " "),
    netCo2: (38_000 + i * 156.1).toFixed(1).replace(/\B(?=(\d{3})+(?!\d))/g, " "),
    co2e: (79_030 + i * 211.3).toFixed(1).replace(/\B(?=(\d{3})+(?!\d))/g, " "),
    intensity: (2.195 - i * 0.004).toFixed(3),
    status: "Signed",
  })),
  totals: { ammonia: "441 075.0", grossCo2: "961 946.6", deducted: "495 643.2", netCo2: "466 303.4", co2e: "962 306.6", intensity: "2.182" },
  emissionsByGas: sampleMonthly.emissionsByGas.map((g) => ({ ...g })),
  intensities: sampleMonthly.intensities,
  uncertainty: [
    { figure: "Gross CO2, year", value: { value: "961 946.6", unit: "t CO2" }, expanded: "± 1.2 %", note: "monthly meter errors independent; factor errors fully correlated across months" },
  ],
  flags: [],
  revisions: [{ revision: "1", signedAt: "2027-01-20 09:00 UTC", signer: "Tomasz Ferreira", reason: "First issue" }],
  cautions: [...STATEMENT_CAUTIONS],
  signOff: { ...signOff, revision: "1", date: "2027-01-20 09:00 UTC" },
};
