// Theoretical minimum feed per tonne NH3 for the site's own feed gas and air.
//
// Derivation (stoichiometric, no losses, no purge): per kmol NH3 the make-up gas needs
// 1/2 kmol N2 and 3/2 kmol H2. Feed gas supplies h_f H2-equivalents and n_f N2 per kmol
// (H2-equivalents = 2c + h/2 − o: reforming CcHh + c H2O → c CO + (c + h/2) H2, then shift
// CO + H2O → CO2 + H2); air supplies n_a N2 and h_a = −2·x(O2) H2-equivalents per kmol (its
// oxygen burns hydrogen to water in the secondary reformer). Solving
//     f·n_f + a·n_a = 1/2,   f·h_f + a·h_a = 3/2
// gives the minimum feed f (kmol per kmol NH3); × feed NCV / M(NH3) gives GJ LHV per t NH3.
// Steam is taken as free and no fuel is counted. For pure methane and dry air this is
// 0.4421 kmol CH4 per kmol NH3, 20.84 GJ LHV/t (common practice quotes about 20.9, from memory).
import { ATOMIC_WEIGHT } from "./components";
import { Dec, HUNDRED, ZERO, dec, sum } from "./decimal";
import { DRY_AIR } from "./streams";
import type { StreamFlow } from "./streams";

export const M_NH3 = ATOMIC_WEIGHT.N.plus(ATOMIC_WEIGHT.H.times(3));

export interface PerMole {
  n2: Dec; // N2 per kmol
  h2eq: Dec; // H2-equivalents per kmol
  ncv: Dec; // MJ/kmol, net, 15 °C
}

export interface MinimumFeed {
  feed_kmol_per_kmol_nh3: Dec;
  air_kmol_per_kmol_nh3: Dec;
  gj_lhv_per_t_nh3: Dec;
}

/** Solves the two stoichiometric conditions; null when the gas and air cannot make 3:1 gas. */
export function minimumFeed(feed: PerMole, air: Pick<PerMole, "n2" | "h2eq">): MinimumFeed | null {
  const det = feed.n2.times(air.h2eq).minus(air.n2.times(feed.h2eq));
  if (det.isZero()) return null;
  const half = dec("0.5");
  const threeHalves = dec("1.5");
  const f = half.times(air.h2eq).minus(threeHalves.times(air.n2)).div(det);
  const a = threeHalves.times(feed.n2).minus(half.times(feed.h2eq)).div(det);
  if (f.lte(0) || a.lt(0)) return null;
  return { feed_kmol_per_kmol_nh3: f, air_kmol_per_kmol_nh3: a, gj_lhv_per_t_nh3: f.times(feed.ncv).div(M_NH3) };
}

/** Mole-weighted per-kmol figures of a set of streams (e.g. two feed meters with different gas). */
export function mixPerMole(flows: StreamFlow[]): PerMole | null {
  const kmol = sum(flows.map((f) => f.figures.kmol ?? ZERO));
  if (kmol.isZero()) return null;
  const over = (g: (f: StreamFlow) => Dec) => sum(flows.map((f) => (f.figures.kmol ?? ZERO).times(g(f)))).div(kmol);
  return {
    n2: over((f) => f.gas!.n2PerMol),
    h2eq: over((f) => f.gas!.h2EquivalentsPerMol),
    ncv: sum(flows.map((f) => f.figures.gj_lhv ?? ZERO)).times(1000).div(kmol),
  };
}

export interface FeedFigures {
  ammonia_t: Dec;
  feed_gj_lhv: Dec;
  fuel_gj_lhv: Dec;
  gj_lhv_per_t_nh3: Dec | null; // (feed + fuel) / NH3
  /** The same on the gross (higher) heating value, for sets whose calorific basis is GCV/HHV. */
  gj_hhv_per_t_nh3: Dec | null;
  feed_gj_lhv_per_t_nh3: Dec | null;
  theoretical_min_gj_lhv_per_t_nh3: Dec | null;
  feed_efficiency_pct: Dec | null; // theoretical / actual feed × 100
}

export function feedFigures(flows: StreamFlow[]): FeedFigures {
  const of = (kind: string) => flows.filter((f) => f.stream.kind === kind);
  const gj = (fs: StreamFlow[]) => sum(fs.map((f) => f.figures.gj_lhv ?? ZERO));
  const gjHhv = (fs: StreamFlow[]) => sum(fs.map((f) => f.figures.gj_hhv ?? ZERO));
  const ammonia_t = sum(of("ammonia").map((f) => f.figures.t ?? ZERO));
  const feed_gj_lhv = gj(of("feed-gas"));
  const fuel_gj_lhv = gj(of("fuel-gas"));
  const feedMix = mixPerMole(of("feed-gas"));
  const air = mixPerMole(of("process-air")) ?? { n2: DRY_AIR.n2PerMol, h2eq: DRY_AIR.h2EquivalentsPerMol };
  const min = feedMix ? minimumFeed(feedMix, air) : null;
  const perT = (x: Dec) => (ammonia_t.gt(0) ? x.div(ammonia_t) : null);
  const feedPerT = feedMix ? perT(feed_gj_lhv) : null;
  const theoretical = min?.gj_lhv_per_t_nh3 ?? null;
  return {
    ammonia_t,
    feed_gj_lhv,
    fuel_gj_lhv,
    gj_lhv_per_t_nh3: perT(feed_gj_lhv.plus(fuel_gj_lhv)),
    gj_hhv_per_t_nh3: perT(gjHhv(of("feed-gas")).plus(gjHhv(of("fuel-gas")))),
    feed_gj_lhv_per_t_nh3: feedPerT,
    theoretical_min_gj_lhv_per_t_nh3: theoretical,
    feed_efficiency_pct: theoretical && feedPerT && feedPerT.gt(0) ? theoretical.div(feedPerT).times(HUNDRED) : null,
  };
}
