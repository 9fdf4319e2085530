import { ZERO, dec, type Decimal } from "./decimal";
import { streamsOf } from "./activity";
import type { FactorSet } from "./factor-set-schema";
import type { EmissionsInput, Flag } from "./types";

export interface IntensityFigures {
  ammonia_t: Decimal;
  co2_t_per_t_nh3: Decimal | null;              // direct CO2 before deductions
  co2e_t_per_t_nh3: Decimal | null;             // direct CO2e before deductions
  net_co2e_t_per_t_nh3: Decimal | null;         // after the deductions the rules allow
  indirect_co2e_t: Decimal;                     // imported electricity + imported steam − exported steam
  indirect_complete: boolean;                   // false when a factor was missing and a stream left out
  co2e_incl_indirect_t_per_t_nh3: Decimal | null;
  energy_gj_lhv: Decimal;                       // feed + fuel, net calorific
  gj_lhv_per_t_nh3: Decimal | null;
}

export interface BenchmarkComparison {
  id: string; label: string; kind: "product-benchmark" | "reference";
  value: Decimal; unit: string; source: string; status: "confirmed" | "unconfirmed"; checked: string | null;
  compared_with: "co2_t_per_t_nh3" | "co2e_t_per_t_nh3";
  site_value: Decimal | null;
  difference: Decimal | null;                   // site − benchmark
  ratio_pct: Decimal | null;                    // site / benchmark × 100
}

export interface TheoreticalMinimum {
  min_gj_lhv_per_t: Decimal; actual_gj_lhv_per_t: Decimal;
  excess_gj_per_t: Decimal; efficiency_pct: Decimal;   // minimum / actual × 100
}

function per(x: Decimal, nh3: Decimal): Decimal | null {
  return nh3.isZero() ? null : x.div(nh3);
}

/**
 * Indirect CO2e of bought energy: MWh × the stream's factor or the set's grid default; steam
 * imported adds and steam exported subtracts (the site gets credit for heat it supplies).
 * A stream with no factor is left out and the figure marked incomplete rather than guessed.
 */
function indirect(input: EmissionsInput, set: FactorSet, flags: Flag[]): { t: Decimal; complete: boolean } {
  let t = ZERO;
  let complete = true;
  for (const s of streamsOf(input, "electricity-import")) {
    const f = s.factor_t_per_MWh ?? (set.grid_electricity ? set.grid_electricity.value : undefined);
    const mwh = s.mwh ?? (s.unit === "MWh" ? s.quantity : null);
    if (f === undefined || mwh === null) {
      complete = false;
      flags.push({ code: "electricity-factor-missing", severity: "warning",
        message: `Electricity ${s.id}: no t CO2/MWh factor in the file or in ${set.id}; left out of the indirect intensity.` });
      continue;
    }
    t = t.plus(dec(mwh).times(dec(f)));
  }
  for (const s of streamsOf(input, "steam-import", "steam-export")) {
    const f = s.factor_t_per_GJ ?? (set.steam ? set.steam.value : undefined);
    const gj = s.gj_lhv ?? s.quantity;
    if (f === undefined) {
      complete = false;
      flags.push({ code: "steam-factor-missing", severity: "warning",
        message: `Steam ${s.id}: no t CO2/GJ factor; left out of the indirect intensity.` });
      continue;
    }
    const x = dec(gj).times(dec(f));
    t = s.kind === "steam-import" ? t.plus(x) : t.minus(x);
  }
  return { t, complete };
}

export function intensities(input: EmissionsInput, set: FactorSet, e: { co2_t: Decimal; co2e_t: Decimal; net_co2e_t: Decimal },
  flags: Flag[]): IntensityFigures {
  const nh3 = dec(input.ammonia_t);
  if (nh3.lte(0)) flags.push({ code: "no-ammonia", severity: "error", message: "No ammonia produced this month: intensities cannot be formed." });
  const ind = indirect(input, set, flags);
  let energy = ZERO;
  for (const s of streamsOf(input, "feed-gas", "fuel-gas")) {
    if (s.gj_lhv === null) {
      flags.push({ code: "energy-missing", severity: "warning", message: `Stream ${s.id} has no GJ LHV; the energy intensity leaves it out.` });
      continue;
    }
    energy = energy.plus(dec(s.gj_lhv));
  }
  const ok = nh3.gt(0);
  return {
    ammonia_t: nh3,
    co2_t_per_t_nh3: ok ? per(e.co2_t, nh3) : null,
    co2e_t_per_t_nh3: ok ? per(e.co2e_t, nh3) : null,
    net_co2e_t_per_t_nh3: ok ? per(e.net_co2e_t, nh3) : null,
    indirect_co2e_t: ind.t,
    indirect_complete: ind.complete,
    co2e_incl_indirect_t_per_t_nh3: ok ? per(e.co2e_t.plus(ind.t), nh3) : null,
    energy_gj_lhv: energy,
    gj_lhv_per_t_nh3: ok ? per(energy, nh3) : null,
  };
}

/** Benchmarks in force in the month (dates inclusive); references without dates always shown. */
export function compareBenchmarks(set: FactorSet, month: string, i: IntensityFigures): BenchmarkComparison[] {
  const day = `${month}-01`;
  return set.benchmarks
    .filter((b) => (b.applies_from === null || b.applies_from <= day) && (b.applies_to === null || day <= b.applies_to))
    .map((b) => {
      // Table 3.1 figures are CO2 only; a product benchmark counts allowances, i.e. t CO2e.
      const comparedWith = b.unit.includes("CO2/") ? "co2_t_per_t_nh3" as const : "co2e_t_per_t_nh3" as const;
      const site = i[comparedWith];
      const value = dec(b.value);
      return {
        id: b.id, label: b.label, kind: b.kind, value, unit: b.unit, source: b.source, status: b.status, checked: b.checked ?? null,
        compared_with: comparedWith, site_value: site,
        difference: site === null ? null : site.minus(value),
        ratio_pct: site === null || value.isZero() ? null : site.div(value).times(100),
      };
    });
}

export function theoreticalMinimum(input: EmissionsInput, i: IntensityFigures): TheoreticalMinimum | null {
  if (!input.theoretical_min_gj_lhv_per_t_nh3 || i.gj_lhv_per_t_nh3 === null || i.gj_lhv_per_t_nh3.isZero()) return null;
  const min = dec(input.theoretical_min_gj_lhv_per_t_nh3);
  return {
    min_gj_lhv_per_t: min, actual_gj_lhv_per_t: i.gj_lhv_per_t_nh3,
    excess_gj_per_t: i.gj_lhv_per_t_nh3.minus(min), efficiency_pct: min.div(i.gj_lhv_per_t_nh3).times(100),
  };
}
