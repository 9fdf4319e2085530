import type Decimal from "decimal.js";

// ---- Types of docs/engine-contract.md, written exactly as there (lib/balance conforms to them) ----

export type StreamKind =
  | "feed-gas" | "fuel-gas" | "purge-gas" | "process-air" | "ammonia"
  | "co2-export" | "co2-vent" | "stack-co2"
  | "electricity-import" | "steam-import" | "steam-export";

export interface StreamFigures {
  id: string;
  kind: StreamKind;
  destination?: "urea" | "storage" | "pcc" | "sale" | "other"; // co2-export only (pcc: precipitated calcium carbonate)
  fate?: "fuel" | "flare" | "vent";                     // purge-gas only
  analysis?: string;                                     // analysis id used
  unit: string;                                          // unit as written in the file
  quantity: Decimal;                                     // quantity as written in the file
  uncertainty_pct: Decimal | null;                       // expanded, 95 %, of the monthly total
  metered?: false;                                       // a stream no meter measures (quantity solved or estimated)
  systematic_pct?: Decimal;                              // share of the meter's uncertainty repeating monthly, %; absent: 100
  calibrated_on?: string;                                // last calibration as of the month; a new date starts an independent period
  kmol: Decimal | null;        // amount of substance (gas streams, NH3, CO2 streams); null for MWh/steam
  t: Decimal | null;           // mass in tonnes; null for MWh/steam
  carbon_kmol: Decimal | null; // kmol of carbon atoms carried (CO2 streams: kmol CO2); null where no carbon
  carbon_t: Decimal | null;    // carbon_kmol × 12.011 / 1000
  gj_lhv: Decimal | null;      // net calorific content (gas streams); steam: the GJ given
  gj_hhv: Decimal | null;      // gross calorific content
  mwh: Decimal | null;         // electricity only
  factor_t_per_MWh?: Decimal;  // electricity-import, when given in the file
  factor_t_per_GJ?: Decimal;   // steam-import/steam-export, when given in the file
  /** Gas streams with an analysis: the volume at 68 °F and 14.7 psia (40 CFR 98's standard conditions), real gas, scf; what Eq G-1 reads. */
  standard_scf_68f?: Decimal;
}

export interface EmissionsInput {
  month: string;                                   // "YYYY-MM"
  method: { emissions: "carbon-mass-balance" | "fuel-calculation" | "measured" | "default-factor";
            factor_set: string; gwp: "AR4" | "AR5" | "AR6" };
  ammonia_t: Decimal;                              // sum of ammonia streams, t
  streams: StreamFigures[];
  analyses: Record<string, AnalysisFigures>;       // per analysis id, see below
  theoretical_min_gj_lhv_per_t_nh3?: Decimal;      // from lib/balance, when it could be computed
}

export interface AnalysisFigures {
  molar_mass: Decimal;              // kg/kmol
  carbon_mass_fraction: Decimal;    // kg C per kg gas
  carbon_atoms_per_mol: Decimal;    // mol C per mol gas
  ncv_mj_per_kg: Decimal;           // net, mass basis
  gcv_mj_per_kg: Decimal;           // gross, mass basis
  carbon_uncertainty_pct?: Decimal; // expanded (95 %) relative, %, entered with the analysis; absent: the set's default
  cv_uncertainty_pct?: Decimal;     // likewise for the calorific value
}

// ---- Shared shapes ----

export type EmissionsMethod = EmissionsInput["method"]["emissions"];
export type GwpId = EmissionsInput["method"]["gwp"];
export type Destination = NonNullable<StreamFigures["destination"]>;

/** Same shape as lib/balance's flags so the two lists can be concatenated. */
export interface Flag {
  code: string;
  severity: "info" | "warning" | "error";
  message: string;
}
