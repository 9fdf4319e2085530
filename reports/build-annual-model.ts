/**
 * Year data → AnnualStatementModel, the display model reports/annual-statement.tsx lays out. The
 * annual page shows the same strings before signing, so what the signatory reads is what the PDF
 * prints. Every figure is formatted from the engine's decimals here, once.
 */
import { num } from "@/lib/balance/decimal";
import { toResultDocument } from "@/lib/balance/result";
import { uncertaintyJson } from "@/lib/balance/result-emissions";
import { YEAR_CORRELATION, type YearResult } from "@/lib/emissions/year";
import { endedRuns, yearEuEtsAndCbam, type MonthRun, type YearBenchmark } from "@/lib/ledger/year";
import { hasEnded } from "@/lib/period";
import { STATE_LABELS } from "@/lib/month-states";
import type { InstallationIdentity } from "@/lib/validations/installation";
import { declarationText, installationFacts } from "@/reports/build-model";
import { flagRows, meteringLabel, methodSection, revisionRows, uncertaintyRow, unconfirmedRows, type RevisionFact } from "@/reports/build-model-parts";
import { DASH, compare, fixed, monthLabel, percentOver, small, utcStamp } from "@/reports/format";
import { STATEMENT_CAUTIONS, type AnnualStatementModel, type EuEtsSection, type GasRow, type IntensityRow } from "@/reports/model";


export interface AnnualModelInput {
  organisation: string;
  site: { name: string; code: string; meteringReference: string; installation?: InstallationIdentity | null };
  year: string;
  revision: number;
  statementRef: string;
  runs: MonthRun[];
  rollUp: YearResult;
  benchmarks: YearBenchmark[];
  theoreticalMin: string | null;
  preparedBy: string;
  preparedAt: Date | null;
  revisions: RevisionFact[];
  /** The monthly statement and frozen result of each month, by period (known once the months are signed). */
  monthSources?: Map<string, { statementRef: string; resultSha256: string }>;
  now?: Date;
  signOff: { signer: string; role: string; signedAt: Date | null; certificateSubject: string; certificateFingerprint: string; verifyAt: string };
}

function gasRows(runs: MonthRun[]): GasRow[] {
  const ok = runs.flatMap((r) => (r.result ? [r.result.emissions.detail] : []));
  const gwps = new Set(ok.map((d) => d.gwp.id));
  return (["co2", "ch4", "n2o"] as const).map((g) => {
    const t = ok.reduce((a, d) => a.plus(d.by_gas[g].t), ok[0].by_gas[g].t.times(0));
    const co2e = ok.reduce((a, d) => a.plus(d.by_gas[g].co2e_t), ok[0].by_gas[g].co2e_t.times(0));
    const gwp = g === "co2" ? "1" : gwps.size === 1 ? ok[0].gwp[g].toFixed() : "mixed";
    return { gas: g.toUpperCase(), mass: { value: g === "co2" ? fixed(num(t), 1) : small(num(t)), unit: "t" }, gwp, co2e: { value: fixed(num(co2e), 1), unit: "t CO2e" } };
  });
}

const MEASURE: Record<YearBenchmark["compared_with"], string> = { co2_t_per_t_nh3: "Direct CO2 per tonne NH3", co2e_t_per_t_nh3: "Direct CO2e per tonne NH3" };

export function intensityRowsOfYear(y: YearResult, benchmarks: YearBenchmark[], theoreticalMin: string | null): IntensityRow[] {
  const rows: IntensityRow[] = [];
  const info = (measure: string, value: string | null, places: number, unit: string): IntensityRow => ({
    measure, value: { value: fixed(value, places), unit }, benchmark: { value: DASH, unit }, benchmarkSource: "no benchmark in the factor set", mark: "info", position: "For information",
  });
  const co2e = num(y.intensity.co2e_t_per_t_nh3);
  if (!benchmarks.some((b) => b.compared_with === "co2e_t_per_t_nh3")) rows.push(info("Direct CO2e per tonne NH3", co2e, 3, "t CO2e/t NH3"));
  for (const b of benchmarks) {
    const above = b.site_value !== null && compare(b.site_value, b.value) > 0;
    rows.push({
      measure: `${MEASURE[b.compared_with]}, against ${b.label}`,
      value: { value: fixed(b.site_value, 3), unit: b.unit },
      benchmark: { value: fixed(b.value, 3), unit: b.unit },
      benchmarkSource: `${b.source}${b.status === "unconfirmed" ? " (unconfirmed)" : ""}`,
      mark: above ? "attention" : "ok",
      position: b.site_value === null ? "No value this year" : `${above ? "Above by" : "At or below, by"} ${percentOver(b.site_value, b.value)} %`,
    });
  }
  rows.push(info("Net CO2e per tonne NH3 (after deductions)", num(y.intensity.net_co2e_t_per_t_nh3), 3, "t CO2e/t NH3"));
  const gj = num(y.intensity.gj_lhv_per_t_nh3);
  rows.push({
    measure: "Energy per tonne NH3 (net calorific value), against the theoretical minimum",
    value: { value: fixed(gj, 2), unit: "GJ NCV/t NH3" },
    benchmark: { value: fixed(theoreticalMin, 2), unit: "GJ NCV/t NH3" },
    benchmarkSource: "theoretical minimum for the year's gas, weighted by monthly production",
    mark: "info",
    position: gj && theoreticalMin ? `Above the minimum by ${percentOver(gj, theoreticalMin)} %` : "No value this year",
  });
  return rows;
}

