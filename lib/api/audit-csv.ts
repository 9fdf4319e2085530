import { csvLine, type CsvValue } from "@/lib/csv";
import type { AuditTrailFilter, AuditTrailRow } from "@/db/queries/audit-trail";
import type { AuditFilterInput } from "./audit-filter";

/** URL filter → query filter: dates are whole UTC days, `to` inclusive. */
export function trailFilter(f: AuditFilterInput): AuditTrailFilter {
  const before = f.to ? new Date(Date.parse(`${f.to}T00:00:00Z`) + 86_400_000) : undefined;
  return { siteId: f.site, entity: f.entity, channel: f.channel, actor: f.actor, from: f.from ? new Date(`${f.from}T00:00:00Z`) : undefined, before };
}

/**
 * The trail as CSV. The last five columns carry what the hash chain covers that the readable
 * columns do not name exactly (ids), and the chain itself, so a verifier can recompute each
 * event's hash offline (lib/audit/chain.ts: SHA-256 of RFC 8785 canonical JSON) and check the links.
 */
export const AUDIT_CSV_HEADER = ["id", "at_utc", "site", "actor", "channel", "action", "entity", "entity_id", "reason", "before_json", "after_json", "organisation_id", "site_id", "actor_user_id", "prev_hash", "hash"];

export function auditCsvLine(r: AuditTrailRow): string {
  return csvLine([r.id, r.at, r.siteName ?? r.siteId, r.actorLabel, r.channel, r.action, r.entity, r.entityId, r.reason, r.before as CsvValue, r.after as CsvValue,
    r.organisationId, r.siteId, r.actorUserId, r.prevHash, r.hash]);
}
