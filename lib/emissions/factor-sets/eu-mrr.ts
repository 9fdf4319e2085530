import type { CitedValue, FactorSet, FuelFactors } from "../factor-set-schema";
import { TABLE_3_1_REFERENCES, TABLE_3_1_ROWS } from "./ipcc-table-3-1";

function m(value: string, unit: string, source: string, extra: Partial<CitedValue> = {}): CitedValue {
  return { value, unit, source, status: "from memory", from_memory: true, ...extra };
}

// The EU ETS covers only CO2 for ammonia production, so CH4 and N2O are null (outside scope).
const naturalGas: FuelFactors = {
  label: "Natural gas",
  activity: { kind: "energy", unit: "TJ", basis: "NCV" },
  co2: m("56100", "kg CO2/TJ NCV", "Reg. (EU) 2018/2066 Annex VI Table 1 (56.1 t CO2/TJ)"),
  co2_from_analysis: true,
  ch4: null,
  n2o: null,
  oxidation_factor: m("1", "fraction", "Reg. (EU) 2018/2066 Art 37 (default oxidation factor 1)"),
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
  tier: t, max_uncertainty_pct: pct, status: "published" as const,
  source: "Reg. (EU) 601/2012 Annex II Table 1 (carried into Reg. (EU) 2018/2066 Annex II)",
});

export const EU_MRR: FactorSet = {
  id: "eu-mrr",
  version: "1",
  name: "EU ETS Monitoring and Reporting Regulation (mass balance, Art 25; transfers, Art 49)",
  description: "EU MRR style: stoichiometric factor 3.664, only transfers to storage deducted, product benchmark.",
  effective: { from: "2021-01-01", to: null },
  stoichiometric_factor: { numerator: "3.664", denominator: "1", unit: "t CO2/t C",
    source: "Reg. (EU) 601/2012 and 2018/2066 Art 25 (mass balance, 3.664 t CO2/t C)", status: "published" },
  fuels: { "natural-gas": naturalGas, "purge-gas": purgeGas },
  default_per_tonne: TABLE_3_1_ROWS,
  default_row: "average-natural-gas",
  benchmarks: [
    { id: "eu-ammonia-2021-2025", label: "EU ETS ammonia product benchmark 2021–2025", kind: "product-benchmark",
      value: "1.570", unit: "allowances/t NH3", applies_from: "2021-01-01", applies_to: "2025-12-31",
      source: "Implementing Reg. (EU) 2021/447", status: "from memory", from_memory: true },
    { id: "eu-ammonia-2013-2020", label: "EU ETS ammonia product benchmark 2013–2020", kind: "product-benchmark",
      value: "1.619", unit: "allowances/t NH3", applies_from: "2013-01-01", applies_to: "2020-12-31",
      source: "Decision 2011/278/EU Annex I", status: "from memory", from_memory: true },
    ...TABLE_3_1_REFERENCES,
  ],
  gwp_default: "AR5",
  deduction_rules: {
    urea: { deducted: false, source: "Reg. (EU) 601/2012 Art 49; Decision 2011/278/EU recitals: CO2 to urea is emitted", status: "published" },
    storage: { deducted: true, source: "Reg. (EU) 601/2012 Art 49: transfers to capture, transport or storage", status: "published" },
    sale: { deducted: false, source: "Reg. (EU) 601/2012 Art 49", status: "published" },
    other: { deducted: false, source: "Reg. (EU) 601/2012 Art 49", status: "published" },
  },
  activity_tiers: [tier(1, "7.5"), tier(2, "5"), tier(3, "2.5"), tier(4, "1.5")],
};
