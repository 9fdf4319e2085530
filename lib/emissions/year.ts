import { ZERO, dec, type Decimal } from "./decimal";
import type { EmissionsResult } from "./result";
import type { Destination, EmissionsInput, Flag } from "./types";
import { rss, summarise, type UncertaintyComponent, type UncertaintyFigures } from "./uncertainty";

export interface YearMonthEntry { month: string; input: EmissionsInput; result: EmissionsResult }

export interface YearResult {
  year: string;
  months_included: string[];
  months_missing: string[];
  ammonia_t: Decimal;
  emissions: EmissionsResult["emissions"];
  co2: EmissionsResult["co2"];
  transfers_by_destination: Record<Destination, Decimal>;
  intensity: {
    co2e_t_per_t_nh3: Decimal | null;
    net_co2e_t_per_t_nh3: Decimal | null;
    gj_lhv_per_t_nh3: Decimal | null;
    /** Imported electricity and steam less exported steam, summed over the months. */
    indirect_co2e_t: Decimal;
    /** False when any month left an import or export out for want of a factor. */
    indirect_complete: boolean;
    co2e_incl_indirect_t_per_t_nh3: Decimal | null;
  };
  uncertainty: { co2: UncertaintyFigures; net_co2: UncertaintyFigures };
  flags: Flag[];
}

const MONTH_NAMES = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

/**
 * Annual uncertainty model. Each month's CO2 uncertainty splits into a meter part and factor
 * parts (one per factor key, see uncertainty.ts).
 *  - Factors: the same factor value is used every month, so an error in it repeats in every month
 *    — fully correlated. Per factor key the monthly absolute standard uncertainties add linearly;
 *    different factor keys stay independent (root-sum-square).
 *  - Meters: a monthly total's error is taken as independent of the next month's (random
 *    reading and integration error), so the monthly meter parts add in quadrature. A systematic
 *    meter bias would be correlated too; we do not model it, which understates the annual figure
 *    when calibration drifts slowly.
 * u_year² = Σ_m u_meter,m² + Σ_keys (Σ_m u_key,m)²; expanded with the same k = 1.96.
 */
function combine(parts: UncertaintyFigures[]): UncertaintyFigures {
  const value = parts.reduce((a, p) => a.plus(p.value_t), ZERO);
  const meterU = rss(parts.map((p) => p.meter_u_std_t));
  const factorByKey = new Map<string, Decimal>();
  for (const p of parts) for (const c of p.factor_components) factorByKey.set(c.key, (factorByKey.get(c.key) ?? ZERO).plus(c.u_std_t));
  const factorComponents: UncertaintyComponent[] = [...factorByKey].map(([key, u]) => ({ key, u_std_t: u }));
  const meterComponents: UncertaintyComponent[] = parts.flatMap((p, i) => p.meter_components.map((c) => ({ key: `${i}:${c.key}`, u_std_t: c.u_std_t })));
  const missing = [...new Set(parts.flatMap((p) => p.meters_without_uncertainty))];
  return summarise(value, meterU, rss(factorComponents.map((c) => c.u_std_t)), meterComponents, factorComponents, missing, parts[0]?.coverage_factor);
}

function sumOf(entries: YearMonthEntry[], pick: (r: EmissionsResult) => Decimal): Decimal {
  return entries.reduce((a, e) => a.plus(pick(e.result)), ZERO);
}