export function buildAnnualModel(input: AnnualModelInput): AnnualStatementModel {
  const y = input.rollUp;
  const now = input.now ?? new Date();
  // Totals count ended months only: the running month is shown but never added in.
  const ended = endedRuns(input.runs, now);
  const computed = ended.filter((r) => r.result);
  const first = toResultDocument(computed[0].result!);
  const method = methodSection(first);
  if (y.flags.some((f) => f.code.startsWith("mixed-"))) method.notes.push("The months of this year do not all use the same method, factor set or GWP set; each month is stated under its own.");
  const monthFlags = ended.flatMap((r) =>
    (r.result?.flags ?? []).filter((f) => f.severity !== "info").map((f) => ({ code: f.code, severity: f.severity, message: `${r.period}: ${f.message}`, ...(f.stream ? { stream: f.stream } : {}) })),
  );
  return {
    header: {
      organisation: input.organisation,
      installation: installationFacts(input.site.installation),
      siteName: input.site.name,
      siteCode: input.site.code,
      period: input.year,
      periodLabel: `Calendar year ${input.year}`,
      revision: String(input.revision),
      statementRef: input.statementRef,
      meteringReference: meteringLabel(input.site.meteringReference),
      preparedBy: input.preparedBy,
      preparedAt: input.preparedAt ? utcStamp(input.preparedAt) : DASH,
    },
    method,
    sources: ended.map((r) => {
      const src = input.monthSources?.get(r.period);
      return { month: monthLabel(r.period), revision: String(r.revision), statementRef: src?.statementRef ?? DASH, resultSha256: src?.resultSha256 ?? DASH };
    }),
    units: { ammonia: "t", co2: "t", co2e: "t", intensity: "t CO2e/t NH3" },
    months: input.runs.map((r) => {
      const d = r.result?.emissions.detail;
      return {
        month: monthLabel(r.period),
        revision: String(r.revision),
        ammonia: fixed(num(r.result?.feed.ammonia_t), 1),
        grossCo2: fixed(num(d?.co2.gross_t), 1),
        deducted: fixed(num(d?.co2.deductible_t), 1),
        netCo2: fixed(num(d?.co2.net_t), 1),
        co2e: fixed(num(d?.emissions.co2e_t), 1),
        intensity: fixed(num(d?.intensity.co2e_t_per_t_nh3), 3),
        status: !hasEnded(r.period, now) ? "In progress, not counted" : r.result ? STATE_LABELS[r.state] : "Does not compute",
      };
    }),
    totals: {
      ammonia: fixed(num(y.ammonia_t), 1),
      grossCo2: fixed(num(y.co2.gross_t), 1),
      deducted: fixed(num(y.co2.deductible_t), 1),
      netCo2: fixed(num(y.co2.net_t), 1),
      co2e: fixed(num(y.emissions.co2e_t), 1),
      intensity: fixed(num(y.intensity.co2e_t_per_t_nh3), 3),
    },
    emissionsByGas: gasRows(ended),
    intensities: intensityRowsOfYear(y, input.benchmarks, input.theoreticalMin),
    uncertainty: [
      uncertaintyRow("Gross CO2, year", uncertaintyJson(y.uncertainty.co2)),
      uncertaintyRow("Net CO2, year", uncertaintyJson(y.uncertainty.net_co2)),
      uncertaintyRow("Gross CO2e, year", uncertaintyJson(y.uncertainty.co2e), undefined, "t CO2e"),
      { figure: "How the months combine", value: { value: "", unit: "" }, expanded: "", note: YEAR_CORRELATION },
    ],
    flags: flagRows([...y.flags, ...monthFlags], null),
    revisions: revisionRows(input.revisions),
    cautions: [...STATEMENT_CAUTIONS],
    unconfirmedCount: unconfirmedRows(first).length,
    euEts: euEtsSection(input.year, input.runs, now),
    signOff: {
      signer: input.signOff.signer,
      role: input.signOff.role,
      date: input.signOff.signedAt ? utcStamp(input.signOff.signedAt) : "not signed yet",
      revision: String(input.revision),
      certificateSubject: input.signOff.certificateSubject,
      certificateFingerprint: input.signOff.certificateFingerprint,
      verifyAt: input.signOff.verifyAt,
      declaration: declarationText(unconfirmedRows(first).length),
    },
  };
}

