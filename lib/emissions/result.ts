import type { Citation } from "./citations";
import type { Decimal } from "./decimal";
import type { BenchmarkComparison, IntensityFigures, TheoreticalMinimum } from "./intensity";
import type { BalanceCheck, StreamEmission } from "./model";
import type { TransferSummary } from "./transfers";
import type { MeterTier, UncertaintyFigures } from "./uncertainty";
import type { EmissionsMethod, Flag, GwpId } from "./types";

export interface GasTotal { t: Decimal; co2e_t: Decimal }

export interface EmissionsResult {
  month: string;
  method: EmissionsMethod;
  factor_set: { id: string; version: string; name: string; built_in: boolean };
  /** Calorific basis of the set's fuel factors: NCV (LHV) or GCV (HHV). */
  energy_basis: "NCV" | "GCV";
  gwp: { id: GwpId; ch4: Decimal; n2o: Decimal; source: string; status: "confirmed" | "unconfirmed"; checked: string | null };
  /** True for the default-factor method: a per-tonne estimate, not a monitored figure. */
  screening_estimate: boolean;
  by_stream: StreamEmission[];
  by_gas: { co2: GasTotal; ch4: GasTotal; n2o: GasTotal };
  co2: { gross_t: Decimal; deductible_t: Decimal; net_t: Decimal };
  transfers: Omit<TransferSummary, "deduction_terms">;
  emissions: {
    co2_t: Decimal;             // direct CO2 before deductions
    ch4_t: Decimal;
    n2o_t: Decimal;
    co2e_t: Decimal;            // direct total before deductions
    transferred_co2_t: Decimal; // every co2-export, deducted or not
    net_co2e_t: Decimal;        // co2e_t − the transfers the set's rules deduct
  };
  intensity: IntensityFigures;
  benchmarks: BenchmarkComparison[];
  theoretical_minimum: TheoreticalMinimum | null;
  balance_check: BalanceCheck | null;
  /** co2: of emissions.co2_t (gross); net_co2: of co2.net_t (deducted exports with their meters). */
  /** Gross and net CO2, and gross and net CO2e (CH4 and N2O with their factor ranges, at the month's GWP). */
  uncertainty: { co2: UncertaintyFigures; net_co2: UncertaintyFigures; co2e: UncertaintyFigures; net_co2e: UncertaintyFigures };
  tiers: MeterTier[];
  /** The cited values this month's figures rest on, each marked when taken from memory. */
  citations: Citation[];
  flags: Flag[];
}
