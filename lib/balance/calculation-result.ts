// The shapes of a computed plant-month, in a module of their own so that the calculation
// (calculate.ts) and the result document (result.ts) can both name them without importing each
// other.
import type { EmissionsResult } from "../emissions/result";
import type { ElementBalances } from "./balances";
import type { Dec } from "./decimal";
import type { FeedFigures } from "./feed";
import type { GasProperties } from "./gas-properties";
import type { PlantReconciliation } from "./reconcile-plant";
import type { StreamFlow } from "./streams";
import type { AnalysisFigures, EmissionsInput, Flag, StreamFigures } from "./types";

export interface EmissionsPart {
  emissions: { co2_t: Dec; ch4_t: Dec; n2o_t: Dec; co2e_t: Dec; transferred_co2_t: Dec; net_co2e_t: Dec };
  intensity: { co2e_t_per_t_nh3: Dec | null };
  flags: Flag[];
  /** Everything lib/emissions computed for the month (by stream, by gas, transfers, uncertainty, …). */
  detail: EmissionsResult;
  /** The input it was computed from: the annual roll-up needs both. */
  input: EmissionsInput;
}

export interface AnalysisResult extends AnalysisFigures {
  id: string;
  gas: GasProperties;
  z_15c: Dec;
  gcv_mj_per_m3_15c: Dec; // real gas, 15 °C / 15 °C
  ncv_mj_per_m3_15c: Dec;
}

export interface CalculationResult {
  site: string;
  month: string;
  streams: StreamFigures[];
  flows: StreamFlow[];
  analyses: Record<string, AnalysisResult>;
  balances: ElementBalances;
  feed: FeedFigures;
  reconciliation: PlantReconciliation | null;
  emissions: EmissionsPart;
  flags: Flag[];
  /** The closure tolerance the flags were judged against, % (the site's). */
  tolerancePct: Dec;
}
