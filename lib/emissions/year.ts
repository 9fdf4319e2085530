import { ZERO, dec, sqrtOf, type Decimal } from "./decimal";
import type { EmissionsResult } from "./result";
import type { Destination, EmissionsInput, Flag } from "./types";
import { rss, summarise, type MeterComponent, type UncertaintyComponent, type UncertaintyFigures } from "./uncertainty";

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
  uncertainty: { co2: UncertaintyFigures; net_co2: UncertaintyFigures; co2e: UncertaintyFigures; net_co2e: UncertaintyFigures };
  flags: Flag[];
}

const MONTH_NAMES = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

export const YEAR_CORRELATION =
  "meters: the systematic part of each meter fully correlated across the months of one calibration period (periods independent), the random part independent month to month; analyses: independent month to month (each month its own samples); factors: fully correlated across months (the same value every month); different meters, analyses and factors independent";

/**
 * Annual uncertainty (GUM 5.2, correlated input quantities: u²(y) = Σ u_i² + 2 Σ_{i<j} r_ij u_i u_j,
 * with r = 1 or 0 as stated in YEAR_CORRELATION). Per meter m and calibration period p:
 *   u²_meter,year = Σ_m [ Σ_p (Σ_{months in p} s_m,month)² + Σ_months r_m,month² ]
 * where s and r are the systematic and random parts of the month (uncertainty.ts); per analysis
 * property the months add in quadrature; per factor key the months add linearly:
 *   u²_year = u²_meter,year + Σ_keys Σ_months a² + Σ_keys (Σ_months f)².
 * A meter whose months name no calibration date is one period: all its months correlated.
 */
function combine(parts: UncertaintyFigures[]): UncertaintyFigures {
  const value = parts.reduce((a, p) => a.plus(p.value_t), ZERO);
  const meters = new Map<string, { periods: Map<string, Decimal>; random2: Decimal }>();
  for (const p of parts) {
    for (const c of p.meter_components) {
      const m = meters.get(c.key) ?? { periods: new Map<string, Decimal>(), random2: ZERO };
      const period = c.period ?? "";
      // A month frozen before meters were split reads as all systematic, period unknown.
      const sysPart = c.systematic_u_std_t ?? c.u_std_t;
      const randPart = c.random_u_std_t ?? ZERO;
      m.periods.set(period, (m.periods.get(period) ?? ZERO).plus(sysPart));
      m.random2 = m.random2.plus(randPart.times(randPart));
      meters.set(c.key, m);
    }
  }
  const meterComponents: MeterComponent[] = [...meters].map(([key, m]) => {
    const sys = rss([...m.periods.values()]);
    const rand = sqrtOf(m.random2);
    const named = [...m.periods.keys()].filter((k) => k !== "");
    return { key, u_std_t: sqrtOf(sys.times(sys).plus(m.random2)), systematic_u_std_t: sys, random_u_std_t: rand, period: named.length ? named.join(", ") : null };
  });
  const analysis2 = new Map<string, Decimal>();
  for (const p of parts) for (const c of p.analysis_components ?? []) analysis2.set(c.key, (analysis2.get(c.key) ?? ZERO).plus(c.u_std_t.times(c.u_std_t)));
  const analysisComponents: UncertaintyComponent[] = [...analysis2].map(([key, v]) => ({ key, u_std_t: sqrtOf(v) }));
  const factorByKey = new Map<string, Decimal>();
  for (const p of parts) for (const c of p.factor_components) factorByKey.set(c.key, (factorByKey.get(c.key) ?? ZERO).plus(c.u_std_t));
  const factorComponents: UncertaintyComponent[] = [...factorByKey].map(([key, u]) => ({ key, u_std_t: u }));
  const missing = [...new Set(parts.flatMap((p) => p.meters_without_uncertainty))];
  return summarise(value, meterComponents, analysisComponents, factorComponents, missing, parts[0]?.coverage_factor, YEAR_CORRELATION);
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
  const before = entries.filter((e) => !e.result.uncertainty.co2e).map((e) => e.month);
  if (before.length > 0) {
    flags.push({ code: "uncertainty-co2-only", severity: "info",
      message: `${before.join(", ")} were frozen before CO2e carried its own uncertainty: the year's CO2e uncertainty counts their CO2 only.` });
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
  const dests: Destination[] = ["urea", "storage", "pcc", "sale", "other"];
  // Months frozen before "pcc" existed carry no entry for it: nothing went there.
  const byDest = Object.fromEntries(dests.map((d) => [d, sumOf(entries, (r) => r.transfers.by_destination[d]?.co2_t ?? ZERO)])) as Record<Destination, Decimal>;
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
      co2e: combine(entries.map((e) => e.result.uncertainty.co2e ?? e.result.uncertainty.co2)),
      net_co2e: combine(entries.map((e) => e.result.uncertainty.net_co2e ?? e.result.uncertainty.net_co2)),
    },
    flags,
  };
}
