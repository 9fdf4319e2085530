// The emissions members of the result document `synledger.result/1`. The documented keys of
// `emissions` and `intensity` stay flat strings (scripts read them with a plain lookup); the
// breakdowns live beside them under their own keys, so adding detail never moves a stable key.
import type { UncertaintyFigures } from "../emissions/uncertainty";
import type { EmissionsResult } from "../emissions/result";
import { type Dec, num } from "./decimal";

/**
 * The uncertainty of one figure: expanded at 95 %, with its meter (systematic and random),
 * analysis and factor parts. A calculation frozen by an earlier engine lacks the analysis part
 * and the meter split: those read as absent (null, empty), never as a crash.
 */
export function uncertaintyJson(given: UncertaintyFigures) {
  const u = given as Partial<UncertaintyFigures> & Pick<UncertaintyFigures, "value_t" | "u95_t" | "u95_pct" | "coverage_factor" | "u_std_t" | "meter_u_std_t" | "factor_u_std_t" | "meter_components" | "factor_components" | "meters_without_uncertainty">;
  return {
    value_t: num(u.value_t),
    u95_t: num(u.u95_t),
    u95_pct: num(u.u95_pct),
    confidence_pct: "95",
    coverage_factor: num(u.coverage_factor),
    u_std_t: num(u.u_std_t),
    meter_u_std_t: num(u.meter_u_std_t),
    meter_systematic_u_std_t: num(u.meter_systematic_u_std_t ?? null),
    meter_random_u_std_t: num(u.meter_random_u_std_t ?? null),
    analysis_u_std_t: num(u.analysis_u_std_t ?? null),
    factor_u_std_t: num(u.factor_u_std_t),
    meter_components: u.meter_components.map((c) => ({
      key: c.key, u_std_t: num(c.u_std_t), systematic_u_std_t: num(c.systematic_u_std_t ?? null), random_u_std_t: num(c.random_u_std_t ?? null), period: c.period ?? null,
    })),
    analysis_components: (u.analysis_components ?? []).map((c) => ({ key: c.key, u_std_t: num(c.u_std_t) })),
    factor_components: u.factor_components.map((c) => ({ key: c.key, u_std_t: num(c.u_std_t) })),
    meters_without_uncertainty: u.meters_without_uncertainty,
    correlation: u.correlation ?? null,
  };
}

