import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { TrendCharts } from "@/components/charts/trend-charts";
import { SiteViewHeader } from "@/components/overview/site-view-header";
import { EmptyState } from "@/components/ui/empty-state";
import { getDb } from "@/db";
import { yearsOfSite } from "@/db/queries/overview";
import { findSite } from "@/db/queries/sites";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Trends" };

type Props = { params: Promise<{ siteId: string }>; searchParams: Promise<{ year?: string }> };

/**
 * A site's year month by month. The page only picks the site and year on the server; the charts
 * fetch the series from the API themselves, so they can refresh without reloading the page.
 */
export default async function TrendsPage({ params, searchParams }: Props) {
  const [{ siteId }, { year: asked }] = await Promise.all([params, searchParams]);
  const actor = await requirePageActor();
  const db = getDb();
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) notFound();
  const years = await yearsOfSite(db, site.id);
  const year = asked && years.includes(asked) ? asked : (years[0] ?? null);

  return (
    <div className="space-y-5">
      <SiteViewHeader
        site={site}
        title={year ? `Trends ${year}` : "Trends"}
        current="trends"
        year={year}
        years={years}
        yearHref={(y) => `/sites/${site.id}/trends?year=${y}`}
      />
      {year ? (
        <TrendCharts siteId={site.id} year={year} />
      ) : (
        <EmptyState title="No months yet">
          <p>Trends appear once months of {site.name} have been entered.</p>
        </EmptyState>
      )}
    </div>
  );
}
