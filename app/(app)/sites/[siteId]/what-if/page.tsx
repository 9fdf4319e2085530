import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { SiteViewHeader } from "@/components/overview/site-view-header";
import { EmptyState } from "@/components/ui/empty-state";
import { WhatIfPanel } from "@/components/what-if/what-if-panel";
import { getDb } from "@/db";
import { yearsOfSite } from "@/db/queries/overview";
import { loadSiteYear } from "@/lib/ledger/site-year";
import { endedRuns } from "@/lib/ledger/year";
import { findSite } from "@/db/queries/sites";
import { requirePageActor } from "@/lib/auth/guard";
import { EMISSION_METHODS, GWP_SETS } from "@/lib/balance/types";
import { BUILT_IN_FACTOR_SETS } from "@/lib/emissions/registry";
import { METHOD_LABELS } from "@/reports/build-model-parts";

export const metadata: Metadata = { title: "What-if" };

type Props = { params: Promise<{ siteId: string }>; searchParams: Promise<{ year?: string }> };

/**
 * What-if on a copy of a month or a year. The server only reads the stored plant-month
 * documents; every change is computed in the browser, and there is no route that could save it.
 */
export default async function WhatIfPage({ params, searchParams }: Props) {
  const [{ siteId }, { year: asked }] = await Promise.all([params, searchParams]);
  const actor = await requirePageActor();
  const db = getDb();
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) notFound();
  const years = await yearsOfSite(db, site.id);
  const year = asked && years.includes(asked) ? asked : (years[0] ?? null);
  const y = year ? await loadSiteYear(db, actor.organisationId, site.id, year) : null;
  // Complete months only, as the year to date counts them: the running month is provisional.
  const documents = y ? endedRuns(y.runs).filter((r) => r.result).map((r) => r.document) : [];

  return (
    <div className="space-y-5">
      <SiteViewHeader site={site} title={year ? `What-if on ${year}` : "What-if"} current="what-if" year={year} years={years} yearHref={(v) => `/sites/${site.id}/what-if?year=${v}`} />
      {documents.length === 0 ? (
        <EmptyState title="Nothing to try changes on yet">
          <p>What-if works on a copy of months that compute; none of {site.name} does yet.</p>
        </EmptyState>
      ) : (
        <WhatIfPanel
          documents={documents}
          tolerance={site.closureTolerancePct}
          factorSets={BUILT_IN_FACTOR_SETS.map((s) => ({ id: s.id, name: `${s.name} (${s.id})` }))}
          methods={EMISSION_METHODS.map((m) => ({ id: m, name: METHOD_LABELS[m]?.split(" (")[0] ?? m }))}
          gwps={GWP_SETS.map((g) => ({ id: g, name: g }))}
        />
      )}
    </div>
  );
}