/** `gjLhvPerT` comes from lib/balance's feed figures, which the format has always printed. */
export function emissionsDocumentPart(d: EmissionsResult, gjLhvPerT: Dec | null, gjHhvPerT: Dec | null = null) {
  const e = d.emissions;
  const i = d.intensity;
  const gas = (g: { t: Dec; co2e_t: Dec }, gwp: Dec | null) => ({ t: num(g.t), gwp: num(gwp), co2e_t: num(g.co2e_t) });
  return {
    emissions: {
      co2_t: num(e.co2_t), ch4_t: num(e.ch4_t), n2o_t: num(e.n2o_t), co2e_t: num(e.co2e_t),
      transferred_co2_t: num(e.transferred_co2_t), net_co2e_t: num(e.net_co2e_t),
      gross_co2_t: num(d.co2.gross_t), deductible_co2_t: num(d.co2.deductible_t), net_co2_t: num(d.co2.net_t),
    },
    intensity: {
      co2e_t_per_t_nh3: num(i.co2e_t_per_t_nh3),
      gj_lhv_per_t_nh3: num(gjLhvPerT),
      gj_hhv_per_t_nh3: num(gjHhvPerT),
      co2_t_per_t_nh3: num(i.co2_t_per_t_nh3),
      net_co2e_t_per_t_nh3: num(i.net_co2e_t_per_t_nh3),
      co2e_incl_indirect_t_per_t_nh3: num(i.co2e_incl_indirect_t_per_t_nh3),
      indirect_co2e_t: num(i.indirect_co2e_t),
      indirect_complete: i.indirect_complete,
    },
    emissions_by_stream: d.by_stream.map((s) => ({
      id: s.id, kind: s.kind, co2_t: num(s.co2_t), ch4_t: num(s.ch4_t), n2o_t: num(s.n2o_t), co2e_t: num(s.co2e_t), basis: s.basis,
      co2_factor: s.co2_factor ? { value: num(s.co2_factor.value), unit: s.co2_factor.unit, origin: s.co2_factor.origin, source: s.co2_factor.source } : null,
    })),
    emissions_by_gas: { co2: gas(d.by_gas.co2, null), ch4: gas(d.by_gas.ch4, d.gwp.ch4), n2o: gas(d.by_gas.n2o, d.gwp.n2o) },
    transfers: {
      transferred_co2_t: num(d.transfers.transferred_t),
      deductible_co2_t: num(d.transfers.deductible_t),
      by_destination: Object.fromEntries(Object.entries(d.transfers.by_destination).map(([k, v]) => [k, { co2_t: num(v.co2_t), deducted: v.deducted, rule_source: v.rule_source }])),
      streams: d.transfers.rows.map((r) => ({ id: r.id, destination: r.destination, co2_t: num(r.co2_t), deducted: r.deducted })),
    },
    benchmarks: d.benchmarks.map((b) => ({
      id: b.id, label: b.label, kind: b.kind, value: num(b.value), unit: b.unit, compared_with: b.compared_with,
      site_value: num(b.site_value), difference: num(b.difference), ratio_pct: num(b.ratio_pct), source: b.source, status: b.status,
    })),
    theoretical_minimum: d.theoretical_minimum && {
      min_gj_lhv_per_t_nh3: num(d.theoretical_minimum.min_gj_lhv_per_t),
      actual_gj_lhv_per_t_nh3: num(d.theoretical_minimum.actual_gj_lhv_per_t),
      excess_gj_lhv_per_t_nh3: num(d.theoretical_minimum.excess_gj_per_t),
      efficiency_pct: num(d.theoretical_minimum.efficiency_pct),
    },
    balance_check: d.balance_check && {
      measured_co2_t: num(d.balance_check.measured_co2_t), balance_co2_t: num(d.balance_check.balance_co2_t),
      difference_t: num(d.balance_check.difference_t), u95_t: num(d.balance_check.u95_t), within_uncertainty: d.balance_check.within_uncertainty,
    },
    uncertainty: {
      co2: uncertaintyJson(d.uncertainty.co2), net_co2: uncertaintyJson(d.uncertainty.net_co2),
      // Absent from a calculation frozen before CO2e had its own uncertainty.
      ...(d.uncertainty.co2e ? { co2e: uncertaintyJson(d.uncertainty.co2e), net_co2e: uncertaintyJson(d.uncertainty.net_co2e) } : {}),
    },
    // A tier is an ordinal class (1–4, 0 below the loosest), like `dof`: written as a JSON integer.
    activity_tiers: d.tiers.map((t) => ({ stream: t.stream_id, kind: t.kind, uncertainty_pct: num(t.uncertainty_pct), tier: t.tier })),
    method: {
      emissions: d.method,
      factor_set: d.factor_set,
      /** The calorific basis the set states its fuel factors on: NCV (LHV) or GCV (HHV). */
      energy_basis: d.energy_basis,
      gwp: { id: d.gwp.id, ch4: num(d.gwp.ch4), n2o: num(d.gwp.n2o), source: d.gwp.source, status: d.gwp.status },
      screening_estimate: d.screening_estimate,
      // Keys of the cited values not yet read in their published text: the signatory acknowledges each.
      unconfirmed: [
        ...d.citations.filter((c) => c.status === "unconfirmed").map((c) => c.key),
        ...d.benchmarks.filter((b) => b.status === "unconfirmed").map((b) => `benchmark.${b.id}`),
      ],
      sources: d.citations.map((c) => ({
        key: c.key, label: c.label, value: c.value, unit: c.unit, source: c.source, status: c.status,
        ...(c.checked ? { checked: c.checked } : {}), ...(c.stream ? { stream: c.stream } : {}),
      })),
    },
  };
}
