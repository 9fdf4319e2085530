import { z } from "zod";
import { blankIsAbsent } from "@/lib/validations/blank";
import { zodIssues, type IssueDetail } from "@/lib/auth/errors";

export const CHANNELS = ["form", "import", "api-token", "system", "seed"] as const;
export const AUDIT_PAGE_SIZE = 50;
const DAY = /^\d{4}-\d{2}-\d{2}$/;

const opt = <T extends z.ZodType>(s: T) => z.preprocess(blankIsAbsent, s.optional());

/** The audit filters as they travel in the URL, shared by the page and the CSV export. */
export const auditFilterSchema = z
  .object({
    site: opt(z.uuid({ error: "site must be one of the organisation's sites" })),
    entity: opt(z.string().trim().max(60, "entity is longer than 60 characters")),
    channel: opt(z.enum(CHANNELS, { error: `channel must be one of: ${CHANNELS.join(", ")}` })),
    actor: opt(z.string().trim().max(200, "actor is longer than 200 characters")),
    from: opt(z.iso.date({ error: "from must be a date YYYY-MM-DD" })),
    to: opt(z.iso.date({ error: "to must be a date YYYY-MM-DD" })),
    page: z.preprocess(blankIsAbsent, z.coerce.number({ error: "page must be a whole number" }).int("page must be a whole number").min(1, "page starts at 1").max(100_000).default(1)),
  });

export type AuditFilterInput = z.output<typeof auditFilterSchema>;

/** Search params (page props or a URL) → the filter, or the issues with their field names. */
export function parseAuditFilter(
  source: URLSearchParams | Record<string, string | string[] | undefined>,
): { ok: true; filter: AuditFilterInput } | { ok: false; issues: IssueDetail[] } {
  const get = (k: string) => {
    const v = source instanceof URLSearchParams ? source.get(k) : source[k];
    return Array.isArray(v) ? v[0] : (v ?? undefined);
  };
  const r = auditFilterSchema.safeParse(Object.fromEntries(["site", "entity", "channel", "actor", "from", "to", "page"].map((k) => [k, get(k)])));
  const issues = r.success ? [] : zodIssues(r.error.issues);
  // Checked beside the schema, not after it, so a bad range is reported together with any other mistake.
  const from = get("from");
  const to = get("to");
  if (from && to && DAY.test(from) && DAY.test(to) && from > to) issues.push({ path: "to", message: "to must not be before from" });
  return r.success && issues.length === 0 ? { ok: true, filter: r.data } : { ok: false, issues };
}

/** The filter back into a query string (without the page unless asked), for links and the CSV. */
export function auditQuery(f: Partial<AuditFilterInput>, page?: number): string {
  const q = new URLSearchParams();
  for (const k of ["site", "entity", "channel", "actor", "from", "to"] as const) if (f[k]) q.set(k, String(f[k]));
  if (page && page > 1) q.set("page", String(page));
  const s = q.toString();
  return s ? `?${s}` : "";
}
