import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { HistoryList, SignedPdfList } from "@/components/lifecycle/history-list";
import { LifecyclePanel } from "@/components/lifecycle/lifecycle-panel";
import { BalanceSection } from "@/components/review/balance-section";
import { Section } from "@/components/review/figure-table";
import { EmissionsSections } from "@/components/review/statement-sections";
import { EmptyState } from "@/components/ui/empty-state";
import { formatDateTime, monthLabel } from "@/reports/format";
import { Notice } from "@/components/ui/status";
import { link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { can, requirePageActor } from "@/lib/auth/guard";
import { docStreamIds, loadReview } from "@/lib/lifecycle/review-data";
import { plainIssue } from "@/lib/plain-path";
import { RULES, TRANSITIONS, type TransitionName } from "@/lib/lifecycle/transitions";
import { STATE_LABELS } from "@/lib/month-states";
import { EMISSIONS_METHOD_CHOICES, FACTOR_SET_CHOICES, GWP_CHOICES, emissionsMethodLabel, factorSetLabel, gwpLabel } from "@/lib/ledger/method-labels";
import { isFrozenState } from "@/lib/ledger/month-runs";
import { isMonthKey, monthTiming } from "@/lib/period";
import { MethodPanel } from "@/components/review/method-panel";
import { MonthTimingNotice } from "@/components/month/month-timing";
import { explainFlagAction, setMonthMethodAction, transitionAction } from "./actions";

type Params = { siteId: string; month: string };

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { month } = await params;
  return { title: isMonthKey(month) ? `Review ${monthLabel(month)}` : "Review" };
}

/**
 * The month as the officer and signatory judge it: balances, reconciliation, emissions and
 * method from the engine run of the stored figures, and the life-cycle panel beside them.
 * Every member may read it; the panel offers only what the reader's roles allow.
 */
