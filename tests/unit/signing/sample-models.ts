/**
 * Statement models of the fictional Vellmar Nitrogen Co. (Estuary Works) for layout and signing
 * tests: the monthly one from the engine and the statement builder, the annual one invented.
 */
import { calculate } from "@/lib/balance/calculate";
import { toResultDocument } from "@/lib/balance/result";
import { demoPlantMonths, demoSite } from "@/lib/demo/scenario";
import { buildMonthlyModel } from "@/reports/build-model";
import { STATEMENT_CAUTIONS, type AnnualStatementModel, type MonthlyStatementModel, type StatementHeader } from "@/reports/model";

// Built by the statement builder from an engine run of the demo's March 2026 at Estuary Works,
// so layout and signing tests exercise the model the app prints.
const march = demoPlantMonths("estuary").find((d) => d.month === "2026-03")!;
const result = toResultDocument(calculate(march));
const site = demoSite("estuary");

export const sampleMonthly: MonthlyStatementModel = buildMonthlyModel({
  organisation: "Vellmar Nitrogen Co.",
  site: { name: site.name, code: site.key, meteringReference: "15C", closureTolerancePct: "2", installation: site.installation },
  period: "2026-03",
  revision: 2,
  statementRef: "5d0c2a4e-7f11-4b8e-9a36-2c1f0e9b7a51",
  result,
  document: JSON.parse(JSON.stringify(march)) as Record<string, unknown>,
  analyses: Object.keys(march.analyses).map((key) => ({ key, sampledOn: "2026-03-01", laboratory: "Estuary Works laboratory" })),
  streams: site.streams.map((s) => ({
    key: s.id,
    name: `${s.kind} ${s.id}`,
    kind: s.kind,
    meterTag: s.meter,
    calibratedOn: s.calibrated,
    source: "meter",
    note: null,
    uncertaintyPct: s.uncertainty_pct,
    calibrationIntervalMonths: 12,
  })),
  balanceNote: null,
  preparedBy: "Maren Holt, environmental officer",
  preparedAt: new Date("2026-04-09T08:00:00Z"),
  revisions: [
    { revision: 1, signedAt: new Date("2026-04-06T10:05:00Z"), signer: "Rafael Okonkwo-Lind", reason: "First issue" },
    { revision: 2, signedAt: new Date("2026-04-11T14:32:00Z"), signer: "Rafael Okonkwo-Lind", reason: "Reopened: boiler fuel corrected from the final invoice" },
  ],
  evidence: {
    documentSha256: "4d2b6f8a0c1e3a5b7d9f1c3e5a7b9d0f2a4c6e8b0d1f3a5c7e9b1d3f5a7c9e0b",
    resultSha256: "e1c3a5b7d9f0a2c4e6b8d0f1a3c5e7b9d2f4a6c8e0b1d3f5a7c9e2b4d6f8a0c1",
    engineVersion: result.engine,
    frozenAt: "2026-04-08 09:12 UTC",
    files: [
      { name: "synledger-estuary-2026-03-r2.plant-month.json", what: "plant-month document" },
      { name: "synledger-estuary-2026-03-r2.result.json", what: "result document" },
    ],
  },
  signOff: {
    signer: "Rafael Okonkwo-Lind",
    role: "Signatory",
    signedAt: new Date("2026-04-11T14:32:00Z"),
    certificateSubject: "CN=Vellmar Estuary statements, O=Vellmar Nitrogen Co.",
    certificateFingerprint: "3f9a1c0e5b7d2a4c6e8f0a1b3c5d7e9f1a2b3c4d5e6f708192a3b4c5d6e7f809",
    verifyAt: "https://ledger.vellmar.example/verify/5d0c2a4e-7f11-4b8e-9a36-2c1f0e9b7a51",
  },
});
const header: StatementHeader = sampleMonthly.header;
const method = sampleMonthly.method;
const signOff = sampleMonthly.signOff;

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
  unconfirmedCount: sampleMonthly.unconfirmed.length,
  signOff: { ...signOff, revision: "1", date: "2027-01-20 09:00 UTC" },
};
