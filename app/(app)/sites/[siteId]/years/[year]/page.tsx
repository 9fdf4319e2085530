import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { Section } from "@/components/review/figure-table";
import { AnnualSignForm } from "@/components/overview/annual-sign-form";
import { monthsLabel } from "@/components/overview/attention";
import { RuleSetTable } from "@/components/overview/rule-set-table";
import { ListSkeleton } from "@/components/overview/skeletons";
import { SiteViewHeader } from "@/components/overview/site-view-header";
import { YearByGas, YearBySource, YearIntensities, YearMonths, YearTotals } from "@/components/overview/year-sections";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/status";
import { link } from "@/components/ui/styles";
import { getDb } from "@/db";
import { yearsOfSite } from "@/db/queries/overview";
import { loadSiteYear, seriesOf } from "@/lib/ledger/site-year";
import { listStatements } from "@/db/queries/statements";
import { can, requirePageActor } from "@/lib/auth/guard";
import { isYearKey } from "@/lib/period";
import { monthSourcesOf } from "@/lib/lifecycle/sign-annual";
import { annualReadiness, endedRuns, rollUpRuns, yearBenchmarks, yearBySource, yearEuEtsAndCbam, yearTheoreticalMinimum } from "@/lib/ledger/year";
import { CbamFigures, EuEtsCheck } from "@/components/overview/eu-ets-cbam";
import { KIND_LABELS } from "@/reports/build-model-parts";
import { fixed, monthLabel, small, utcStamp } from "@/reports/format";
import { signAnnualStatementAction } from "./actions";
import { buildAnnualModel } from "@/reports/build-annual-model";

type Params = { siteId: string; year: string };

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  return { title: `Year ${(await params).year}` };
}

