import { getDb } from "@/db";
import { countAudit, searchAudit } from "@/db/queries/audit-trail";
import { HttpError } from "@/lib/auth/errors";
import { parseAuditFilter } from "@/lib/api/audit-filter";
import { AUDIT_CSV_HEADER, auditCsvLine, trailFilter } from "@/lib/api/audit-csv";
import { v1Route } from "@/lib/api/route";

/** More rows than this are refused rather than cut off: a silently shortened trail would mislead a verifier. */
const MAX_ROWS = 50_000;
const BATCH = 2_000;

/** GET /api/v1/audit/export?site=&entity=&channel=&actor=&from=&to=: the filtered audit trail as CSV. */
export const GET = v1Route({ permission: "audit:read", what: "read the audit trail" }, async (req, caller) => {
  const parsed = parseAuditFilter(new URL(req.url).searchParams);
  if (!parsed.ok) throw new HttpError(400, "invalid_input", "Some filters are not valid.", parsed.issues);
  const filter = trailFilter(parsed.filter);
  // One snapshot for the count and every batch, so events written meanwhile neither shift nor repeat rows.
  const lines = await getDb().transaction(
    async (tx) => {
      const total = await countAudit(tx, caller.organisationId, filter);
      if (total > MAX_ROWS) {
        throw new HttpError(400, "too_many_rows", `The filter matches ${total} events; an export holds at most ${MAX_ROWS}. Narrow the date range or choose a site.`, [{ path: "from", message: "narrow the date range" }]);
      }
      const out = [AUDIT_CSV_HEADER.join(",")];
      for (let offset = 0; offset < total; offset += BATCH) {
        const rows = await searchAudit(tx, caller.organisationId, filter, { limit: BATCH, offset });
        for (const r of rows) out.push(auditCsvLine(r));
      }
      return out;
    },
    { isolationLevel: "repeatable read", accessMode: "read only" },
  );
  const day = new Date().toISOString().slice(0, 10);
  // The BOM lets spreadsheet programs read names and arrows as UTF-8.
  return new Response(`\uFEFF${lines.join("\r\n")}\r\n`, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="synledger-audit-${day}.csv"`,
      "Cache-Control": "private, no-store",
    },
  });
});