/** Key figures stored with the annual statement, for lists and the verification answer. */
export function annualSummary(y: YearResult): Record<string, string> {
  return {
    ammonia: `${fixed(num(y.ammonia_t), 1)} t NH3`,
    grossCo2: `${fixed(num(y.co2.gross_t), 1)} t CO2`,
    netCo2: `${fixed(num(y.co2.net_t), 1)} t CO2`,
    co2e: `${fixed(num(y.emissions.co2e_t), 1)} t CO2e`,
    intensity: `${fixed(num(y.intensity.co2e_t_per_t_nh3), 3)} t CO2e/t NH3`,
    uncertainty: `± ${fixed(num(y.uncertainty.co2.u95_pct), 2)} % (95 %)`,
    months: `${y.months_included.length}`,
  };
}

const CLASS_LABEL: Record<string, string> = { major: "major", minor: "minor", "de-minimis": "de minimis" };

/** The EU trading-system and CBAM section of the annual statement, as display text. */
export function euEtsSection(year: string, runs: AnnualModelInput["runs"], now: Date): EuEtsSection | null {
  const f = yearEuEtsAndCbam(year, runs, now);
  if (!f) return null;
  const e = f.euEts;
  const c = f.cbam;
  const b = e.benchmark;
  return {
    facts: [
      ["Installation category", `${e.installation_category} (Reg. (EU) 2018/2066 Art 19(2); from ${fixed(e.emissions_t, 0)} t CO2e this year)`],
      ["Materiality level", `${e.materiality_threshold_pct} % = ${fixed(e.materiality_threshold_t, 0)} t CO2e (Reg. (EU) 2018/2067 Art 23)`],
      ["EU ammonia benchmark", b ? `${b.value === null ? `${b.label}: ${b.value_note}` : `${b.value} ${b.unit} (${b.source})`}; this year ${fixed(b.intensity_t_per_t, 3)} t CO2e/t NH3, CO2 to urea counted as emitted` : e.benchmark_note ?? DASH],
    ],
    streams: e.source_streams.map((s) => ({
      id: s.id,
      cls: CLASS_LABEL[s.class] ?? s.class,
      co2e: fixed(s.emissions_t, 0),
      share: fixed(s.share_pct, 2),
      uncertainty: s.uncertainty_pct === null ? DASH : `± ${fixed(s.uncertainty_pct, 2)}`,
      tier: s.tier_required === null ? "none needed" : `${s.tier_achieved ?? DASH} of ${s.tier_required}`,
      factors: `${s.factor_origin === "analysis" ? "analysis" : "default"}, tier ${s.factor_tier_achieved}${s.factor_tier_required === null ? "" : ` of ${s.factor_tier_required === 2 ? "2a/2b" : s.factor_tier_required}`}`,
    })),
    shortfalls: f.flags.map((x) => x.message),
    cbam: [
      ["Good", `${c.good.description}, CN ${c.good.cn_code} (unconfirmed); ${c.good.route.toLowerCase()}`],
      ["Ammonia produced", `${fixed(c.production_t, 1)} t NH3`],
      ["Direct embedded", `${fixed(c.see_direct_t_per_t, 4)} t CO2e/t NH3 (${fixed(c.direct_t, 0)} t CO2e; CO2 to urea counted, storage deducted)`],
      ["Indirect embedded", c.see_indirect_t_per_t === null ? "not computed: a month's electricity has no emission factor" : `${fixed(c.see_indirect_t_per_t, 4)} t CO2e/t NH3 (${fixed(c.electricity_mwh, 0)} MWh × factor)`],
      ["Embedded, total", c.see_total_t_per_t === null ? DASH : `${fixed(c.see_total_t_per_t, 4)} t CO2e/t NH3`],
    ],
    report: {
      streams: f.annualReport.streams.map((s) => ({
        id: s.id,
        activity: s.activity.map((a) => `${fixed(a.quantity, 0)} ${a.unit}`).join("; "),
        ncv: s.ncv_gj_per_t === null ? DASH : fixed(s.ncv_gj_per_t, 3),
        ef: s.emission_factor_t_co2_per_tj === null ? DASH : fixed(s.emission_factor_t_co2_per_tj, 2),
        oxidation: s.oxidation_factor,
        tiers: `activity ${s.tier_activity}; factors ${s.tier_factors}`,
        co2e: fixed(s.co2e_t, 1),
      })),
      transfers: f.annualReport.transfers.map((t) => `${t.id}: ${fixed(t.co2_t, 1)} t CO2 to ${t.destination}, ${t.deducted_under_eu_rules ? "deducted" : "not deducted"} under Art 49; receiver ${t.receiver}`),
      gaps: f.annualReport.data_gaps,
    },
    notes: [...e.notes, "Tiers: Annex II Table 1 (gaseous fuels): tier 4 ±1.5 %, 3 ±2.5 %, 2 ±5 %, 1 ±7.5 % over the year; the calculation-factor tier rule is unconfirmed.", "CBAM: Reg. (EU) 2023/956 Annex IV; the CN code, fertilisers' indirect emissions and the definitive period's rules are unconfirmed."],
  };
}