export default async function ReviewPage({ params, searchParams }: { params: Promise<Params>; searchParams: Promise<{ done?: string; notified?: string }> }) {
  const { siteId, month: period } = await params;
  const { done, notified } = await searchParams;
  const actor = await requirePageActor();
  if (!isMonthKey(period)) notFound();
  const data = await loadReview(getDb(), actor, siteId, period);
  if (!data) notFound();
  const { site } = data;
  const monthHref = `/sites/${site.id}/months/${period}`;
  const timing = monthTiming(period);
  const frozen = data.run?.ok ? data.run.frozen : null;
  const method = frozen ? (data.run!.document.method as { emissions: string; factor_set: string; gwp: string }) : data.month ? { emissions: data.month.emissionsMethod, factor_set: data.month.factorSet, gwp: data.month.gwp } : null;
  const methodLock = !data.month
    ? null
    : isFrozenState(data.month.state)
      ? `Frozen with revision ${data.month.revision}: the month is ${STATE_LABELS[data.month.state]}. Returning it or reopening it lets the method be chosen again.`
      : !can(actor, "month:method")
        ? "An environmental officer or an administrator chooses the month's method while it is Open or Balanced."
        : null;

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="text-sm text-ink-soft">
            {site.name} <span className="num text-ink-faint">{site.code}</span> ·{" "}
            <Link className={link} href={monthHref}>
              figures of the month
            </Link>
          </p>
          <h1 className={pageTitle}>Review and sign-off: {monthLabel(period)}</h1>
        </div>
      </div>

      {data.month && done && (TRANSITIONS as readonly string[]).includes(done) ? (
        <Notice tone="ok" title={`Done: the month is now ${STATE_LABELS[data.month.state]} (revision ${data.month.revision}).`}>
          You {RULES[done as TransitionName].done}
          {Number(notified) > 0 ? `; ${notified} ${Number(notified) === 1 ? "person was" : "people were"} notified by e-mail` : ""}.
        </Notice>
      ) : null}

      {timing.kind !== "ended" ? <MonthTimingNotice period={period} timing={timing} coveredThrough={data.month?.coveredThrough ?? null} /> : null}
      {frozen ? (
        <Notice tone="locked" title={`Frozen record of revision ${data.month!.revision}`}>
          Everything on this page comes from the record frozen on {formatDateTime(frozen.frozenAt)} when the month was sent for sign-off (computed by{" "}
          {frozen.engineVersion}); later changes to the site&rsquo;s settings do not reach it. Plant-month document SHA-256{" "}
          <span className="num break-all">{frozen.documentSha256}</span>; result document SHA-256 <span className="num break-all">{frozen.resultSha256}</span>.
        </Notice>
      ) : null}

      {data.overdue?.length ? (
        <Notice tone="warn" title="Meter calibration overdue in this month">
          <ul className="list-disc pl-5">
            {data.overdue.map((o) => (
              <li key={o.meter.key}>
                {o.meter.name}
                {o.meter.meterTag ? <span className="num"> ({o.meter.meterTag})</span> : null}: calibrated {o.meter.calibratedOn}, due {o.dueOn} by the site&rsquo;s{" "}
                {o.meter.calibrationIntervalMonths}-month interval. The statement marks it.
              </li>
            ))}
          </ul>
        </Notice>
      ) : null}

      {!data.month ? (
        <EmptyState title="Nothing entered for this month yet">
          <p>The review starts once a process engineer has entered or imported the month&rsquo;s figures.</p>
        </EmptyState>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
          <div className="min-w-0 space-y-6">
            {data.run && !data.run.ok ? (
              <Notice tone="fault" title="The stored figures do not compute">
                <ul className="list-disc pl-5">
                  {data.run.issues.map((i) => (
                    <li key={i.path}>{plainIssue(i.path, i.reason, docStreamIds(data.run!.document))}</li>
                  ))}
                </ul>
              </Notice>
            ) : null}
            {data.run?.ok && data.model ? (
              <>
                {data.month.balanceNote ? (
                  <Notice tone="info" title="Engineer's note on the balance">
                    {data.month.balanceNote}
                  </Notice>
                ) : null}
                <BalanceSection
                  doc={data.run.doc}
                  model={data.model}
                  tolerance={frozen?.context.site.closureTolerancePct ?? site.closureTolerancePct}
                  streams={data.run.bundle.streams.map((s) => ({ key: s.key, name: s.name, unit: s.unit, meterTag: s.meterTag }))}
                />
                <EmissionsSections
                  m={data.model}
                  explain={!isFrozenState(data.month.state) && can(actor, "month:explain") ? { siteId: site.id, period, action: explainFlagAction } : undefined}
                />
              </>
            ) : null}
          </div>
          <aside className="space-y-6">
            {method ? (
              <MethodPanel
                siteId={site.id}
                period={period}
                version={data.month.version}
                current={{ emissions: emissionsMethodLabel(method.emissions), factorSet: factorSetLabel(method.factor_set), gwp: gwpLabel(method.gwp) }}
                choices={{ emissions: EMISSIONS_METHOD_CHOICES, factorSet: FACTOR_SET_CHOICES, gwp: GWP_CHOICES }}
                lockedBecause={methodLock}
                action={setMonthMethodAction}
              />
            ) : null}
            <LifecyclePanel
              roles={actor.roles}
              state={data.month.state}
              revision={data.month.revision}
              version={data.month.version}
              siteId={site.id}
              period={period}
              pre={data.pre}
              action={transitionAction}
              sign={
                data.model
                  ? {
                      previewHref: `/api/v1/sites/${site.id}/months/${period}/statement-preview`,
                      declaration: data.model.signOff.declaration,
                      unconfirmed: data.model.unconfirmed,
                    }
                  : undefined
              }
            />
            <Section id="signed-pdfs" title="Signed statements">
              <SignedPdfList statements={data.statements} />
            </Section>
            <Section id="history" title="History">
              <HistoryList items={data.events} />
            </Section>
          </aside>
        </div>
      )}
    </div>
  );
}
