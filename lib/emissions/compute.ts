import { citationsFor } from "./citations";
import { K95, ZERO, dec, type Decimal } from "./decimal";
import type { FactorSet } from "./factor-set-schema";
import { gwpSet } from "./gwp";
import { compareBenchmarks, intensities, theoreticalMinimum } from "./intensity";
import { carbonMassBalance } from "./methods/carbon-mass-balance";
import { defaultFactor } from "./methods/default-factor";
import { fuelCalculation } from "./methods/fuel-calculation";
import { measured } from "./methods/measured";
import type { MethodOutcome, StreamEmission, UncertaintyTerm } from "./model";
import { nonCo2 } from "./non-co2";
import { defaultRegistry, type FactorSetRegistry } from "./registry";
import type { EmissionsResult } from "./result";
import { transfers } from "./transfers";
import { assessTiers, propagate, type MeterSplit } from "./uncertainty";
import type { EmissionsInput, EmissionsMethod, Flag } from "./types";

const METHODS: Record<EmissionsMethod, (i: EmissionsInput, s: FactorSet) => MethodOutcome> = {
  "carbon-mass-balance": carbonMassBalance,
  "fuel-calculation": fuelCalculation,
  measured,
  "default-factor": defaultFactor,
};

export class EmissionsInputError extends Error {
  constructor(message: string) { super(message); this.name = "EmissionsInputError"; }
}

function effectiveFlag(set: FactorSet, month: string): Flag | null {
  const day = `${month}-01`;
  if (day < set.effective.from || (set.effective.to !== null && day > set.effective.to)) {
    return { code: "factor-set-not-effective", severity: "warning",
      message: `Factor set ${set.id} applies from ${set.effective.from}${set.effective.to ? ` to ${set.effective.to}` : ""}; ${month} lies outside.` };
  }
  return null;
}

/** Merge CH4/N2O rows into the CO2 rows of the same stream so each stream appears once. */
function mergeRows(rows: StreamEmission[], extra: { id: string; ch4_t: Decimal; n2o_t: Decimal; basis: string }[],
  kindOf: (id: string) => StreamEmission["kind"]): StreamEmission[] {
  const out = rows.map((r) => ({ ...r }));
  for (const x of extra) {
    const row = out.find((r) => r.id === x.id);
    if (row) {
      row.ch4_t = row.ch4_t.plus(x.ch4_t); row.n2o_t = row.n2o_t.plus(x.n2o_t); row.basis += `; ${x.basis}`;
    } else {
      out.push({ id: x.id, kind: kindOf(x.id), co2_t: ZERO, ch4_t: x.ch4_t, n2o_t: x.n2o_t, co2e_t: ZERO, basis: x.basis });
    }
  }
  return out;
}

/**
 * Emissions of one plant-month under the declared method, factor set and GWP set. Pure: the same
 * input always gives the same result; problems are reported as flags, and only an unknown
 * method or factor set (which no result could describe) throws.
 */
