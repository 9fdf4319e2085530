import { K95, ZERO, dec } from "../decimal";
import { relStd, streamsOf } from "../activity";
import type { FactorSet } from "../factor-set-schema";
import type { MethodOutcome, StreamEmission, UncertaintyTerm } from "../model";
import type { EmissionsInput, Flag } from "../types";

/**
 * Default-factor screening estimate: tonnes of ammonia × the set's per-tonne default (IPCC 2006
 * Vol 3 Table 3.1, Eq 3.1 at Tier 1). It ignores the plant's own feed and fuel, so it is labelled
 * a screening estimate in a flag and in the result, never a monitored figure.
 */
export function defaultFactor(input: EmissionsInput, set: FactorSet): MethodOutcome {
  const flags: Flag[] = [];
  const row = set.default_per_tonne.find((r) => r.id === set.default_row) ?? set.default_per_tonne[0];
  if (!row) {
    flags.push({ code: "default-factor-missing", severity: "error", message: `Factor set ${set.id} has no per-tonne default.` });
    return { by_stream: [], gross_co2_t: ZERO, terms: [], flags, balance_check: null, screening_estimate: true };
  }
  const factor = dec(row.co2_t_per_t.value);
  const factorStd = relStd(row.co2_t_per_t.uncertainty_pct, K95);
  flags.push({ code: "screening-estimate", severity: "warning",
    message: `Screening estimate: ammonia × ${row.co2_t_per_t.value} t CO2/t (${row.label}, ${row.co2_t_per_t.source}); not a monitored figure.` });
  const nh3 = streamsOf(input, "ammonia").filter((s) => s.t !== null);
  // Per ammonia meter when they add up to ammonia_t, so each meter's uncertainty is propagated.
  const perMeter = nh3.length > 0 && nh3.reduce((a, s) => a.plus(dec(s.t!)), ZERO).eq(dec(input.ammonia_t));
  const parts = perMeter
    ? nh3.map((s) => ({ id: s.id, t: dec(s.t!), meter: relStd(s.uncertainty_pct, K95) }))
    : [{ id: "ammonia", t: dec(input.ammonia_t), meter: null }];
  const terms: UncertaintyTerm[] = [];
  const rows: StreamEmission[] = [];
  for (const p of parts) {
    const co2 = p.t.times(factor);
    rows.push({ id: p.id, kind: "ammonia-production", co2_t: co2, ch4_t: ZERO, n2o_t: ZERO, co2e_t: ZERO,
      basis: `screening estimate: ${p.t.toString()} t NH3 × ${row.co2_t_per_t.value} t CO2/t NH3`,
      co2_factor: { value: factor, unit: "t CO2/t NH3", origin: "table-3.1", source: row.co2_t_per_t.source } });
    terms.push({ value_t: co2, stream_id: p.id, meter_rel_std: p.meter,
      ...(factorStd ? { factor_key: `${set.id}:per-tonne:${row.id}`, factor_rel_std: factorStd } : {}) });
  }
  const gross = terms.reduce((a, t) => a.plus(t.value_t), ZERO);
  return { by_stream: rows, gross_co2_t: gross, terms, flags, balance_check: null, screening_estimate: true };
}