/** Annual totals of up to twelve plant-months of one calendar year (partial years allowed). */
export function rollUpYear(months: YearMonthEntry[]): YearResult {
  const flags: Flag[] = [];
  if (months.length === 0) throw new Error("rollUpYear needs at least one month");
  const year = months[0].month.slice(0, 4);
  const seen = new Set<string>();
  const entries: YearMonthEntry[] = [];
  for (const e of months) {
    if (!/^\d{4}-(0[1-9]|1[0-2])$/.test(e.month) || e.month.slice(0, 4) !== year) {
      flags.push({ code: "month-outside-year", severity: "error", message: `Month ${e.month} is not a month of ${year}; left out.` });
      continue;
    }
    if (e.input.month !== e.month || e.result.month !== e.month) {
      flags.push({ code: "month-mismatch", severity: "error", message: `Entry ${e.month} carries input ${e.input.month} / result ${e.result.month}; left out.` });
      continue;
    }
    if (seen.has(e.month)) {
      flags.push({ code: "month-duplicated", severity: "error", message: `Month ${e.month} given twice; the second is left out.` });
      continue;
    }
    seen.add(e.month);
    entries.push(e);
  }
  entries.sort((a, b) => a.month.localeCompare(b.month));
  const missing = MONTH_NAMES.map((_, i) => `${year}-${String(i + 1).padStart(2, "0")}`).filter((m) => !seen.has(m));
  if (missing.length > 0) {
    const names = missing.map((m) => `${MONTH_NAMES[Number(m.slice(5)) - 1]} (${m})`).join(", ");
    flags.push({ code: "months-missing", severity: "warning", message: `Partial year ${year}: missing ${names}.` });
  }
  for (const key of ["method", "factor_set", "gwp"] as const) {
    const values = new Set(entries.map((e) => (key === "method" ? e.result.method : e.result[key].id)));
    if (values.size > 1) {
      flags.push({ code: `mixed-${key.replace("_", "-")}`, severity: "warning", message: `Months use different ${key.replace("_", " ")}s: ${[...values].join(", ")}.` });
    }
  }
  if (entries.some((e) => e.result.screening_estimate)) {
    flags.push({ code: "screening-estimate", severity: "warning", message: "Some months are screening estimates (default factor), not monitored figures." });
  }

  const nh3 = entries.reduce((a, e) => a.plus(dec(e.input.ammonia_t)), ZERO);
  const energy = sumOf(entries, (r) => r.intensity.energy_gj_lhv);
  const emissions = {
    co2_t: sumOf(entries, (r) => r.emissions.co2_t), ch4_t: sumOf(entries, (r) => r.emissions.ch4_t),
    n2o_t: sumOf(entries, (r) => r.emissions.n2o_t), co2e_t: sumOf(entries, (r) => r.emissions.co2e_t),
    transferred_co2_t: sumOf(entries, (r) => r.emissions.transferred_co2_t), net_co2e_t: sumOf(entries, (r) => r.emissions.net_co2e_t),
  };
  const dests: Destination[] = ["urea", "storage", "sale", "other"];
  const byDest = Object.fromEntries(dests.map((d) => [d, sumOf(entries, (r) => r.transfers.by_destination[d].co2_t)])) as Record<Destination, Decimal>;
  const ok = nh3.gt(0);
  const indirectT = sumOf(entries, (r) => r.intensity.indirect_co2e_t);
  return {
    year, months_included: entries.map((e) => e.month), months_missing: missing, ammonia_t: nh3, emissions,
    co2: { gross_t: emissions.co2_t, deductible_t: sumOf(entries, (r) => r.co2.deductible_t), net_t: sumOf(entries, (r) => r.co2.net_t) },
    transfers_by_destination: byDest,
    intensity: {
      co2e_t_per_t_nh3: ok ? emissions.co2e_t.div(nh3) : null,
      net_co2e_t_per_t_nh3: ok ? emissions.net_co2e_t.div(nh3) : null,
      gj_lhv_per_t_nh3: ok ? energy.div(nh3) : null,
      indirect_co2e_t: indirectT,
      indirect_complete: entries.every((e) => e.result.intensity.indirect_complete),
      co2e_incl_indirect_t_per_t_nh3: ok ? emissions.co2e_t.plus(indirectT).div(nh3) : null,
    },
    uncertainty: {
      co2: combine(entries.map((e) => e.result.uncertainty.co2)),
      net_co2: combine(entries.map((e) => e.result.uncertainty.net_co2)),
    },
    flags,
  };
}
