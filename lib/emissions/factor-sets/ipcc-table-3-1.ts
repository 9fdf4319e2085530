import type { Benchmark, CitedValue, PerTonneRow } from "../factor-set-schema";

/**
 * IPCC 2006 Guidelines Vol 3 Ch 3 Table 3.1 (ammonia, total fuel requirement and default CO2 per
 * tonne). All figures are unconfirmed (the table could not be read in its published text when the
 * set was last checked, 2026-12; docs/provenance.md) and are stored as the table is cited: 3.273 for partial oxidation is kept, not recomputed (it implies 18.6 kg C/GJ, not
 * the natural-gas 15.3). Every built-in set carries the rows so a screening estimate is possible
 * under any set; only the IPCC set shows them as benchmarks (they are not the US or EU rules).
 */
const SRC = "IPCC 2006 Guidelines Vol 3 Ch 3 Table 3.1";

function m(value: string, unit: string, uncertainty_pct?: string, note?: string): CitedValue {
  return { value, unit, source: SRC, status: "unconfirmed",
    ...(uncertainty_pct ? { uncertainty_pct } : {}), ...(note ? { note } : {}) };
}

const NG_C = m("15.3", "kg C/GJ", undefined, "natural-gas carbon content used by the table (IPCC 2006 Vol 2 Table 1.3)");

export const TABLE_3_1_ROWS: PerTonneRow[] = [
  { id: "modern-conventional-reforming", label: "Modern plants (Europe), conventional reforming, natural gas",
    fuel_requirement_gj_per_t: m("30.2", "GJ NCV/t NH3", "6"), carbon_content_kg_c_per_gj: NG_C,
    co2_t_per_t: m("1.694", "t CO2/t NH3", "6", "uncertainty of the fuel requirement carried to the factor") },
  { id: "modern-excess-air-reforming", label: "Modern plants (Europe), excess-air reforming, natural gas",
    fuel_requirement_gj_per_t: m("29.7", "GJ NCV/t NH3", "6"), carbon_content_kg_c_per_gj: NG_C,
    co2_t_per_t: m("1.666", "t CO2/t NH3", "6") },
  { id: "modern-autothermal-reforming", label: "Modern plants (Europe), autothermal reforming, natural gas",
    fuel_requirement_gj_per_t: m("30.2", "GJ NCV/t NH3", "6"), carbon_content_kg_c_per_gj: NG_C,
    co2_t_per_t: m("1.694", "t CO2/t NH3", "6") },
  { id: "modern-partial-oxidation", label: "Modern plants (Europe), partial oxidation",
    fuel_requirement_gj_per_t: m("36.0", "GJ NCV/t NH3", "6"), co2_t_per_t: m("2.772", "t CO2/t NH3", "6") },
  { id: "average-natural-gas", label: "Average value, natural gas (mix of modern and older plants)",
    fuel_requirement_gj_per_t: m("37.5", "GJ NCV/t NH3", "7"), carbon_content_kg_c_per_gj: NG_C,
    co2_t_per_t: m("2.104", "t CO2/t NH3", "7") },
  { id: "average-partial-oxidation", label: "Average value, partial oxidation",
    fuel_requirement_gj_per_t: m("48.0", "GJ NCV/t NH3", "7"), co2_t_per_t: m("3.273", "t CO2/t NH3", "7") },
];

/** Table 3.1 figures shown beside a site's intensity as context (not a regulatory benchmark). */
export const TABLE_3_1_REFERENCES: Benchmark[] = [
  { id: "ipcc-modern-conventional", label: "IPCC Table 3.1, modern conventional reforming", kind: "reference",
    value: "1.694", unit: "t CO2/t NH3", applies_from: null, applies_to: null, source: SRC, status: "unconfirmed" },
  { id: "ipcc-average-natural-gas", label: "IPCC Table 3.1, average natural-gas plant", kind: "reference",
    value: "2.104", unit: "t CO2/t NH3", applies_from: null, applies_to: null, source: SRC, status: "unconfirmed" },
];
