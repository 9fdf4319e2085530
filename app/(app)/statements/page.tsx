import type { Metadata } from "next";
import Link from "next/link";
import { FigureTable } from "@/components/review/figure-table";
import { EmptyState } from "@/components/ui/empty-state";
import { MonthStateBadge } from "@/components/ui/month-state";
import { link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { listMonthsOfOrganisation, listSites } from "@/db/queries/sites";
import { listStatements } from "@/db/queries/statements";
import { can, requirePageActor } from "@/lib/auth/guard";
import { monthLabel, utcStamp } from "@/reports/format";

export const metadata: Metadata = { title: "Statements" };

/**
 * The organisation's signed statements (every revision, newest period first) and, above them,
 * where each month of the year stands in the life cycle with a way into its review.
 */
export default async function StatementsPage({ searchParams }: { searchParams: Promise<{ year?: string }> }) {
  const actor = await requirePageActor();
  const db = getDb();
  const { year: y } = await searchParams;
  const year = y && /^\d{4}$/.test(y) ? y : String(new Date().getUTCFullYear() - (new Date().getUTCMonth() === 0 ? 1 : 0));
  const [statements, sites, months] = await Promise.all([
    listStatements(db, { organisationId: actor.organisationId }),
    listSites(db, actor.organisationId),
    listMonthsOfOrganisation(db, actor.organisationId, `${year}-01`, `${year}-12`),
  ]);

  return (
    <div className="space-y-8">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h1 className={pageTitle}>Statements</h1>
        <p className="flex gap-4 text-sm">
          <Link className={link} href="/verify">
            Verify a PDF
          </Link>
          {can(actor, "org:manage-users") ? (
            <Link className={link} href="/settings/signing">
              Signing certificate
            </Link>
          ) : null}
        </p>
      </div>

      <section aria-labelledby="months-heading" className="space-y-2">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="months-heading" className="text-base font-semibold">
            Review and sign-off, {year}
          </h2>
          <p className="text-sm">
            <Link className={link} href={`/statements?year=${Number(year) - 1}`}>
              {Number(year) - 1}
            </Link>{" "}
            ·{" "}
            <Link className={link} href={`/statements?year=${Number(year) + 1}`}>
              {Number(year) + 1}
            </Link>
          </p>
        </div>
        {sites.map((site) => {
          const ofSite = months.filter((m) => m.siteId === site.id).sort((a, b) => a.period.localeCompare(b.period));
          return (
            <div key={site.id} className="border border-rule bg-white px-4 py-3">
              <h3 className="text-sm font-semibold">
                {site.name} <span className="num font-normal text-ink-faint">{site.code}</span>
              </h3>
              {ofSite.length === 0 ? (
                <p className="text-sm text-ink-soft">No months started in {year}.</p>
              ) : (
                <ul className="mt-2 grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-3 lg:grid-cols-4">
                  {ofSite.map((m) => (
                    <li key={m.period} className="flex items-baseline justify-between gap-2">
                      <Link className={link} href={`/sites/${site.id}/months/${m.period}/review`} aria-label={`Review and sign-off, ${site.name}, ${monthLabel(m.period)}`}>
                        {monthLabel(m.period).split(" ")[0]}
                      </Link>
                      <span className="text-xs">
                        <MonthStateBadge state={m.state} /> <span className="num text-ink-faint">r{m.revision}</span>
                      </span>
                    </li>
                  ))}
                </ul>
              )}
            </div>
          );
        })}
      </section>

      <section aria-labelledby="signed-heading" className="space-y-2">
        <h2 id="signed-heading" className="text-base font-semibold">
          Signed statements
        </h2>
        {statements.length === 0 ? (
          <EmptyState title="No statements signed yet">
            <p>
              A statement is signed from a month&rsquo;s review page once an environmental officer has sent it for sign-off. Each signed
              statement is a digitally signed PDF kept unchanged; every revision stays here.
            </p>
          </EmptyState>
        ) : (
          <FigureTable
            caption="Signed statements"
            columns={[
              { title: "Site", cell: (s) => s.siteName },
              {
                title: "Period",
                cell: (s) =>
                  s.kind === "monthly" && s.period ? (
                    <Link className={link} href={`/sites/${s.siteId}/months/${s.period}/review`}>
                      {monthLabel(s.period)}
                    </Link>
                  ) : (
                    `Year ${s.period}`
                  ),
              },
              { title: "Revision", numeric: true, cell: (s) => <span className="num">{s.revision}</span> },
              { title: "Signed by", cell: (s) => `${s.signerName} (${s.signerRole})` },
              { title: "Signed at", cell: (s) => <span className="num whitespace-nowrap">{utcStamp(s.signedAt)}</span> },
              { title: "SHA-256", cell: (s) => <span className="num break-all text-xs text-ink-soft" title={s.sha256}>{s.sha256.slice(0, 16)}…</span> },
              {
                title: "PDF",
                cell: (s) => (
                  <a className={link} href={`/api/v1/statements/${s.id}/pdf`} download aria-label={`Download ${s.siteName} ${s.period} revision ${s.revision}`}>
                    Download
                  </a>
                ),
              },
            ]}
            rows={statements}
          />
        )}
      </section>
    </div>
  );
}
