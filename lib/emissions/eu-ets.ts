// EU emissions trading monitoring check for one site and year (issue 14): the installation's
// category, each source stream's class, the activity-data tier each meter reaches over the year
// against the tier its category and class require, the tier of the calculation factors, and the
// verifier's materiality level. Pure Decimal; no framework or database imports.
//
// Texts read (each value below names where):
// - Reg. (EU) 2018/2066 Art 19(2) categories and 19(3) source-stream classes: read in Reg. (EU)
//   601/2012 Art 19 as published on legislation.gov.uk (same wording carried into 2018/2066 Art 19,
//   whose de-minimis and minor limits were read in a parallel-text excerpt of 2018/2066).
// - Reg. (EU) 2018/2066 Art 26(1)–(3) applicable tiers: read in 2018/2066 Art 26 on legislation.gov.uk.
// - Annex II Table 1 activity-data tiers and Annex V Table 1 category-A minimum tiers: read in the
//   601/2012 annexes on legislation.gov.uk (2018/2066 keeps the annexes' titles; their tables were
//   not read in 2018/2066 itself).
// - Reg. (EU) 2018/2067 Art 23 materiality: read in its predecessor, Reg. (EU) 600/2012 Art 23.
// - The tier of calculation factors from laboratory analyses (tier 3) is not confirmed here.
import { ZERO, dec, sqrtOf, type Decimal } from "./decimal";
import type { Benchmark } from "./factor-set-schema";
import type { YearMonthEntry } from "./year";
import type { Flag, StreamKind } from "./types";

export type InstallationCategory = "A" | "B" | "C";
export type SourceStreamClass = "major" | "minor" | "de-minimis";

export interface RuleSource { text: string; status: "confirmed" | "unconfirmed"; checked: string }

const READ_601 = "Reg. (EU) 601/2012 as published on legislation.gov.uk (official reproduction); the same provision in 2018/2066";
export const RULES = {
  category: { text: "Reg. (EU) 2018/2066 Art 19(2): A ≤ 50 000 t CO2(e), B ≤ 500 000 t, C above; excluding biomass CO2, before subtraction of transferred CO2", status: "confirmed", checked: READ_601 },
  classes: { text: "Reg. (EU) 2018/2066 Art 19(3): minor jointly < 5 000 t fossil CO2 or < 10 % (at most 100 000 t), de minimis jointly < 1 000 t or < 2 % (at most 20 000 t), whichever is higher in absolute value; against the sum of absolute values before subtraction of transferred CO2", status: "confirmed", checked: `${READ_601}; the limits also read in a parallel-text excerpt of 2018/2066` },
  tiers: { text: "Reg. (EU) 2018/2066 Art 26(1): category A at least the Annex V tiers, otherwise the highest Annex II tier; for major source streams one level lower (category C) or up to two lower (A and B), at least tier 1, where the authority accepts that the higher tier is technically not feasible or costs unreasonably; Art 26(2): minor source streams may apply lower tiers, at least tier 1; Art 26(3): de-minimis source streams may be estimated without a tier", status: "confirmed", checked: "Reg. (EU) 2018/2066 Art 26 as published on legislation.gov.uk" },
  activityThresholds: { text: "Reg. (EU) 2018/2066 Annex II Table 1, combustion of fuels and fuels used as process input, other gaseous and liquid fuels: tier 1 ±7.5 %, tier 2 ±5 %, tier 3 ±2.5 %, tier 4 ±1.5 % over the reporting period", status: "confirmed", checked: "Reg. (EU) 601/2012 Annex II Table 1 on legislation.gov.uk" },
  annexV: { text: "Reg. (EU) 2018/2066 Annex V Table 1, other gaseous and liquid fuels, category A minimum: activity data tier 2, emission factor and net calorific value tier 2a/2b", status: "confirmed", checked: "Reg. (EU) 601/2012 Annex V Table 1 on legislation.gov.uk" },
  factorTiers: { text: "calculation factors: tier 3 where the emission factor and calorific value come from laboratory analyses of the source stream, tier 2a/2b for national or proxy values, tier 1 for the standard factors (Reg. (EU) 2018/2066 Annex II section 2, not read here)", status: "unconfirmed", checked: "not read" },
  materiality: { text: "Reg. (EU) 2018/2067 Art 23: materiality level 5 % of the total reported emissions for category A and B installations, 2 % for category C", status: "confirmed", checked: "Reg. (EU) 600/2012 Art 23 on legislation.gov.uk (the predecessor; 2018/2067 Art 23 itself not read)" },
} as const satisfies Record<string, RuleSource>;

