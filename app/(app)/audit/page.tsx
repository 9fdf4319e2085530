import type { Metadata } from "next";
import Link from "next/link";
import { AuditFilters } from "@/components/audit/audit-filters";
import { AuditPager } from "@/components/audit/audit-pager";
import { AuditTable } from "@/components/audit/audit-table";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/status";
import { link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { auditEntities, auditRecordLabels, auditSites, countAudit, searchAudit } from "@/db/queries/audit-trail";
import { AUDIT_PAGE_SIZE, parseAuditFilter } from "@/lib/api/audit-filter";
import { trailFilter } from "@/lib/api/audit-csv";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Audit trail" };

type Search = Record<string, string | string[] | undefined>;

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

/** The organisation's audit trail: filters and page in the URL, before → after per event, CSV of the filtered events. */
export default async function AuditPage({ searchParams }: { searchParams: Promise<Search> }) {
  const actor = await requirePageActor("audit:read");
  const params = await searchParams;
  const db = getDb();
  const parsed = parseAuditFilter(params);
  const [sites, entities] = await Promise.all([auditSites(db, actor.organisationId), auditEntities(db, actor.organisationId)]);
  const values = Object.fromEntries(["site", "entity", "channel", "actor", "from", "to"].map((k) => [k, first(params[k])]));

  let body;
  if (!parsed.ok) {
    body = (
      <Notice tone="fault" title="Some filters are not valid">
        <ul className="list-inside list-disc text-sm">
          {parsed.issues.map((i, n) => (
            <li key={`${i.path}-${n}`}>{i.message}</li>
          ))}
        </ul>
      </Notice>
    );
  } else {
    const f = trailFilter(parsed.filter);
    const [events, total] = await Promise.all([
      searchAudit(db, actor.organisationId, f, { limit: AUDIT_PAGE_SIZE, offset: (parsed.filter.page - 1) * AUDIT_PAGE_SIZE }),
      countAudit(db, actor.organisationId, f),
    ]);
    const records = await auditRecordLabels(db, actor.organisationId, events);
    const filtered = Object.values(values).some(Boolean);
    body =
      events.length === 0 ? (
        <EmptyState title={total > 0 ? `No events on page ${parsed.filter.page}` : filtered ? "No events match these filters" : "No changes recorded yet"}>
          {total > 0 ? (
            <p>
              The filters match <span className="num">{total}</span> events.{" "}
              <Link className={link} href="/audit">
                Back to the newest
              </Link>
              .
            </p>
          ) : filtered ? (
            <p>Widen the date range or clear a filter. Every change to figures, months, sites, users and tokens is recorded.</p>
          ) : (
            <p>Changes to figures, balances, statements, users and sites will appear here as they happen, with before and after values.</p>
          )}
        </EmptyState>
      ) : (
        <div className="space-y-3">
          <AuditPager filter={parsed.filter} total={total} pageSize={AUDIT_PAGE_SIZE} />
          <AuditTable events={events} records={records} />
          <AuditPager filter={parsed.filter} total={total} pageSize={AUDIT_PAGE_SIZE} />
        </div>
      );
  }

  return (
    <div className="space-y-4">
      <div>
        <h1 className={pageTitle}>Audit trail</h1>
        <p className="mt-1 max-w-prose text-ink-soft">
          Every change, who made it, when and through which channel, with the values before and after. Records cannot be edited or deleted,
          by anyone.
        </p>
      </div>
      <AuditFilters values={values} sites={sites} entities={entities} filter={parsed.ok ? parsed.filter : undefined} />
      {body}
    </div>
  );
}
