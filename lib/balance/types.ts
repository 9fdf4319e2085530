// Shared record types of lib/balance, including the contract with lib/emissions
// (docs/engine-contract.md). Every engineering number is a Decimal.
import type Decimal from "decimal.js";

export const STREAM_KINDS = [
  "feed-gas", "fuel-gas", "purge-gas", "process-air", "ammonia",
  "co2-export", "co2-vent", "stack-co2",
  "electricity-import", "steam-import", "steam-export",
] as const;
export type StreamKind = (typeof STREAM_KINDS)[number];

/** Where exported CO2 goes; "pcc": used to make precipitated calcium carbonate, the CO2 chemically bound. */
export const DESTINATIONS = ["urea", "storage", "pcc", "sale", "other"] as const;
export const FATES = ["fuel", "flare", "vent"] as const;
export const EMISSION_METHODS = ["carbon-mass-balance", "fuel-calculation", "measured", "default-factor"] as const;
export const GWP_SETS = ["AR4", "AR5", "AR6"] as const;

export interface StreamFigures {
  id: string;
  kind: StreamKind;
  destination?: (typeof DESTINATIONS)[number];
  fate?: (typeof FATES)[number];
  analysis?: string;
  unit: string;
  quantity: Decimal;
  uncertainty_pct: Decimal | null;
  /** Present (false) on a stream no meter measures: its quantity is the one the balances fixed, or the estimate. */
  metered?: false;
  /** Share of the meter's uncertainty that repeats every month until recalibration, %; absent: 100. */
  systematic_pct?: Decimal;
  /** Last calibration of the meter as of the month (YYYY-MM-DD): a new date starts an independent period. */
  calibrated_on?: string;
  kmol: Decimal | null;
  t: Decimal | null;
  carbon_kmol: Decimal | null;
  carbon_t: Decimal | null;
  gj_lhv: Decimal | null;
  gj_hhv: Decimal | null;
  mwh: Decimal | null;
  factor_t_per_MWh?: Decimal;
  factor_t_per_GJ?: Decimal;
}

export interface AnalysisFigures {
  molar_mass: Decimal;
  carbon_mass_fraction: Decimal;
  carbon_atoms_per_mol: Decimal;
  ncv_mj_per_kg: Decimal;
  gcv_mj_per_kg: Decimal;
  /** Expanded (95 %) relative uncertainty of the carbon content, %, as entered with the analysis. */
  carbon_uncertainty_pct?: Decimal;
  /** Expanded (95 %) relative uncertainty of the calorific value, %, as entered with the analysis. */
  cv_uncertainty_pct?: Decimal;
}

export interface EmissionsInput {
  month: string;
  method: {
    emissions: (typeof EMISSION_METHODS)[number];
    factor_set: string;
    gwp: (typeof GWP_SETS)[number];
  };
  ammonia_t: Decimal;
  streams: StreamFigures[];
  analyses: Record<string, AnalysisFigures>;
  theoretical_min_gj_lhv_per_t_nh3?: Decimal;
}

export type Severity = "info" | "warning" | "error";

export interface Flag {
  code: string;
  severity: Severity;
  message: string;
  stream?: string;
}
