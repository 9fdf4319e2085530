import { fuelFor, streamsOf } from "./activity";
import type { CitedValue, FactorSet } from "./factor-set-schema";
import type { GwpSet } from "./gwp";
import type { EmissionsInput } from "./types";

/**
 * Provenance of a cited value: "confirmed" and "unconfirmed" as the factor set records them
 * (factor-set-schema.ts); "site" for a factor the site entered itself (an electricity or steam
 * supplier's figure), which rests on the site's own evidence rather than on a published table.
 */
export type CitationStatus = "confirmed" | "unconfirmed" | "site";

/** One value a month's figures rest on, with the table it comes from. */
export interface Citation {
  key: string;            // e.g. "natural-gas.co2", "stoichiometric-factor", "deduction.urea"
  label: string;
  value: string | null;   // as the set writes it (decimal text, or "44/12")
  unit: string | null;
  source: string;
  status: CitationStatus;
  /** Where the published text was read (confirmed values only). */
  checked: string | null;
  /** The stream a site-entered factor belongs to. */
  stream?: string;
}

const cite = (key: string, label: string, v: Pick<CitedValue, "source" | "status" | "checked"> & { value?: string; unit?: string }): Citation => ({
  key, label, value: v.value ?? null, unit: v.unit ?? null, source: v.source, status: v.status, checked: v.checked ?? null,
});

/**
 * The cited values the month's calculation actually used, so a statement can list its sources and
 * mark those taken from memory. A reader checking a statement needs exactly these, not the whole
 * set: a factor for a fuel the site does not burn says nothing about its figures.
 */
export function citationsFor(input: EmissionsInput, set: FactorSet, gwp: GwpSet, tierFallback?: FactorSet): Citation[] {
  const out: Citation[] = [];
  const method = input.method.emissions;
  const sf = set.stoichiometric_factor;
  if (method !== "default-factor") {
    out.push(cite("stoichiometric-factor", "CO2 per carbon", { ...sf, value: `${sf.numerator}/${sf.denominator}` }));
  }
  if (method === "default-factor") {
    const row = set.default_per_tonne.find((r) => r.id === set.default_row) ?? set.default_per_tonne[0];
    if (row) out.push(cite(`per-tonne.${row.id}`, row.label, row.co2_t_per_t));
  }
  const burnt = streamsOf(input, "fuel-gas", "purge-gas").filter((s) => s.kind === "fuel-gas" || s.fate === "fuel");
  const fuelKeys = new Set(streamsOf(input, "feed-gas", "fuel-gas", "purge-gas").map((s) => fuelFor(set, s).key));
  for (const key of fuelKeys) {
    const fuel = set.fuels[key];
    if (method === "fuel-calculation") {
      if (fuel.co2) out.push(cite(`${key}.co2`, `${fuel.label}: CO2 factor${fuel.co2_from_analysis ? " (used only where no analysis gives the carbon)" : ""}`, fuel.co2));
      out.push(cite(`${key}.oxidation`, `${fuel.label}: oxidation factor`, fuel.oxidation_factor));
    }
    if (burnt.some((s) => fuelFor(set, s).key === key)) {
      if (fuel.ch4) out.push(cite(`${key}.ch4`, `${fuel.label}: CH4 from combustion`, fuel.ch4));
      if (fuel.n2o) out.push(cite(`${key}.n2o`, `${fuel.label}: N2O from combustion`, fuel.n2o));
    }
  }
  // The set's default uncertainty of a gas analysis, where an analysis in use states none.
  const used = new Set(streamsOf(input, "feed-gas", "fuel-gas", "purge-gas").flatMap((s) => (s.analysis ? [s.analysis] : [])));
  const au = set.analysis_uncertainty;
  if (au && [...used].some((id) => input.analyses[id]?.carbon_uncertainty_pct === undefined)) {
    out.push(cite("analysis-uncertainty.carbon", "Uncertainty of an analysis's carbon content (default)", au.carbon));
  }
  if (au && [...used].some((id) => input.analyses[id]?.cv_uncertainty_pct === undefined)) {
    out.push(cite("analysis-uncertainty.calorific", "Uncertainty of an analysis's calorific value (default)", au.calorific));
  }
  const destinations = new Set(streamsOf(input, "co2-export").map((s) => s.destination ?? "other"));
  for (const d of destinations) {
    const rule = set.deduction_rules[d] ?? set.deduction_rules.other;
    const where = d === "pcc" ? "precipitated calcium carbonate" : d;
    out.push(cite(`deduction.${d}`, `CO2 exported to ${where}: ${rule.deducted ? "deducted" : "not deducted"}`, rule));
  }
  if (streamsOf(input, "electricity-import").some((s) => !s.factor_t_per_MWh) && set.grid_electricity) {
    out.push(cite("grid-electricity", "imported electricity", set.grid_electricity));
  }
  if (streamsOf(input, "steam-import", "steam-export").some((s) => !s.factor_t_per_GJ) && set.steam) {
    out.push(cite("steam", "imported/exported steam", set.steam));
  }
  // Factors the site gives its imports itself: a statement lists them beside the set's own.
  for (const s of streamsOf(input, "electricity-import")) {
    if (s.factor_t_per_MWh) out.push(siteFactor(s.id, "electricity", "CO2 factor of the imported electricity", s.factor_t_per_MWh.toString(), "t CO2/MWh"));
  }
  for (const s of streamsOf(input, "steam-import", "steam-export")) {
    if (s.factor_t_per_GJ) out.push(siteFactor(s.id, "steam", `CO2 factor of the ${s.kind === "steam-export" ? "exported" : "imported"} steam`, s.factor_t_per_GJ.toString(), "t CO2/GJ"));
  }
  // Tiers fall back to the EU MRR thresholds when the set has none (as assessTiers does).
  const tier = set.activity_tiers?.[0] ?? tierFallback?.activity_tiers?.[0];
  if (tier) out.push(cite("activity-tiers", `activity-data tier thresholds${set.activity_tiers ? "" : " (the set states none; the EU MRR thresholds are used)"}`, tier));
  out.push({ key: "gwp", label: `GWP100 ${gwp.id}: CH4 ${gwp.ch4.toString()}, N2O ${gwp.n2o.toString()}`, value: null, unit: null,
    source: gwp.source, status: gwp.status, checked: gwp.checked ?? null });
  return out;
}

function siteFactor(stream: string, what: string, label: string, value: string, unit: string): Citation {
  return { key: `${what}.${stream}`, label, value, unit, source: "the site's own figure for this stream (supplier or grid operator)", status: "site", checked: null, stream };
}