/** Activity-data tiers of Annex II Table 1 for gaseous fuels: highest first. */
export const ACTIVITY_TIERS: readonly { tier: number; max_pct: Decimal }[] = [
  { tier: 4, max_pct: dec("1.5") }, { tier: 3, max_pct: dec("2.5") }, { tier: 2, max_pct: dec(5) }, { tier: 1, max_pct: dec("7.5") },
];
const HIGHEST_ACTIVITY_TIER = 4;
const CATEGORY_A_ACTIVITY_TIER = 2; // Annex V Table 1
const HIGHEST_FACTOR_TIER = 3; // Annex II section 2: analyses (unconfirmed)
const CATEGORY_A_FACTOR_TIER = 2; // Annex V Table 1: 2a/2b

const KT50 = dec(50_000);
const KT500 = dec(500_000);

/** Art 19(2). The regulation takes the average verified emissions of the previous trading period; here the year's own figure stands in. */
export function installationCategory(emissionsT: Decimal): InstallationCategory {
  if (emissionsT.lte(KT50)) return "A";
  if (emissionsT.lte(KT500)) return "B";
  return "C";
}

/** Reg. (EU) 2018/2067 Art 23(1)–(2), %. */
export function materialityPct(category: InstallationCategory): Decimal {
  return category === "C" ? dec(2) : dec(5);
}

/** The limit a group of streams must stay below, jointly: the higher of the absolute figure and the share (capped). */
function jointLimit(total: Decimal, absoluteT: number, sharePct: number, capT: number): Decimal {
  const share = total.times(sharePct).div(100);
  const capped = share.gt(capT) ? dec(capT) : share;
  return capped.gt(absoluteT) ? capped : dec(absoluteT);
}

/**
 * Art 19(3): the operator selects the streams it classes minor or de minimis; jointly they must stay
 * below the limit. The smallest streams are taken first, which classes as many as the rule allows;
 * the rest are major. Comparison is against the sum of absolute values. "Less than" is strict.
 */
export function classifySourceStreams(streams: { id: string; t: Decimal }[]): Map<string, SourceStreamClass> {
  const total = streams.reduce((a, s) => a.plus(s.t.abs()), ZERO);
  const deMinimisLimit = jointLimit(total, 1_000, 2, 20_000);
  const minorLimit = jointLimit(total, 5_000, 10, 100_000);
  const sorted = [...streams].sort((a, b) => a.t.abs().cmp(b.t.abs()) || a.id.localeCompare(b.id));
  const out = new Map<string, SourceStreamClass>();
  let deMinimis = ZERO;
  let minor = ZERO;
  for (const s of sorted) {
    const t = s.t.abs();
    if (deMinimis.plus(t).lt(deMinimisLimit)) {
      deMinimis = deMinimis.plus(t);
      out.set(s.id, "de-minimis");
    } else if (minor.plus(t).lt(minorLimit)) {
      minor = minor.plus(t);
      out.set(s.id, "minor");
    } else out.set(s.id, "major");
  }
  return out;
}

/** The highest Annex II tier whose maximum permissible uncertainty the annual uncertainty meets; 0 beyond tier 1. */
export function activityTierOf(uncertaintyPct: Decimal): number {
  return ACTIVITY_TIERS.find((t) => uncertaintyPct.lte(t.max_pct))?.tier ?? 0;
}

export interface TierRequirement {
  /** Tier Art 26 asks for; null for a de-minimis stream (estimation allowed). */
  required: number | null;
  /** The lowest tier the authority may accept for a major stream on feasibility or cost grounds (Art 26(1) second subparagraph). */
  with_approval: number | null;
  rule: string;
}

