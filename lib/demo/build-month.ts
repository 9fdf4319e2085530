// Builds a demo plant-month from stoichiometry so its balances close before meter error:
// NH3 production and purge set the nitrogen and hydrogen demand; feed gas and process air
// are solved from the two element conditions; all process carbon leaves the CO2 removal
// unit (export + vent); fuel carbon and the purge burnt as fuel leave through the stack.
// Then every meter reads with a small seeded error, and one month has a drifting meter.
import { Dec, ZERO, dec } from "../balance/decimal";
import { M_NH3 } from "../balance/feed";
import { type GasProperties, calorificValues, compositionOf, gasProperties } from "../balance/gas-properties";
import { PLANT_MONTH_FORMAT, type PlantMonth } from "../balance/schema";
import { DRY_AIR, PURE_CO2, PURE_NH3 } from "../balance/streams";
import { fromKmol } from "../balance/units";
import { type Rng, rng, seedOf } from "./prng";
import type { DemoSite, DemoStream } from "./sites";

/** Decimals kept per unit when a meter total is written: about what a plant historian stores. */
const PLACES: Record<string, number> = { Sm3: 0, Nm3: 0, MMscf: 3, Mscf: 1, "MMBtu-HHV": 0, t: 1, MWh: 1 };

export interface BuildOptions {
  days: number;
  /** Extra seed text, so a benchmark can make many distinct sites from one design. */
  variant?: string;
  /** Month to date the document with (YYYY-MM). */
  month: string;
  /** Apply the site's deliberate drift when the month matches (default true). */
  drift?: boolean;
}

interface TrueFlows {
  kmol: Record<string, Dec>; // per stream id, true amount
  mwh: Dec;
}

/** True (error-free) amounts for a period of `days` days. */
export function trueFlows(site: DemoSite, r: Rng, days: number): TrueFlows {
  const gases = Object.fromEntries(Object.entries(site.analyses).map(([k, v]) => [k, gasProperties(compositionOf(v))]));
  const by = (kind: string) => site.streams.find((s) => s.kind === kind)!;
  const feedGas = gases[by("feed-gas").analysis!];
  const purgeGas = gases[by("purge-gas").analysis!];
  const nh3T = dec(site.nh3_t_per_day).times(days).times(r.between("0.93", "1.00"));
  const P = nh3T.times(1000).div(M_NH3);
  const purge = P.times(site.design.purge_per_nh3).times(r.between("0.95", "1.05"));
  // f·n_f + a·n_a = P/2 + purge·n_p ;  f·h_f + a·h_a = 3P/2 + purge·h_p
  const nNeed = P.div(2).plus(purge.times(purgeGas.n2PerMol));
  const hNeed = P.times("1.5").plus(purge.times(purgeGas.h2EquivalentsPerMol));
  const det = feedGas.n2PerMol.times(DRY_AIR.h2EquivalentsPerMol).minus(DRY_AIR.n2PerMol.times(feedGas.h2EquivalentsPerMol));
  const feed = nNeed.times(DRY_AIR.h2EquivalentsPerMol).minus(hNeed.times(DRY_AIR.n2PerMol)).div(det);
  const air = feedGas.n2PerMol.times(hNeed).minus(feedGas.h2EquivalentsPerMol.times(nNeed)).div(det);
  const purgeC = purge.times(purgeGas.atoms.C);
  const processCo2 = feed.times(feedGas.atoms.C).minus(purgeC);
  const exported = processCo2.times(site.design.export_share).times(r.between("0.97", "1.03"));
  const [lo, hi] = site.design.gj_lhv_per_t;
  const feedGj = feed.times(calorificValues(feedGas, "15C").netMolar).div(1000);
  const fuelGj = nh3T.times(r.between(lo, hi)).minus(feedGj);
  const fuelGas = gases[by("fuel-gas").analysis!];
  const fuel = fuelGj.times(1000).div(calorificValues(fuelGas, "15C").netMolar);
  const kmol: Record<string, Dec> = {};
  for (const s of site.streams) {
    const k: Partial<Record<DemoStream["kind"], Dec>> = {
      "feed-gas": feed, "fuel-gas": fuel, "process-air": air, "purge-gas": purge, ammonia: P,
      "co2-export": exported, "co2-vent": processCo2.minus(exported),
      "stack-co2": fuel.times(fuelGas.atoms.C).plus(purgeC),
    };
    if (k[s.kind]) kmol[s.id] = k[s.kind]!;
  }
  return { kmol, mwh: nh3T.times(site.design.mwh_per_t).times(r.between("0.9", "1.1")) };
}

function gasOf(site: DemoSite, s: DemoStream): GasProperties {
  if (s.analysis) return gasProperties(compositionOf(site.analyses[s.analysis]));
  if (s.kind === "process-air") return DRY_AIR;
  if (s.kind === "ammonia") return PURE_NH3;
  return PURE_CO2;
}

export function buildPlantMonth(site: DemoSite, opts: BuildOptions): PlantMonth {
  const r = rng(seedOf(`${site.key}/${opts.variant ?? ""}/${opts.month}/${opts.days}`));
  const truth = trueFlows(site, r, opts.days);
  const streams = site.streams.map((s) => {
    // Meter error: uniform ±0.35 % of reading; the drift month multiplies one meter.
    let reading =
      s.kind === "electricity-import"
        ? truth.mwh
        : fromKmol(truth.kmol[s.id], s.unit, gasOf(site, s)).times(r.between("0.9965", "1.0035"));
    if ((opts.drift ?? true) && opts.month === site.drift.month && s.id === site.drift.stream) reading = reading.times(site.drift.factor);
    const quantity = reading.toDecimalPlaces(PLACES[s.unit] ?? 3);
    return {
      id: s.id,
      kind: s.kind,
      ...(s.analysis ? { analysis: s.analysis } : {}),
      ...(s.fate ? { fate: s.fate } : {}),
      ...(s.destination ? { destination: s.destination } : {}),
      quantity: quantity.lt(0) ? ZERO : quantity,
      unit: s.unit,
      ...(s.uncertainty_pct ? { uncertainty_pct: dec(s.uncertainty_pct) } : {}),
      ...(s.factor_t_per_MWh ? { factor_t_per_MWh: dec(s.factor_t_per_MWh) } : {}),
      meter: s.meter,
    };
  });
  const analyses = Object.fromEntries(
    Object.entries(site.analyses).map(([id, pct]) => [id, { components: compositionOf(pct) }]),
  );
  return {
    format: PLANT_MONTH_FORMAT,
    site: site.name,
    month: opts.month,
    analyses,
    streams,
    method: { ...site.method },
  };
}
