import { ANALYSIS_DEFAULT_UNCERTAINTY } from "./analysis-default";
import type { CitedValue, FactorSet, FuelFactors } from "../factor-set-schema";
import { TABLE_3_1_ROWS } from "./ipcc-table-3-1";

/** Confirmed: read in the published text (or a verbatim reproduction of it) named in `checked`. */
function p(value: string, unit: string, source: string, checked: string, extra: Partial<CitedValue> = {}): CitedValue {
  return { value, unit, source, status: "confirmed", checked, ...extra };
}
function m(value: string, unit: string, source: string, extra: Partial<CitedValue> = {}): CitedValue {
  return { value, unit, source, status: "unconfirmed", ...extra };
}

// Where each confirmed value was read (2026-12; docs/provenance.md).
const READ_C2 = "Table C-2 as amended 14 May 2024 (89 FR 42220), in a verbatim eCFR reproduction";
const READ_C1 = "Table C-1 in a reproduction of Subpart C (text of 9 Dec 2016); same figures in Table NN-1 of an eCFR reproduction (2024)";
const READ_G = "§ 98.73(b) Eq G-1 and its definitions, in a verbatim eCFR reproduction (2024 text)";
const READ_72 = "§ 98.72(a), in a verbatim eCFR reproduction";

const nonCo2 = {
  // Table C-2 states no uncertainty; the IPCC 2006 range for the same factors is applied (and said so).
  ch4: p("1.0E-03", "kg CH4/MMBtu HHV", "40 CFR 98 Subpart C Table C-2 (natural gas)", READ_C2, {
    uncertainty_pct: "135", note: "uncertainty: Table C-2 states none; the half-width of the range of IPCC 2006 Vol 2 Ch 2 Table 2.2 (0.3–3 × the default, unconfirmed) is applied" }),
  n2o: p("1.0E-04", "kg N2O/MMBtu HHV", "40 CFR 98 Subpart C Table C-2 (natural gas)", READ_C2, {
    uncertainty_pct: "135", note: "uncertainty: Table C-2 states none; the half-width of the range of IPCC 2006 Vol 2 Ch 2 Table 2.2 (0.03–0.3 × the default, unconfirmed) is applied" }),
  // Eq C-1 has no oxidation term: complete oxidation is assumed.
  oxidation_factor: m("1", "fraction", "40 CFR 98.33(a)(1) Eq C-1 (no oxidation term)"),
};

const naturalGas: FuelFactors = {
  label: "Natural gas (pipeline quality)",
  activity: { kind: "energy", unit: "MMBtu", basis: "GCV" },
  co2: p("53.06", "kg CO2/MMBtu HHV", "40 CFR 98 Subpart C Table C-1 (natural gas, weighted U.S. average)", READ_C1),
  co2_from_analysis: true,
  ...nonCo2,
  default_energy_per_volume: { ...p("1.026E-03", "MMBtu HHV/scf", "40 CFR 98 Subpart C Table C-1 (natural gas, weighted U.S. average)", READ_C1), volume_unit: "scf" },
};

const purgeGas: FuelFactors = {
  label: "Synthesis-loop purge / off-gas (carbon content from its analysis, Tier 3 style)",
  activity: { kind: "energy", unit: "MMBtu", basis: "GCV" },
  co2: null,
  co2_from_analysis: true,
  ...nonCo2,
};

/**
 * Subpart G process CO2 follows Eq G-1 (44/12 × feedstock scf × carbon content × MW / MVC × 0.001);
 * with lib/balance's real-gas kmol, carbon_t × 44/12 is the same product (kmol = scf / MVC), so
 * the engine uses carbon_t directly and keeps MVC here for reference and for `eqG1FeedstockCo2T`.
 */
export const US_MOLAR_VOLUME_SCF_PER_KMOL = p("849.5", "scf/kg-mol at standard conditions", "40 CFR 98.73(b) Eq G-1 (MVC)", READ_G, {
  note: "standard conditions are defined in § 98.6 (68 °F and 14.7 psia, unconfirmed; ideal gas at those gives 849.3)",
});

export const US_40CFR98: FactorSet = {
  id: "us-40cfr98",
  version: "1",
  name: "40 CFR 98 Subparts C (combustion) and G (ammonia manufacturing)",
  description: "US Greenhouse Gas Reporting Program style: HHV basis, process CO2 from feedstock carbon (Eq G-1).",
  effective: { from: "2010-01-01", to: null },
  stoichiometric_factor: { numerator: "44", denominator: "12", unit: "t CO2/t C",
    source: "40 CFR 98.73(b) Eq G-1 (44/12)", status: "confirmed", checked: READ_G },
  fuels: { "natural-gas": naturalGas, "purge-gas": purgeGas },
  default_per_tonne: TABLE_3_1_ROWS,
  default_row: "average-natural-gas",
  // Subpart G sets no product benchmark; IPCC's reference figures belong to the IPCC set.
  benchmarks: [],
  gwp_default: "AR5",
  analysis_uncertainty: ANALYSIS_DEFAULT_UNCERTAINTY,
  gwp_by_reporting_year: [
    { from_year: "2010", to_year: "2024", gwp: "AR4", source: "40 CFR 98 Table A-1 before its 2024 amendment (CH4 25, N2O 298)", status: "confirmed",
      checked: "40 CFR 98 Table A-1 in a verbatim eCFR reproduction (text before the 2024 amendment)" },
    { from_year: "2025", to_year: null, gwp: "AR5", source: "40 CFR 98 Table A-1 as amended in 2024 (89 FR 31802), said to apply from reporting year 2025", status: "unconfirmed" },
  ],
  // Eq G-1 literally: the feedstock volume restated to the rule's standard conditions, month by month.
  feedstock_volume_equation: {
    equation: "40 CFR 98.73(b)(1) Eq G-1",
    mvc_scf_per_kmol: US_MOLAR_VOLUME_SCF_PER_KMOL,
    standard_temperature_f: "68",
    standard_pressure_psia: "14.7",
    standard_source: "68 °F read in 40 CFR 98.163 (Subpart P's Fdstk: 'scf (at standard conditions of 68 °F and atmospheric pressure)'); 14.7 psia from § 98.6, not read here (unconfirmed)",
  },
  deduction_rules: {
    urea: { deducted: false, source: "40 CFR 98.72(a): process CO2 includes CO2 later consumed for urea", status: "confirmed", checked: READ_72 },
    storage: { deducted: false, source: "40 CFR 98 Subpart G (captured CO2 reported under Subpart PP, not deducted)", status: "unconfirmed" },
    sale: { deducted: false, source: "40 CFR 98.72", status: "unconfirmed" },
    pcc: { deducted: false, source: "40 CFR 98.72", status: "unconfirmed" },
    other: { deducted: false, source: "40 CFR 98.72", status: "unconfirmed" },
  },
};
