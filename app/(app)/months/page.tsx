import type { Metadata } from "next";
import { LedgerGrid } from "@/components/ledger/ledger-grid";
import { EmptyState } from "@/components/ui/empty-state";
import { pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { requirePageActor } from "@/lib/auth/guard";
import { ledgerRows } from "@/lib/ledger/ledger-rows";

export const metadata: Metadata = { title: "Monthly ledger" };

/** Every site's running month and the twelve before it, as a grid a plant team works from. */
export default async function MonthsPage() {
  const actor = await requirePageActor();
  const { rows } = await ledgerRows(getDb(), actor.organisationId);
  const sites = [...new Map(rows.map((r) => [r.siteId, { id: r.siteId, name: r.siteName }])).values()];

  return (
    <div className="space-y-5">
      <div>
        <h1 className={pageTitle}>Monthly ledger</h1>
        <p className="mt-1 text-ink-soft">The running month and the twelve before it, for every site, newest first. Closures outside the site&rsquo;s tolerance are marked.</p>
      </div>
      {sites.length === 0 ? (
        <EmptyState title="No sites, so no months yet">
          <p>
            Once a site is set up, its months appear here with their state — Open, Balanced, In review, Signed or Submitted —
            and each opens the month&rsquo;s figures, balances and emissions.
          </p>
        </EmptyState>
      ) : (
        <LedgerGrid rows={rows} roles={actor.roles} sites={sites} />
      )}
    </div>
  );
}
