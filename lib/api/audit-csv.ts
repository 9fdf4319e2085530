import { csvLine, type CsvValue } from "@/lib/csv";
import type { AuditTrailFilter, AuditTrailRow } from "@/db/queries/audit-trail";
import type { AuditFilterInput } from "./audit-filter";

/** URL filter → query filter: dates are whole UTC days, `to` inclusive. */
export function trailFilter(f: AuditFilterInput): AuditTrailFilter {
  const before = f.to ? new Date(Date.parse(`${f.to}T00:00:00Z`) + 86_400_000) : undefined;
  return { siteId: f.site, entity: f.entity, channel: f.channel, actor: f.actor, from: f.from ? new Date(`${f.from}T00:00:00Z`) : undefined, before };
}

export const AUDIT_CSV_HEADER = ["id", "at_utc", "site", "actor", "channel", "action", "entity", "entity_id", "reason", "before_json", "after_json"];

export function auditCsvLine(r: AuditTrailRow): string {
  return csvLine([r.id, r.at, r.siteName ?? r.siteId, r.actorLabel, r.channel, r.action, r.entity, r.entityId, r.reason, r.before as CsvValue, r.after as CsvValue]);
}