export function activityTierRequired(category: InstallationCategory, cls: SourceStreamClass): TierRequirement {
  if (cls === "de-minimis") return { required: null, with_approval: null, rule: "Art 26(3): a de-minimis source stream may be estimated without a tier" };
  if (cls === "minor") return { required: 1, with_approval: null, rule: "Art 26(2): a minor source stream may apply a lower tier, at least tier 1" };
  const base = category === "A" ? CATEGORY_A_ACTIVITY_TIER : HIGHEST_ACTIVITY_TIER;
  const lower = Math.max(1, base - (category === "C" ? 1 : 2));
  return {
    required: base,
    with_approval: lower,
    rule: category === "A" ? "Art 26(1)(a) and Annex V: category A, at least tier 2" : `Art 26(1)(b): category ${category}, the highest Annex II tier (4)`,
  };
}

export function factorTierRequired(category: InstallationCategory, cls: SourceStreamClass): number | null {
  if (cls === "de-minimis") return null;
  if (cls === "minor") return 1;
  return category === "A" ? CATEGORY_A_FACTOR_TIER : HIGHEST_FACTOR_TIER;
}

/**
 * Relative expanded uncertainty (%) of a stream's annual total from its monthly totals q_i, each
 * stated at U_i % with a share s_i repeating every month (the year model of lib/emissions/year.ts):
 * U_year = √((Σ s_i·U_i·q_i)² + Σ (√(1 − s_i²)·U_i·q_i)²) / Σ q_i. All systematic: U_year is the
 * quantity-weighted mean of U_i; all random: it shrinks like 1/√n. Null when a month states none.
 */
export function annualUncertaintyPct(months: { quantity: Decimal; uncertainty_pct: Decimal | null; systematic_share: Decimal }[]): Decimal | null {
  if (months.length === 0 || months.some((m) => m.uncertainty_pct === null)) return null;
  let sys = ZERO;
  let rand2 = ZERO;
  let total = ZERO;
  for (const m of months) {
    const u = m.uncertainty_pct!.times(m.quantity.abs());
    sys = sys.plus(u.times(m.systematic_share));
    const r = u.times(sqrtOf(dec(1).minus(m.systematic_share.times(m.systematic_share))));
    rand2 = rand2.plus(r.times(r));
    total = total.plus(m.quantity.abs());
  }
  return total.isZero() ? null : sqrtOf(sys.times(sys).plus(rand2)).div(total);
}

export interface SourceStreamCheck {
  id: string;
  kind: StreamKind;
  /** The stream's emissions over the year, t CO2e (absolute value of what it contributes). */
  emissions_t: Decimal;
  share_pct: Decimal | null;
  class: SourceStreamClass;
  uncertainty_pct: Decimal | null;
  tier_achieved: number | null;
  tier_required: number | null;
  tier_with_approval: number | null;
  /** The largest uncertainty that would reach the required tier, %; null when no tier is required. */
  uncertainty_needed_pct: Decimal | null;
  factor_origin: "analysis" | "default";
  factor_tier_achieved: number;
  factor_tier_required: number | null;
  rule: string;
}

export interface MonitoringCheck {
  installation_category: InstallationCategory;
  /** The figure the category is read from: the year's CO2e before transfers are subtracted, t. */
  emissions_t: Decimal;
  materiality_threshold_pct: Decimal;
  materiality_threshold_t: Decimal;
  source_streams: SourceStreamCheck[];
  flags: Flag[];
  rules: RuleSource[];
  /** Why the figures are an indication: the category rests on the previous trading period. */
  notes: string[];
}

const SOURCE_KINDS: StreamKind[] = ["feed-gas", "fuel-gas", "purge-gas", "co2-export", "co2-vent", "stack-co2"];

