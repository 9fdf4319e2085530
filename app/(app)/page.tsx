import type { Metadata } from "next";
import Link from "next/link";
import { Suspense } from "react";
import { AttentionList } from "@/components/overview/attention-list";
import { CardSkeleton, ListSkeleton } from "@/components/overview/skeletons";
import { SiteYearCard } from "@/components/overview/site-year-card";
import { EmptyState } from "@/components/ui/empty-state";
import { link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { overviewScope } from "@/db/queries/overview";
import { can, requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Overview" };

/**
 * Every site's current year at a glance. "Current" is the latest year that has months, not the
 * calendar year: a ledger being filled in for last year still opens on last year. Each site card
 * and the attention list compute on their own, so a slow site never holds the page.
 */
export default async function OverviewPage() {
  const actor = await requirePageActor();
  const { sites, year } = await overviewScope(getDb(), actor.organisationId);

  return (
    <div className="space-y-6">
      <div>
        <h1 className={pageTitle}>Overview</h1>
        <p className="mt-1 text-ink-soft">
          {actor.organisationName}
          {year ? (
            <>
              {" "}
              · year <span className="num text-ink">{year}</span> (the latest with months) · figures computed from the stored months
            </>
          ) : null}
        </p>
      </div>

      {sites.length === 0 ? (
        <EmptyState title="No sites yet">
          <p>
            Each site of {actor.organisationName} will be listed here with its months by state, the closure of its carbon,
            hydrogen and nitrogen balances and its intensities against the factor set&rsquo;s benchmarks.
          </p>
          <p>
            {can(actor, "site:manage") ? (
              <>
                Set up the first site under{" "}
                <Link href="/settings/sites" className={link}>
                  Settings → Sites and meters
                </Link>
                .
              </>
            ) : (
              "An administrator of your organisation sets up sites; they appear here as soon as one exists."
            )}
          </p>
        </EmptyState>
      ) : !year ? (
        <EmptyState title="No months yet">
          <p>
            The overview fills in once a process engineer enters or imports a month for one of the sites (
            <Link href="/months" className={link}>
              Monthly ledger
            </Link>
            ).
          </p>
        </EmptyState>
      ) : (
        <>
          <div className="space-y-4">
            {sites.map((s) => (
              <Suspense key={s.id} fallback={<CardSkeleton title={s.name} />}>
                <SiteYearCard organisationId={actor.organisationId} site={s} year={year} />
              </Suspense>
            ))}
          </div>
          <section aria-labelledby="attention-heading" className="space-y-2">
            <h2 id="attention-heading" className="text-base font-semibold">
              Waiting for someone in {year}
            </h2>
            <Suspense fallback={<ListSkeleton label="Waiting for someone" />}>
              <AttentionList organisationId={actor.organisationId} sites={sites} year={year} roles={actor.roles} />
            </Suspense>
          </section>
        </>
      )}
    </div>
  );
}
