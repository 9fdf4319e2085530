import { ANALYSIS_DEFAULT_UNCERTAINTY } from "./analysis-default";
import type { CitedValue, FactorSet, FuelFactors } from "../factor-set-schema";
import { TABLE_3_1_ROWS } from "./ipcc-table-3-1";

function m(value: string, unit: string, source: string, extra: Partial<CitedValue> = {}): CitedValue {
  return { value, unit, source, status: "unconfirmed", ...extra };
}

// Where each confirmed value was read (2026-12; docs/provenance.md). The same provisions of
// Reg. (EU) 2018/2066, which replaced 601/2012, could not be read then; the sources say so.
const READ_601 = "the text of Reg. (EU) 601/2012 as published on legislation.gov.uk (official reproduction)";

// The EU ETS covers only CO2 for ammonia production, so CH4 and N2O are null (outside scope).
const naturalGas: FuelFactors = {
  label: "Natural gas",
  activity: { kind: "energy", unit: "TJ", basis: "NCV" },
  co2: m("56100", "kg CO2/TJ NCV", "Reg. (EU) 2018/2066 Annex VI Table 1 (56.1 t CO2/TJ)"),
  co2_from_analysis: true,
  ch4: null,
  n2o: null,
  oxidation_factor: { value: "1", unit: "fraction", source: "Reg. (EU) 601/2012 Art 37(1) (a value of 1 where the emission factor includes incomplete oxidation); same rule in 2018/2066 unconfirmed",
    status: "confirmed", checked: READ_601 },
  calorific_value: m("48.0", "TJ/Gg NCV", "Reg. (EU) 2018/2066 Annex VI Table 1"),
};

const purgeGas: FuelFactors = {
  label: "Synthesis-loop purge / off-gas (carbon content from its analysis)",
  activity: { kind: "energy", unit: "TJ", basis: "NCV" },
  co2: null,
  co2_from_analysis: true,
  ch4: null,
  n2o: null,
  oxidation_factor: naturalGas.oxidation_factor,
};

const tier = (t: number, pct: string) => ({
  tier: t, max_uncertainty_pct: pct, status: "confirmed" as const, checked: READ_601,
  source: "Reg. (EU) 601/2012 Annex II Table 1 (commercial standard fuels; carried into 2018/2066 Annex II, unconfirmed)",
});

export const EU_MRR: FactorSet = {
  id: "eu-mrr",
  version: "1",
  name: "EU ETS Monitoring and Reporting Regulation (mass balance, Art 25; transfers, Art 49)",
  description: "EU MRR style: stoichiometric factor 3.664, only transfers to storage deducted, product benchmark.",
  effective: { from: "2021-01-01", to: null },
  stoichiometric_factor: { numerator: "3.664", denominator: "1", unit: "t CO2/t C",
    source: "Reg. (EU) 601/2012 Art 36(3) as corrected (3.664 t CO2/t C); mass balance, Art 25 of 2018/2066, unconfirmed", status: "confirmed", checked: READ_601 },
  fuels: { "natural-gas": naturalGas, "purge-gas": purgeGas },
  default_per_tonne: TABLE_3_1_ROWS,
  default_row: "average-natural-gas",
  benchmarks: [
    { id: "eu-ammonia-2021-2025", label: "EU ETS ammonia product benchmark 2021–2025", kind: "product-benchmark",
      value: "1.570", unit: "allowances/t NH3", applies_from: "2021-01-01", applies_to: "2025-12-31",
      source: "Implementing Reg. (EU) 2021/447", status: "unconfirmed" },
    { id: "eu-ammonia-2013-2020", label: "EU ETS ammonia product benchmark 2013–2020", kind: "product-benchmark",
      value: "1.619", unit: "allowances/t NH3", applies_from: "2013-01-01", applies_to: "2020-12-31",
      source: "Decision 2011/278/EU Annex I", status: "unconfirmed" },
  ],
  gwp_default: "AR5",
  // Art 49(1): subtract only CO2 transferred to capture, a transport network or a storage site
  // for long-term geological storage; "for any other transfer … no subtraction".
  deduction_rules: {
    urea: { deducted: false, source: "Reg. (EU) 601/2012 Art 49(1): no subtraction for transfers other than to storage", status: "confirmed", checked: READ_601 },
    storage: { deducted: true, source: "Reg. (EU) 601/2012 Art 49(1)(a)–(c): transfers to capture, transport or geological storage", status: "confirmed", checked: READ_601 },
    sale: { deducted: false, source: "Reg. (EU) 601/2012 Art 49(1): no subtraction for transfers other than to storage", status: "confirmed", checked: READ_601 },
    other: { deducted: false, source: "Reg. (EU) 601/2012 Art 49(1): no subtraction for transfers other than to storage", status: "confirmed", checked: READ_601 },
    // 2018/2066 (which replaced 601/2012 from 2021) adds point (b): after the Court's ruling in
    // Schaefer Kalk (C-460/15, 2017), CO2 chemically bound in precipitated calcium carbonate.
    pcc: { deducted: true, source: "Reg. (EU) 2018/2066 Art 49(1)(b): CO2 transferred out and used to produce precipitated calcium carbonate, in which it is chemically bound", status: "confirmed",
      checked: "Art 49(1)(b) in a consolidated German text of Reg. (EU) 2018/2066 (gesetze.legal, read 2026-12); the consolidation date is not stated there" },
  },
  activity_tiers: [tier(1, "7.5"), tier(2, "5"), tier(3, "2.5"), tier(4, "1.5")],
  analysis_uncertainty: ANALYSIS_DEFAULT_UNCERTAINTY,
};