export function monitoringCheck(months: YearMonthEntry[]): MonitoringCheck {
  const emissionsT = months.reduce((a, m) => a.plus(m.result.emissions.co2e_t), ZERO);
  const category = installationCategory(emissionsT);
  // Each stream's emissions over the year, as the month's method attributes them.
  const byStream = new Map<string, { kind: StreamKind; t: Decimal }>();
  for (const m of months)
    for (const r of m.result.by_stream) {
      const kind = r.kind as StreamKind;
      if (!SOURCE_KINDS.includes(kind)) continue; // the screening method's per-tonne row is no source stream
      const e = byStream.get(r.id) ?? { kind, t: ZERO };
      e.t = e.t.plus(r.co2e_t);
      byStream.set(r.id, e);
    }
  const present = [...byStream].filter(([, v]) => !v.t.isZero()).map(([id, v]) => ({ id, kind: v.kind, t: v.t.abs() }));
  const classes = classifySourceStreams(present);
  const total = present.reduce((a, s) => a.plus(s.t), ZERO);
  const flags: Flag[] = [];
  const source_streams = present.map((s): SourceStreamCheck => {
    const cls = classes.get(s.id)!;
    const monthsOf = months.flatMap((m) => m.input.streams.filter((x) => x.id === s.id).map((x) => ({
      quantity: dec(x.quantity),
      uncertainty_pct: x.uncertainty_pct === null ? null : dec(x.uncertainty_pct),
      systematic_share: x.systematic_pct === undefined ? dec(1) : dec(x.systematic_pct).div(100),
      analysis: x.analysis,
    })));
    const u = annualUncertaintyPct(monthsOf);
    const achieved = u === null ? null : activityTierOf(u);
    const req = activityTierRequired(category, cls);
    const needed = req.required === null ? null : ACTIVITY_TIERS.find((t) => t.tier === req.required)!.max_pct;
    const origin = monthsOf.every((x) => x.analysis !== undefined) ? "analysis" : "default";
    const factorAchieved = origin === "analysis" ? HIGHEST_FACTOR_TIER : 1;
    const factorRequired = factorTierRequired(category, cls);
    if (req.required !== null && (achieved === null || achieved < req.required)) {
      const reached = achieved === null ? "no stated uncertainty" : achieved === 0 ? `±${u!.toDecimalPlaces(2).toFixed()} %, beyond tier 1` : `tier ${achieved} (±${u!.toDecimalPlaces(2).toFixed()} %)`;
      const approval = req.with_approval !== null && achieved !== null && achieved >= req.with_approval
        ? `; tier ${req.with_approval} is allowed only where the competent authority accepts that tier ${req.required} is technically not feasible or costs unreasonably (Art 26(1))`
        : "";
      flags.push({ code: "eu-ets-activity-tier-shortfall", severity: "warning",
        message: `${s.id}: its meter reaches ${reached} over the year; a ${cls} source stream of a category ${category} installation needs tier ${req.required}, an uncertainty of ±${needed!.toFixed()} % or better${approval}` });
    }
    if (factorRequired !== null && factorAchieved < factorRequired)
      flags.push({ code: "eu-ets-factor-tier-shortfall", severity: "warning",
        message: `${s.id}: its calculation factors are default values (tier 1); a ${cls} source stream of a category ${category} installation needs tier ${factorRequired === 2 ? "2a/2b" : factorRequired} (laboratory analyses of the stream give tier ${HIGHEST_FACTOR_TIER}; unconfirmed)` });
    return {
      id: s.id, kind: s.kind, emissions_t: s.t, share_pct: total.isZero() ? null : s.t.div(total).times(100), class: cls,
      uncertainty_pct: u, tier_achieved: achieved, tier_required: req.required, tier_with_approval: req.with_approval,
      uncertainty_needed_pct: needed, factor_origin: origin, factor_tier_achieved: factorAchieved, factor_tier_required: factorRequired, rule: req.rule,
    };
  });
  const sets = new Set(months.map((m) => m.result.factor_set.id));
  const notes = [
    "The category is read from this year's emissions; the regulation reads it from the average verified annual emissions of the previous trading period.",
    "A monthly meter uncertainty is combined over the year with its stated repeating share (all repeating unless stated); a month without a stated uncertainty leaves the stream's tier unknown.",
    ...(sets.has("eu-mrr") && sets.size === 1 ? [] : [`The months are computed under ${[...sets].join(", ")}; an EU emissions report uses the EU set (eu-mrr).`]),
  ];
  const materiality = materialityPct(category);
  return {
    installation_category: category,
    emissions_t: emissionsT,
    materiality_threshold_pct: materiality,
    materiality_threshold_t: emissionsT.times(materiality).div(100),
    source_streams,
    flags,
    rules: Object.values(RULES),
    notes,
  };
}

