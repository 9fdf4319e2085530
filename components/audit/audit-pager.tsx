import Link from "next/link";
import { buttonSecondary } from "@/components/ui/styles";
import { auditQuery, type AuditFilterInput } from "@/lib/api/audit-filter";

const nf = new Intl.NumberFormat("en-GB");

/** "Events 51–100 of 1,234" with previous and next pages, keeping the filters. */
export function AuditPager({ filter, total, pageSize }: { filter: AuditFilterInput; total: number; pageSize: number }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = (filter.page - 1) * pageSize + 1;
  const last = Math.min(total, filter.page * pageSize);
  const href = (page: number) => `/audit${auditQuery(filter, page)}`;
  return (
    <nav aria-label="Pages of the audit trail" className="flex flex-wrap items-center justify-between gap-3 text-sm">
      <p className="text-ink-soft">
        {total === 0 ? (
          "No events"
        ) : (
          <>
            Events <span className="num">{nf.format(first)}–{nf.format(last)}</span> of <span className="num">{nf.format(total)}</span>, newest first
          </>
        )}
      </p>
      {pages > 1 ? (
        <div className="flex items-center gap-2">
          {filter.page > 1 ? (
            <Link href={href(filter.page - 1)} className={buttonSecondary} rel="prev">
              ← Newer
            </Link>
          ) : null}
          <span className="num text-ink-soft">
            page {filter.page} of {pages}
          </span>
          {filter.page < pages ? (
            <Link href={href(filter.page + 1)} className={buttonSecondary} rel="next">
              Older →
            </Link>
          ) : null}
        </div>
      ) : null}
    </nav>
  );
}
