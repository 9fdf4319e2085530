import type { AuditTrailFilter, AuditTrailRow } from "@/db/queries/audit-trail";
import type { AuditFilterInput } from "./audit-filter";

/** URL filter → query filter: dates are whole UTC days, `to` inclusive. */
export function trailFilter(f: AuditFilterInput): AuditTrailFilter {
  const before = f.to ? new Date(Date.parse(`${f.to}T00:00:00Z`) + 86_400_000) : undefined;
  return { siteId: f.site, entity: f.entity, channel: f.channel, actor: f.actor, from: f.from ? new Date(`${f.from}T00:00:00Z`) : undefined, before };
}

/**
 * One CSV cell (RFC 4180 quoting). A text cell that a spreadsheet would run as a formula
 * (= + - @ at the start) gets a leading apostrophe: labels and notes are typed by people.
 */
export function csvCell(value: unknown): string {
  if (value === null || value === undefined) return "";
  let s = typeof value === "string" ? value : value instanceof Date ? value.toISOString() : typeof value === "object" ? JSON.stringify(value) : String(value);
  if (typeof value === "string" && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export const AUDIT_CSV_HEADER = ["id", "at_utc", "site", "actor", "channel", "action", "entity", "entity_id", "reason", "before_json", "after_json"];

export function auditCsvLine(r: AuditTrailRow): string {
  return [r.id, r.at, r.siteName ?? r.siteId, r.actorLabel, r.channel, r.action, r.entity, r.entityId, r.reason, r.before, r.after].map(csvCell).join(",");
}