export interface EtsBenchmark {
  id: string;
  label: string;
  /** Null when the value was not confirmed in the act that set it: then it is left out, never shown as if sourced. */
  value: Decimal | null;
  unit: string;
  source: string;
  status: "confirmed" | "unconfirmed";
  /** The year's intensity as the trading system counts it: CO2e before any deduction (CO2 to urea counted as emitted) per tonne NH3. */
  intensity_t_per_t: Decimal | null;
  difference_pct: Decimal | null;
}

/**
 * The EU ammonia product benchmark in force in the year, from the EU set; none for 2026–2030 (the
 * act setting it was not found, so no value is shown). The comparison counts all CO2 as emitted,
 * including CO2 used for urea (Decision 2011/278/EU recital on the ammonia benchmark, read in a
 * parallel-text excerpt).
 */
export function etsBenchmark(year: string, benchmarks: readonly Benchmark[], co2eBeforeDeductionsT: Decimal, ammoniaT: Decimal): EtsBenchmark | null {
  const day = `${year}-07-01`;
  const b = benchmarks.find((x) => x.id.startsWith("eu-ammonia-") && (x.applies_from ?? "") <= day && (x.applies_to ?? "9999") >= day);
  if (!b) return null;
  const intensity = ammoniaT.gt(0) ? co2eBeforeDeductionsT.div(ammoniaT) : null;
  // Issue 14: a benchmark not confirmed in its act is left out (the year's intensity is still shown).
  const value = b.status === "confirmed" ? dec(b.value) : null;
  return { id: b.id, label: b.label, value, unit: b.unit, source: b.source, status: b.status, intensity_t_per_t: intensity,
    difference_pct: intensity && value ? intensity.minus(value).div(value).times(100) : null };
}

// ---- Annual emissions report content (Reg. (EU) 2018/2066 Art 67–68 and Annex X: what an
// annual emissions report holds per source stream, in a layout of our own; Annex X's list was not
// read here, so the items follow the list: activity data, calorific value, emission
// factor, oxidation or conversion factor, tiers applied, emissions, totals, transfers, data gaps.)

export interface ReportStreamRow {
  id: string;
  kind: StreamKind;
  /** Activity data by the unit it is metered in (a stream whose unit changed lists each). */
  activity: { unit: string; quantity: Decimal }[];
  mass_t: Decimal | null;
  ncv_gj_per_t: Decimal | null;
  carbon_t_per_t: Decimal | null;
  /** CO2 per net energy, t CO2/TJ, implied by the year's figures. */
  emission_factor_t_per_tj: Decimal | null;
  oxidation_factor: string;
  tier_activity: string;
  tier_factors: string;
  co2_t: Decimal;
  co2e_t: Decimal;
}

export interface ReportTransferRow { id: string; destination: string; co2_t: Decimal; deducted_under_eu_rules: boolean; receiver: string }

export interface AnnualReportContent {
  streams: ReportStreamRow[];
  totals: { co2e_before_deductions_t: Decimal; deducted_t: Decimal; net_co2e_t: Decimal };
  transfers: ReportTransferRow[];
  data_gaps: string[];
}

const EU_DEDUCTED = new Set(["storage", "pcc"]); // Reg. (EU) 2018/2066 Art 49(1)

