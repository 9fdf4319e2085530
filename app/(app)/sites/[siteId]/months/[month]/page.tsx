import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { EmptyState } from "@/components/ui/empty-state";
import { formatDateTime, formatMonth, isMonthKey } from "@/components/ui/format";
import { MonthStateBadge } from "@/components/ui/month-state";
import { pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { findMonth, findSite } from "@/db/queries/sites";
import { can, requirePageActor } from "@/lib/auth/guard";

type Params = { siteId: string; month: string };

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { month } = await params;
  return { title: isMonthKey(month) ? formatMonth(month) : "Month" };
}

/**
 * One site's month. The site must belong to the signed-in organisation: anything else is a
 * plain 404, so the page never tells whether another organisation's site exists.
 */
export default async function MonthPage({ params }: { params: Promise<Params> }) {
  const { siteId, month } = await params;
  const actor = await requirePageActor();
  if (!isMonthKey(month)) notFound();
  const db = getDb();
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) notFound();
  const record = await findMonth(db, site.id, month);

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="text-sm text-ink-soft">
            {site.name} <span className="num text-ink-faint">{site.code}</span>
          </p>
          <h1 className={pageTitle}>{formatMonth(month)}</h1>
        </div>
        <div className="text-right text-sm">
          <MonthStateBadge state={record?.state ?? null} />
          {record ? (
            <p className="num mt-0.5 text-xs text-ink-soft">
              rev. {record.revision} · changed {formatDateTime(record.updatedAt)}
            </p>
          ) : null}
        </div>
      </div>

      <dl className="grid max-w-3xl grid-cols-2 gap-x-6 gap-y-1 border border-rule bg-white px-4 py-3 text-sm sm:grid-cols-4">
        <div>
          <dt className="text-xs text-ink-soft">Metering reference</dt>
          <dd className="num">{site.meteringReference === "60F" ? "60 °F (scf)" : site.meteringReference === "0C" ? "0 °C (Nm3)" : "15 °C (Sm3)"}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">Closure tolerance</dt>
          <dd className="num">{site.closureTolerancePct} %</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">Emissions method</dt>
          <dd>{site.emissionsMethod}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">Factor set · GWP</dt>
          <dd>
            {site.factorSet} · {site.gwp}
          </dd>
        </div>
      </dl>

      <EmptyState title={record ? "No figures on this page yet" : "Nothing entered for this month yet"}>
        <p>
          This page will hold the month&rsquo;s meter totals and gas analyses, the carbon, hydrogen and nitrogen balances drawn as
          beams around zero with their tolerance band, the meter most likely to be wrong, and the month&rsquo;s CO2, CH4 and N2O
          with the CO2e intensity per tonne of ammonia.
        </p>
        <p>
          {can(actor, "month:enter")
            ? "As a process engineer you will enter or import the figures here."
            : "The process engineers of the site enter the figures; you will see them here as they arrive."}
        </p>
      </EmptyState>
    </div>
  );
}
