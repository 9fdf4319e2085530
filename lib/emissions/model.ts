import type { Decimal } from "./decimal";
import type { Flag, StreamKind } from "./types";

/**
 * One additive contribution to a CO2 figure, as the uncertainty model sees it: the figure is a
 * sum of terms, each the product of a metered quantity and a factor. The meter and the factor each
 * carry a relative standard uncertainty; terms sharing a factor key are fully correlated (the same
 * number multiplies them), terms of different meters are independent.
 */
export interface UncertaintyTerm {
  value_t: Decimal;                 // signed contribution, t CO2
  stream_id?: string;               // the meter behind it
  meter_rel_std?: Decimal | null;   // null: the meter has no stated uncertainty
  factor_key?: string;              // e.g. "ipcc-2006:natural-gas:co2"
  factor_rel_std?: Decimal;
  /** The month's gas analysis behind the term: "<analysis id>:carbon" or "<analysis id>:cv". */
  analysis_key?: string;
  analysis_rel_std?: Decimal;
}

/** How a stream contributes, in the units and with the factor actually used. */
export interface StreamEmission {
  id: string;
  kind: StreamKind | "ammonia-production";
  co2_t: Decimal;
  ch4_t: Decimal;
  n2o_t: Decimal;
  co2e_t: Decimal;                  // filled once the GWP set is applied
  basis: string;                    // plain-language description of the calculation
  co2_factor?: { value: Decimal; unit: string; origin: "factor-set" | "analysis" | "table-3.1"; source: string };
}

export interface BalanceCheck {
  measured_co2_t: Decimal;          // stack + vent monitors
  balance_co2_t: Decimal;           // CO2 to air implied by the carbon balance
  difference_t: Decimal;            // measured − balance
  u95_t: Decimal | null;            // combined expanded uncertainty of the difference; null when unknown
  within_uncertainty: boolean | null;
}

export interface MethodOutcome {
  by_stream: StreamEmission[];
  gross_co2_t: Decimal;
  terms: UncertaintyTerm[];
  flags: Flag[];
  balance_check: BalanceCheck | null;
  screening_estimate: boolean;
}

export function pushOnce(flags: Flag[], flag: Flag): void {
  if (!flags.some((f) => f.code === flag.code && f.message === flag.message)) flags.push(flag);
}
