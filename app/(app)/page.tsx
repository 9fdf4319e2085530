import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState } from "@/components/ui/empty-state";
import { formatMonth, previousMonthKey } from "@/components/ui/format";
import { MonthStateBadge } from "@/components/ui/month-state";
import { link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { listMonthsOfOrganisation, listSites } from "@/db/queries/sites";
import { can, requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Overview" };

/** What each permission means to the reader, in the order the month's work happens. */
const ABILITIES = [
  ["month:enter", "enter and import monthly figures and gas analyses"],
  ["month:balance", "close the carbon, hydrogen and nitrogen balances"],
  ["month:prepare", "prepare emissions statements and send them for signing"],
  ["month:sign", "sign or return statements"],
  ["org:manage-users", "manage users, invitations and sites"],
] as const;

export default async function OverviewPage() {
  const actor = await requirePageActor();
  const db = getDb();
  const month = previousMonthKey();
  const [sites, months] = await Promise.all([listSites(db, actor.organisationId), listMonthsOfOrganisation(db, actor.organisationId, month, month)]);
  const abilities = ABILITIES.filter(([p]) => can(actor, p)).map(([, text]) => text);

  return (
    <div className="space-y-6">
      <div>
        <h1 className={pageTitle}>Overview</h1>
        <p className="mt-1 text-ink-soft">
          {actor.organisationName} · month to close: <span className="num text-ink">{formatMonth(month)}</span>
        </p>
      </div>

      {sites.length === 0 ? (
        <EmptyState title="No sites yet">
          <p>
            Each site of {actor.organisationName} will be listed here with the state of its latest month, the closure of its
            carbon, hydrogen and nitrogen balances and its CO2e intensity per tonne of ammonia.
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
      ) : (
        <section aria-labelledby="sites-heading" className="border border-rule bg-white">
          <h2 id="sites-heading" className="border-b border-rule px-4 py-2.5 text-base font-semibold">
            Sites · {formatMonth(month)}
          </h2>
          <ul className="divide-y divide-rule">
            {sites.map((s) => {
              const m = months.find((row) => row.siteId === s.id);
              return (
                <li key={s.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-2.5">
                  <Link href={`/sites/${s.id}/months/${month}`} className={link}>
                    {s.name} <span className="num text-ink-faint">{s.code}</span>
                  </Link>
                  <MonthStateBadge state={m?.state ?? null} />
                </li>
              );
            })}
          </ul>
        </section>
      )}

      <section aria-labelledby="you-heading" className="max-w-prose">
        <h2 id="you-heading" className="text-base font-semibold">
          Your part
        </h2>
        {abilities.length > 0 ? (
          <p className="mt-1 text-ink-soft">With your roles you can {abilities.join("; ")}. You can read everything of your organisation.</p>
        ) : (
          <p className="mt-1 text-ink-soft">
            Your roles let you read everything of your organisation&rsquo;s sites and download and verify signed statements; you
            cannot change anything.
          </p>
        )}
      </section>
    </div>
  );
}
