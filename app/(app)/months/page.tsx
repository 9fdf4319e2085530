import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState } from "@/components/ui/empty-state";
import { formatMonth, monthKeysBack, previousMonthKey } from "@/components/ui/format";
import { MonthStateBadge } from "@/components/ui/month-state";
import { link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { listMonthsOfOrganisation, listSites } from "@/db/queries/sites";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Monthly ledger" };

const MONTHS_SHOWN = 12;

/** The last twelve months of every site with their state; each month links to its page. */
export default async function MonthsPage() {
  const actor = await requirePageActor();
  const db = getDb();
  const keys = monthKeysBack(previousMonthKey(), MONTHS_SHOWN);
  const [sites, months] = await Promise.all([
    listSites(db, actor.organisationId),
    listMonthsOfOrganisation(db, actor.organisationId, keys[keys.length - 1], keys[0]),
  ]);

  return (
    <div className="space-y-6">
      <div>
        <h1 className={pageTitle}>Monthly ledger</h1>
        <p className="mt-1 text-ink-soft">The last {MONTHS_SHOWN} calendar months of each site, newest first.</p>
      </div>
      {sites.length === 0 ? (
        <EmptyState title="No sites, so no months yet">
          <p>
            Once a site is set up, its months appear here with their state — Open, Balanced, In review, Signed or Submitted —
            and each opens the month&rsquo;s figures, balances and emissions.
          </p>
        </EmptyState>
      ) : (
        sites.map((s) => (
          <section key={s.id} aria-labelledby={`site-${s.id}`} className="border border-rule bg-white">
            <h2 id={`site-${s.id}`} className="border-b border-rule px-4 py-2.5 text-base font-semibold">
              {s.name} <span className="num text-sm font-normal text-ink-faint">{s.code}</span>
            </h2>
            <table className="w-full text-left text-sm">
              <thead className="sr-only">
                <tr>
                  <th scope="col">Month</th>
                  <th scope="col">State</th>
                  <th scope="col">Revision</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-rule">
                {keys.map((k) => {
                  const m = months.find((row) => row.siteId === s.id && row.period === k);
                  return (
                    <tr key={k}>
                      <td className="px-4 py-1.5">
                        <Link href={`/sites/${s.id}/months/${k}`} className={link}>
                          {formatMonth(k)}
                        </Link>
                      </td>
                      <td className="px-4 py-1.5">
                        <MonthStateBadge state={m?.state ?? null} />
                      </td>
                      <td className="num px-4 py-1.5 text-right text-ink-soft">{m && m.revision > 1 ? `rev. ${m.revision}` : ""}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </section>
        ))
      )}
    </div>
  );
}