/** A site's calendar year: totals with uncertainty, months, sources, rule sets, benchmarks, annual statement. */
export default async function YearPage({ params }: { params: Promise<Params> }) {
  const { siteId, year } = await params;
  const actor = await requirePageActor();
  if (!isYearKey(year)) notFound();
  const db = getDb();
  const y = await loadSiteYear(db, actor.organisationId, siteId, year);
  if (!y) notFound();
  const [years, statements] = await Promise.all([yearsOfSite(db, y.site.id), listStatements(db, { organisationId: actor.organisationId }, { siteId: y.site.id })]);
  const series = seriesOf(y);
  const rollUp = rollUpRuns(y.runs);
  const header = (
    <SiteViewHeader site={y.site} title={`Year ${year}`} current="year" year={year} years={years} yearHref={(v) => `/sites/${y.site.id}/years/${v}`} />
  );
  if (!rollUp) {
    return (
      <div className="space-y-5">
        {header}
        <EmptyState title={`No month of ${year} computes yet`}>
          <p>The year&rsquo;s totals appear once months of {y.site.name} have been entered and compute.</p>
        </EmptyState>
      </div>
    );
  }

  const model = buildAnnualModel({
    organisation: actor.organisationName,
    site: y.site,
    year,
    revision: 1,
    statementRef: "assigned at signing",
    runs: y.runs,
    rollUp,
    benchmarks: yearBenchmarks(endedRuns(y.runs), rollUp),
    theoreticalMin: yearTheoreticalMinimum(endedRuns(y.runs)),
    preparedBy: "from the monthly statements",
    preparedAt: null,
    revisions: [],
    monthSources: await monthSourcesOf(db, actor.organisationId, y),
    signOff: { signer: "—", role: "Signatory", signedAt: null, certificateSubject: "—", certificateFingerprint: "—", verifyAt: "" },
  });
  const monthly = new Map(statements.filter((s) => s.kind === "monthly").map((s) => [`${s.period}#${s.revision}`, s.id]));
  const annual = statements.filter((s) => s.kind === "annual" && s.period === year);
  const ready = annualReadiness(year, y.runs);
  const names = new Map(y.streams.map((s) => [s.key, s.name]));
  const recordedSets = [...new Set(series.months.flatMap((m) => (m.method ? [m.method.factor_set] : [])))];
  const exportBase = `/api/v1/sites/${y.site.id}/years/${year}/export`;
  const euCbam = yearEuEtsAndCbam(year, y.runs);

  return (
    <div className="space-y-7">
      {header}
      <p className="text-sm text-ink-soft">
        Download: <a className={link} href={`${exportBase}?format=csv`}>months (CSV)</a> ·{" "}
        <a className={link} href={`${exportBase}?format=csv&table=sources`}>sources (CSV)</a> ·{" "}
        <a className={link} href={`${exportBase}?format=csv&table=rule-sets`}>factor sets (CSV)</a> ·{" "}
        <a className={link} href={`${exportBase}?format=csv&table=annual-report`}>annual emissions report content (CSV</a>,{" "}
        <a className={link} href={`${exportBase}?format=json&table=annual-report`}>JSON)</a> ·{" "}
        <a className={link} href={`${exportBase}?format=json`}>plant-month files (JSON)</a>
      </p>
      {rollUp.flags.length ? (
        <Notice tone="warn" title="About this year">
          <ul className="list-disc pl-5">{rollUp.flags.map((f) => <li key={f.code}>{f.message}</li>)}</ul>
        </Notice>
      ) : null}
      {series.totals.months_left_out_in_progress.length ? (
        <Notice tone="pending" title="Provisional: a month in progress is left out">
          {series.totals.months_left_out_in_progress.map(monthLabel).join(", ")} has not ended: its figures are shown in the months table but not counted in the
          totals, intensities or uncertainty below, which cover {series.totals.months_included.length} complete{" "}
          {series.totals.months_included.length === 1 ? "month" : "months"}.
        </Notice>
      ) : null}
      <Section id="totals" title={`Totals ${year}`}>
        <YearTotals model={model} series={series} />
      </Section>
      <Section id="months" title="Months">
        <YearMonths
          siteId={y.site.id}
          units={model.units}
          rows={y.runs.map((r, i) => ({ ...model.months[i], period: r.period, state: r.state, statementId: monthly.get(`${r.period}#${r.revision}`) ?? null }))}
        />
      </Section>
      <div className="grid gap-6 lg:grid-cols-2">
        <Section id="sources" title="Emissions by source">
          <YearBySource
            rows={yearBySource(endedRuns(y.runs)).map((r) => ({ id: r.id, name: names.get(r.id) ?? KIND_LABELS[r.kind] ?? r.id, co2: fixed(r.co2_t, 1), ch4: small(r.ch4_t), n2o: small(r.n2o_t), co2e: fixed(r.co2e_t, 1) }))}
          />
        </Section>
        <Section id="gases" title="Emissions by gas">
          <YearByGas model={model} />
        </Section>
      </div>
      <Section id="rule-sets" title="Gross, deducted and net CO2 under each rule set" note="The same stored months that have ended recomputed under each built-in factor set (a month in progress is left out, as in the totals); only the recorded set counts for statements.">
        <Suspense fallback={<ListSkeleton label="Rule sets" />}>
          <RuleSetTable documents={endedRuns(y.runs).map((r) => r.document)} tolerance={y.site.closureTolerancePct} recorded={recordedSets} />
        </Suspense>
      </Section>
      <Section id="intensities" title="Intensity against benchmarks">
        <YearIntensities model={model} />
      </Section>
      {euCbam ? (
        <>
          <Section id="eu-ets" title="EU emissions trading: monitoring check" note="Reg. (EU) 2018/2066 (categories, source streams, tiers) and 2018/2067 (materiality), from the year's ended months.">
            <EuEtsCheck figures={euCbam} />
          </Section>
          <Section id="cbam" title="CBAM embedded emissions" note="Reg. (EU) 2023/956 Annex IV: direct and indirect emissions per tonne of ammonia produced.">
            <CbamFigures figures={euCbam} siteId={y.site.id} from={euCbam.cbam.period.from} to={euCbam.cbam.period.to} />
          </Section>
        </>
      ) : null}
      <Section id="annual" title="Annual statement">
        {annual.length ? (
          <ul className="space-y-1 text-sm">
            {annual.map((s) => (
              <li key={s.id}>
                <a className={link} href={`/api/v1/statements/${s.id}/pdf`}>
                  Annual statement {year}, revision {s.revision} (PDF)
                </a>{" "}
                <span className="text-ink-soft">
                  signed by {s.signerName}, {utcStamp(s.signedAt)} · {s.summary.co2e ?? ""}
                </span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-ink-soft">No annual statement of {year} has been signed.</p>
        )}
        {ready.ready ? (
          <p className="text-sm">All {y.runs.length} months of {year} are Signed or Submitted.</p>
        ) : (
          <p className="text-sm text-ink-soft">
            The annual statement can be signed once every month is Signed or Submitted; waiting for{" "}
            <span className="num">{monthsLabel(ready.waiting)}</span>.
          </p>
        )}
        {ready.ready && can(actor, "month:sign") ? (
          <AnnualSignForm action={signAnnualStatementAction} siteId={y.site.id} year={year} label={annual.length ? "Sign a new revision" : `Sign the annual statement ${year}`} />
        ) : null}
      </Section>
    </div>
  );
}