export function computeEmissions(input: EmissionsInput, registry: FactorSetRegistry = defaultRegistry): EmissionsResult {
  const set = registry.get(input.method.factor_set);
  if (!set) throw new EmissionsInputError(`unknown factor set "${input.method.factor_set}"; known: ${registry.ids().join(", ")}`);
  const method = METHODS[input.method.emissions];
  if (!method) throw new EmissionsInputError(`unknown emissions method "${input.method.emissions}"`);
  const gwp = gwpSet(input.method.gwp);

  const outcome = method(input, set);
  const flags: Flag[] = [...outcome.flags];
  const eff = effectiveFlag(set, input.month);
  if (eff) flags.push(eff);
  const ry = input.month.slice(0, 4);
  const ruleGwp = set.gwp_by_reporting_year?.find((r) => r.from_year <= ry && (r.to_year === null || ry <= r.to_year));
  if (ruleGwp && ruleGwp.gwp !== gwp.id) {
    flags.push({ code: "gwp-not-the-rules-for-year", severity: "warning",
      message: `Reporting year ${ry} under ${set.id} uses ${ruleGwp.gwp} values (${ruleGwp.source}${ruleGwp.status === "unconfirmed" ? ", unconfirmed" : ""}); this month states ${gwp.id}, so its CO2e is not the rule's figure.` });
  } else if (gwp.id !== set.gwp_default) {
    flags.push({ code: "gwp-differs-from-set-default", severity: "info",
      message: `GWP set ${gwp.id} chosen; factor set ${set.id} names ${set.gwp_default} as its default.` });
  }

  const nc = nonCo2(input, set, flags);
  const kindOf = (id: string) => input.streams.find((s) => s.id === id)?.kind ?? "fuel-gas";
  const byStream = mergeRows(outcome.by_stream, nc, kindOf).map((r) => ({
    ...r, co2e_t: r.co2_t.plus(r.ch4_t.times(gwp.ch4)).plus(r.n2o_t.times(gwp.n2o)),
  }));

  const tr = transfers(input, set, flags);
  const co2 = outcome.gross_co2_t;
  const ch4 = nc.reduce((a, r) => a.plus(r.ch4_t), ZERO);
  const n2o = nc.reduce((a, r) => a.plus(r.n2o_t), ZERO);
  const co2e = co2.plus(ch4.times(gwp.ch4)).plus(n2o.times(gwp.n2o));
  const net = co2.minus(tr.deductible_t);
  const netCo2e = co2e.minus(tr.deductible_t);
  if (net.lt(0)) {
    flags.push({ code: "net-co2-negative", severity: "warning", message: "Deducted transfers exceed the CO2 computed: check the export meters and the feed analysis." });
  }

  const emissions = { co2_t: co2, ch4_t: ch4, n2o_t: n2o, co2e_t: co2e, transferred_co2_t: tr.transferred_t, net_co2e_t: netCo2e };
  const intensity = intensities(input, set, emissions, flags);
  const splits = meterSplits(input);
  const gasTerms: UncertaintyTerm[] = nc.flatMap((r) => r.terms.map(({ gas, ...t }) => ({ ...t, value_t: t.value_t.times(gas === "ch4" ? gwp.ch4 : gwp.n2o) })));
  const uncertainty = {
    co2: propagate(outcome.terms, K95, splits),
    net_co2: propagate([...outcome.terms, ...tr.deduction_terms], K95, splits),
    co2e: propagate([...outcome.terms, ...gasTerms], K95, splits),
    net_co2e: propagate([...outcome.terms, ...gasTerms, ...tr.deduction_terms], K95, splits),
  };
  if (uncertainty.co2.meters_without_uncertainty.length > 0) {
    flags.push({ code: "uncertainty-incomplete", severity: "warning",
      message: `No uncertainty_pct for ${uncertainty.co2.meters_without_uncertainty.join(", ")}: the stated uncertainty is understated.` });
  }
  const { deduction_terms: _unused, ...transferView } = tr;
  void _unused;

  return {
    month: input.month,
    method: input.method.emissions,
    factor_set: { id: set.id, version: set.version, name: set.name, built_in: registry.isBuiltIn(set.id) },
    energy_basis: energyBasisOf(set),
    gwp: { id: gwp.id, ch4: gwp.ch4, n2o: gwp.n2o, source: gwp.source, status: gwp.status, checked: gwp.checked ?? null },
    screening_estimate: outcome.screening_estimate,
    by_stream: byStream,
    by_gas: {
      co2: { t: co2, co2e_t: co2 },
      ch4: { t: ch4, co2e_t: ch4.times(gwp.ch4) },
      n2o: { t: n2o, co2e_t: n2o.times(gwp.n2o) },
    },
    co2: { gross_t: co2, deductible_t: tr.deductible_t, net_t: net },
    transfers: transferView,
    emissions,
    intensity,
    benchmarks: compareBenchmarks(set, input.month, intensity),
    theoretical_minimum: theoreticalMinimum(input, intensity),
    balance_check: outcome.balance_check,
    uncertainty,
    tiers: assessTiers(input, set, registry.get("eu-mrr")),
    citations: citationsFor(input, set, gwp, registry.get("eu-mrr")),
    flags,
  };
}


/** Each meter's systematic share and calibration period, from the streams (absent: all systematic, period unknown). */
function meterSplits(input: EmissionsInput): Map<string, MeterSplit> {
  const out = new Map<string, MeterSplit>();
  for (const s of input.streams) {
    out.set(s.id, {
      systematic_share: s.systematic_pct === undefined ? dec(1) : dec(s.systematic_pct).div(100),
      period: s.calibrated_on ?? null,
      ...(s.metered === false ? { unmetered: true } : {}),
    });
  }
  return out;
}

/** The calorific basis of the set's natural-gas factors (NCV unless the set states GCV). */
function energyBasisOf(set: FactorSet): "NCV" | "GCV" {
  const a = set.fuels["natural-gas"]?.activity;
  return a && a.kind === "energy" ? a.basis : "NCV";
}
