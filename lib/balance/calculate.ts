// calculate(): one plant-month document in, every figure of the month out (typed, Decimal).
import { type BalanceOptions, type ElementBalances, balanceFlags, elementBalances } from "./balances";
import { Dec, dec } from "./decimal";
import { CalculationInputError } from "./errors";
import { feedFigures } from "./feed";
import { type GasProperties, calorificValues } from "./gas-properties";
import { type PlantReconciliation, reconcilePlant } from "./reconcile-plant";
import { buildEmissionsInput, emissionsPart } from "./result";
import type { AnalysisResult, CalculationResult } from "./calculation-result";
import type { FactorSetRegistry } from "../emissions/registry";
import { isUnmetered, type PlantMonth } from "./schema";
import { type StreamFlow, analysesOf, streamFlow } from "./streams";
import type { Flag } from "./types";
import { UnitError } from "./units";

export interface CalculateOptions extends BalanceOptions {
  /** Run data reconciliation (default true). */
  reconcile?: boolean;
  /** Confidence of the reconciliation tests (default 0.95). */
  confidence?: Dec;
  /** Factor sets the month may name (default: the built-in sets); an organisation adds its own. */
  factorSets?: FactorSetRegistry;
}


export type { AnalysisResult, CalculationResult } from "./calculation-result";

export { CalculationInputError } from "./errors";

/**
 * Figures many orders of magnitude apart (one stream of 1e29 t beside meters of thousands) leave
 * the reconciliation's covariance matrix singular even in 34 digits. That is bad input, reported
 * as such (the API answers 400, the month page names it), not a failure of the engine.
 */
function reconcileOrExplain(flows: StreamFlow[], confidence: Dec, measured: ElementBalances): PlantReconciliation | null {
  try {
    return reconcilePlant(flows, confidence, measured);
  } catch (e) {
    if (e instanceof Error && e.message === "singular matrix") {
      const i = farthestOrder(flows);
      throw new CalculationInputError(
        i === null ? "streams" : `streams[${i}].quantity`,
        i === null
          ? "the quantities and uncertainties span too many orders of magnitude to reconcile the balances; check the figures for a misplaced unit or extra digits"
          : `stream ${flows[i].stream.id}: ${flows[i].stream.quantity.toString()} ${flows[i].stream.unit} lies orders of magnitude away from the other streams, so the balances cannot be reconciled; check it for a misplaced unit or extra digits`,
      );
    }
    throw e;
  }
}

/**
 * Less feed than the stoichiometric minimum cannot make the ammonia reported: a feed efficiency
 * above 100 % means a feed meter reading low, an analysis too lean or ammonia reading high.
 */
function feedFlags(feed: CalculationResult["feed"]): Flag[] {
  const e = feed.feed_efficiency_pct;
  if (e === null || e.toDecimalPlaces(6).lte(100)) return [];
  return [{ code: "feed-below-theoretical-minimum", severity: "warning",
    message: `feed efficiency ${e.toDecimalPlaces(2).toFixed(2)} %: less feed energy than the theoretical minimum for the ammonia reported; check the feed meter, its analysis and the ammonia meter` }];
}

/** The stream whose amount (kmol) lies most orders of magnitude from the median of the others; null when none is given. */
function farthestOrder(flows: StreamFlow[]): number | null {
  const orders = flows.map((f) => (f.figures.kmol && f.figures.kmol.gt(0) ? f.figures.kmol.e : f.stream.quantity.gt(0) ? f.stream.quantity.e : null));
  const known = orders.filter((o): o is number => o !== null).sort((a, b) => a - b);
  if (known.length < 2) return null;
  const median = known[Math.floor(known.length / 2)];
  let best: number | null = null;
  orders.forEach((o, i) => {
    if (o !== null && (best === null || Math.abs(o - median) > Math.abs(orders[best]! - median))) best = i;
  });
  return best;
}

export function analysisFigures(id: string, gas: GasProperties): AnalysisResult {
  const cv = calorificValues(gas, "15C", "15C");
  return {
    id,
    gas,
    molar_mass: gas.molarMass,
    carbon_mass_fraction: gas.carbonMassFraction,
    carbon_atoms_per_mol: gas.atoms.C,
    ncv_mj_per_kg: cv.netMass,
    gcv_mj_per_kg: cv.grossMass,
    z_15c: cv.z,
    gcv_mj_per_m3_15c: cv.grossVolumeReal,
    ncv_mj_per_m3_15c: cv.netVolumeReal,
  };
}

export function calculate(doc: PlantMonth, options: CalculateOptions = {}): CalculationResult {
  const { gases, flags: analysisFlags } = analysesOf(doc);
  const measuredFlows = doc.streams.map((s, i) => {
    try {
      return streamFlow(s, gases);
    } catch (e) {
      if (e instanceof UnitError) throw new CalculationInputError(`streams[${i}].unit`, e.message);
      throw e;
    }
  });
  // A stream no meter measures gets its quantity from the reconciliation, so a month holding one is
  // reconciled even where the caller asked to skip it (the figures would be wrong otherwise).
  const reconcile = options.reconcile !== false || doc.streams.some(isUnmetered);
  const measuredBalances = elementBalances(measuredFlows);
  const reconciliation = reconcile ? reconcileOrExplain(measuredFlows, options.confidence ?? dec("0.95"), measuredBalances) : null;
  // A stream that is not metered takes the quantity the balances fix for it, everywhere after.
  const flows = measuredFlows.map((f, i) => {
    const solved = reconciliation?.unmeasured.find((u) => u.stream === f.stream.id)?.quantity;
    // A negative flow is no flow: the estimate stays and the reconciliation's flag says why.
    return solved && !solved.isNegative() ? streamFlow({ ...doc.streams[i], quantity: solved }, gases) : f;
  });
  const balances = flows.every((f, i) => f === measuredFlows[i]) ? measuredBalances : elementBalances(flows);
  const feed = feedFigures(flows);
  const analyses = Object.fromEntries(Object.entries(gases).map(([id, g]) => [id, analysisFigures(id, g)]));
  const partial = {
    site: doc.site,
    month: doc.month,
    streams: flows.map((f) => f.figures),
    flows,
    analyses,
    balances,
    feed,
    reconciliation,
  };
  const emissions = emissionsPart(buildEmissionsInput(doc, partial), options.factorSets);
  return {
    ...partial,
    emissions,
    flags: [...analysisFlags, ...balanceFlags(flows, balances, options), ...feedFlags(feed), ...(reconciliation?.flags ?? []), ...emissions.flags],
    tolerancePct: options.closureTolerancePct ?? dec(2),
  };
}