export function annualReportContent(months: YearMonthEntry[], check: MonitoringCheck, year: string): AnnualReportContent {
  const rows = new Map<string, { kind: StreamKind; units: Map<string, Decimal>; t: Decimal; tKnown: boolean; gj: Decimal; carbon: Decimal; co2: Decimal; co2e: Decimal }>();
  for (const m of months) {
    for (const s of m.input.streams) {
      if (!SOURCE_KINDS.slice(0, 3).includes(s.kind)) continue; // feed, fuel and purge: the gases whose carbon is counted
      const r = rows.get(s.id) ?? { kind: s.kind, units: new Map(), t: ZERO, tKnown: true, gj: ZERO, carbon: ZERO, co2: ZERO, co2e: ZERO };
      r.units.set(s.unit, (r.units.get(s.unit) ?? ZERO).plus(dec(s.quantity)));
      if (s.t === null) r.tKnown = false;
      else r.t = r.t.plus(dec(s.t));
      r.gj = r.gj.plus(s.gj_lhv === null ? ZERO : dec(s.gj_lhv));
      r.carbon = r.carbon.plus(s.carbon_t === null ? ZERO : dec(s.carbon_t));
      rows.set(s.id, r);
    }
    for (const b of m.result.by_stream) {
      const r = rows.get(b.id);
      if (r) {
        r.co2 = r.co2.plus(b.co2_t);
        r.co2e = r.co2e.plus(b.co2e_t);
      }
    }
  }
  const massBalance = months.every((m) => m.result.method === "carbon-mass-balance");
  const streams = [...rows].map(([id, r]): ReportStreamRow => {
    const c = check.source_streams.find((s) => s.id === id);
    const t = r.tKnown && r.t.gt(0) ? r.t : null;
    return {
      id, kind: r.kind,
      activity: [...r.units].map(([unit, quantity]) => ({ unit, quantity })),
      mass_t: t,
      ncv_gj_per_t: t ? r.gj.div(t) : null,
      carbon_t_per_t: t ? r.carbon.div(t) : null,
      emission_factor_t_per_tj: r.gj.gt(0) && !r.co2.isZero() ? r.co2.div(r.gj).times(1000) : null,
      oxidation_factor: massBalance ? "not applied (carbon mass balance)" : "1: all carbon taken as oxidised (unconfirmed as the rule's default)",
      tier_activity: c ? (c.tier_required === null ? `${c.tier_achieved ?? "—"} (de minimis: none required)` : `${c.tier_achieved ?? "—"} of ${c.tier_required} required`) : "not a source stream this year",
      tier_factors: c ? `${c.factor_origin === "analysis" ? "laboratory analysis" : "default values"}, tier ${c.factor_tier_achieved}` : "—",
      co2_t: r.co2, co2e_t: r.co2e,
    };
  });
  const transfers = new Map<string, ReportTransferRow>();
  for (const m of months)
    for (const s of m.input.streams) {
      if (s.kind !== "co2-export") continue;
      const t = s.t === null ? ZERO : dec(s.t);
      const dest = s.destination ?? "other";
      const row = transfers.get(s.id) ?? { id: s.id, destination: dest, co2_t: ZERO, deducted_under_eu_rules: EU_DEDUCTED.has(dest), receiver: "not recorded in Synledger: name the receiving installation in the report" };
      row.co2_t = row.co2_t.plus(t);
      transfers.set(s.id, row);
    }
  const gross = months.reduce((a, m) => a.plus(m.result.emissions.co2e_t), ZERO);
  const deducted = [...transfers.values()].filter((x) => x.deducted_under_eu_rules).reduce((a, x) => a.plus(x.co2_t), ZERO);
  const present = new Set(months.map((m) => m.month));
  const missing = Array.from({ length: 12 }, (_, i) => `${year}-${String(i + 1).padStart(2, "0")}`).filter((m) => !present.has(m));
  const noU = [...new Set(months.flatMap((m) => m.result.uncertainty.co2.meters_without_uncertainty))];
  const gaps = [
    ...(missing.length ? [`Months not in these figures: ${missing.join(", ")} (not ended, not entered or not computing); nothing was substituted for them.`] : []),
    ...(noU.length ? [`Meters without a stated uncertainty: ${noU.join(", ")}.`] : []),
    "No reading was substituted: Synledger records no missing-data substitution yet, so a gap shows as a missing month, never as an estimate.",
  ];
  return { streams, totals: { co2e_before_deductions_t: gross, deducted_t: deducted, net_co2e_t: gross.minus(deducted) }, transfers: [...transfers.values()], data_gaps: gaps };
}
