/**
 * A month's method, factor set and GWP set in the words the pages use: the plain name first, the
 * source and version beside it, the code (what the API and the plant-month file carry) last.
 */
import { GWP_SETS } from "@/lib/emissions/gwp";
import { BUILT_IN_FACTOR_SETS } from "@/lib/emissions/registry";
import type { GwpId } from "@/lib/emissions/types";
import { EMISSIONS_METHOD_LABELS } from "@/lib/validations/site";

export interface MethodLabel {
  code: string;
  name: string;
  /** Citation, version or validity, whatever the choice has. */
  detail: string | null;
}

export function emissionsMethodLabel(code: string): MethodLabel {
  return { code, name: EMISSIONS_METHOD_LABELS[code as keyof typeof EMISSIONS_METHOD_LABELS] ?? code, detail: null };
}

export function factorSetLabel(code: string): MethodLabel {
  const set = BUILT_IN_FACTOR_SETS.find((s) => s.id === code);
  if (!set) return { code, name: code, detail: "not a built-in factor set" };
  return { code, name: set.name, detail: `version ${set.version}, in force from ${set.effective.from}${set.effective.to ? ` to ${set.effective.to}` : ""}` };
}

export function gwpLabel(code: string): MethodLabel {
  const g = GWP_SETS[code as GwpId];
  if (!g) return { code, name: code, detail: null };
  return { code, name: `${code}: CH4 ${g.ch4.toFixed()}, N2O ${g.n2o.toFixed()} (100-year)`, detail: `${g.source}${g.status === "unconfirmed" ? " (unconfirmed: not yet read in the published text)" : ""}` };
}

export const FACTOR_SET_CHOICES = BUILT_IN_FACTOR_SETS.map((s) => factorSetLabel(s.id));
export const GWP_CHOICES = (Object.keys(GWP_SETS) as GwpId[]).map(gwpLabel);
export const EMISSIONS_METHOD_CHOICES = Object.keys(EMISSIONS_METHOD_LABELS).map(emissionsMethodLabel);
