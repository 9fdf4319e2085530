import { ANALYSIS_DEFAULT_UNCERTAINTY } from "./analysis-default";
import type { CitedValue, FactorSet, FuelFactors } from "../factor-set-schema";
import { TABLE_3_1_REFERENCES, TABLE_3_1_ROWS } from "./ipcc-table-3-1";

// Unconfirmed, every figure below: the tables of the 2006 Guidelines could not be read in their
// published text when the set was last checked (2026-12; docs/provenance.md). Statements list
// them as unconfirmed and their signatory acknowledges each.
function m(value: string, unit: string, source: string, extra: Partial<CitedValue> = {}): CitedValue {
  return { value, unit, source, status: "unconfirmed", ...extra };
}

const V2 = "IPCC 2006 Guidelines Vol 2 Ch";

const gaseousNonCo2 = {
  // Ranges 0.3–3 and 0.03–0.3 (the table's lower and upper values); their half-width, relative to
  // the default, is taken as the expanded uncertainty. Unconfirmed like the defaults themselves.
  ch4: m("1", "kg CH4/TJ NCV", `${V2} 2 Table 2.2 (natural gas, energy industries)`, {
    uncertainty_pct: "135", note: "half-width of the 0.3–3 kg/TJ range of the table, relative to 1 (range unconfirmed)" }),
  n2o: m("0.1", "kg N2O/TJ NCV", `${V2} 2 Table 2.2 (natural gas, energy industries)`, {
    uncertainty_pct: "135", note: "half-width of the 0.03–0.3 kg/TJ range of the table, relative to 0.1 (range unconfirmed)" }),
  oxidation_factor: m("1", "fraction", `${V2} 1 §1.4.2.1 (default oxidation factor 1); Vol 3 §3.2 COF = 1`),
};

const naturalGas: FuelFactors = {
  label: "Natural gas",
  activity: { kind: "energy", unit: "TJ", basis: "NCV" },
  co2: m("56100", "kg CO2/TJ NCV", `${V2} 1 Table 1.4`, {
    uncertainty_pct: "3.6",
    note: "half-width of the 54 300–58 300 kg/TJ range of the table, relative to 56 100",
  }),
  co2_from_analysis: true,
  ...gaseousNonCo2,
  carbon_content: m("15.3", "kg C/GJ NCV", `${V2} 1 Table 1.3`),
  calorific_value: m("48.0", "TJ/Gg NCV", `${V2} 1 Table 1.2`, { note: "range 46.5–50.4" }),
};

const purgeGas: FuelFactors = {
  label: "Synthesis-loop purge / off-gas (carbon content from its analysis)",
  activity: { kind: "energy", unit: "TJ", basis: "NCV" },
  co2: null,
  co2_from_analysis: true,
  ...gaseousNonCo2,
};

export const IPCC_2006: FactorSet = {
  id: "ipcc-2006",
  version: "1",
  name: "IPCC 2006 Guidelines (Vol 2 energy, Vol 3 Ch 3 ammonia)",
  description: "Tier 1 defaults of the 2006 IPCC Guidelines; carbon-content tiers use the month's analyses.",
  effective: { from: "2006-01-01", to: null },
  stoichiometric_factor: { numerator: "44", denominator: "12", unit: "t CO2/t C",
    source: "IPCC 2006 Guidelines Vol 3 Ch 3 Eq 3.1 (44/12)", status: "unconfirmed" },
  fuels: { "natural-gas": naturalGas, "purge-gas": purgeGas },
  default_per_tonne: TABLE_3_1_ROWS,
  default_row: "average-natural-gas",
  benchmarks: TABLE_3_1_REFERENCES,
  gwp_default: "AR5",
  analysis_uncertainty: ANALYSIS_DEFAULT_UNCERTAINTY,
  deduction_rules: {
    urea: { deducted: true, source: "IPCC 2006 Vol 3 §3.2 Eq 3.1, R(CO2) recovered for urea", status: "unconfirmed",
      note: "counted instead where the urea is applied (Vol 4 Ch 11)" },
    storage: { deducted: true, source: "IPCC 2006 Vol 3 §3.2 Eq 3.1, R(CO2) recovered; Vol 2 Ch 5 storage", status: "unconfirmed" },
    sale: { deducted: false, source: "IPCC 2006 Vol 3 §3.2 (our reading: only urea and storage recovery are R)", status: "unconfirmed" },
    pcc: { deducted: false, source: "IPCC 2006 Vol 3 §3.2 (our reading: CO2 bound in precipitated calcium carbonate is not R)", status: "unconfirmed" },
    other: { deducted: false, source: "IPCC 2006 Vol 3 §3.2 (our reading)", status: "unconfirmed" },
  },
};
