import { K95, ZERO, dec, type Decimal } from "../decimal";
import { analysisStd, relStd, streamsOf } from "../activity";
import type { FactorSet } from "../factor-set-schema";
import type { EmissionsInput, Flag } from "../types";
import type { StreamEmission, UncertaintyTerm } from "../model";

/**
 * Purge gas vented leaves the site as methane, not CO2: its carbon came in with the feed, so the
 * carbon-based methods take it out of the CO2 and the non-CO2 part counts it as CH4. Purge burnt
 * as fuel or flared stays in the CO2 already counted through the feed (carbon is counted once).
 */
export function ventedPurgeCarbon(input: EmissionsInput, set: FactorSet, stoich: Decimal, flags: Flag[]):
  { rows: StreamEmission[]; terms: UncertaintyTerm[]; co2_t: Decimal } {
  const rows: StreamEmission[] = [];
  const terms: UncertaintyTerm[] = [];
  let total = ZERO;
  for (const s of streamsOf(input, "purge-gas")) {
    if (s.fate !== "vent") continue;
    if (s.carbon_t === null) {
      flags.push({ code: "purge-carbon-missing", severity: "warning",
        message: `Vented purge ${s.id} has no carbon figure; its carbon stays counted as CO2.` });
      continue;
    }
    const co2 = dec(s.carbon_t).times(stoich).neg();
    total = total.plus(co2);
    rows.push({ id: s.id, kind: s.kind, co2_t: co2, ch4_t: ZERO, n2o_t: ZERO, co2e_t: ZERO,
      basis: "vented purge: its carbon leaves as methane, so it is taken out of the CO2" });
    terms.push({ value_t: co2, stream_id: s.id, meter_rel_std: relStd(s.uncertainty_pct, K95), ...analysisStd(input, set, s, "carbon", flags) });
  }
  return { rows, terms, co2_t: total };
}

/** Flags for purge burnt or flared, so a reader sees it was not double counted. */
export function notePurgeInternal(input: EmissionsInput, flags: Flag[]): void {
  for (const s of streamsOf(input, "purge-gas")) {
    if (s.fate === "fuel" || s.fate === "flare") {
      flags.push({ code: "purge-carbon-counted-in-feed", severity: "info",
        message: `The purge gas (stream ${s.id}) is ${s.fate === "fuel" ? "burnt as fuel" : "flared"}: its carbon entered with the feed gas and is counted there once.` });
    }
  }
}
