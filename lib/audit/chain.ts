/**
 * The audit trail as a hash chain per organisation (issue 19): each event carries the SHA-256 of
 * the previous event of its organisation and its own SHA-256 over canonical JSON (RFC 8785) of
 * that link and every stored field. A row edited afterwards, even by the database owner with the
 * append-only trigger disabled, no longer matches its hash; a row removed or inserted breaks the
 * next link. Pure: the database reads and writes are the caller's.
 */
import { canonicalJson, sha256Of } from "@/lib/ledger/freeze";

/** The fields an event is hashed over, as stored. */
export interface ChainFields {
  organisationId: string;
  siteId: string | null;
  actorUserId: string | null;
  actorLabel: string;
  channel: string;
  action: string;
  entity: string;
  entityId: string | null;
  before: unknown;
  after: unknown;
  reason: string | null;
  at: Date;
}

export const CHAIN_VERSION = 1;

/** JSON values as the database keeps them (a jsonb round trip): what is hashed is what is read back. */
const asStored = (v: unknown): unknown => (v === undefined || v === null ? null : JSON.parse(JSON.stringify(v)));

export function eventHash(prevHash: string | null, e: ChainFields): string {
  return sha256Of(
    canonicalJson({
      v: CHAIN_VERSION,
      prev: prevHash,
      organisation_id: e.organisationId,
      site_id: e.siteId,
      actor_user_id: e.actorUserId,
      actor_label: e.actorLabel,
      channel: e.channel,
      action: e.action,
      entity: e.entity,
      entity_id: e.entityId,
      before: asStored(e.before),
      after: asStored(e.after),
      reason: e.reason,
      at: e.at.toISOString(),
    }),
  );
}

export interface ChainRow extends ChainFields {
  id: number;
  prevHash: string | null;
  hash: string | null;
}

export interface ChainBreak {
  organisationId: string;
  id: number;
  at: string;
  reason: string;
}

export interface ChainReport {
  organisations: number;
  events: number;
  /** Events recorded before the chain began (no hash): not covered, and said so. */
  beforeChain: number;
  /** The first broken link of each organisation whose chain is broken. */
  breaks: ChainBreak[];
}

/** Checks rows of one organisation in id order; returns the first broken link, if any. */
export function checkChain(rows: readonly ChainRow[]): { checked: number; beforeChain: number; firstBreak: ChainBreak | null } {
  let prev: string | null = null;
  let started = false;
  let beforeChain = 0;
  for (const r of rows) {
    const where = { organisationId: r.organisationId, id: r.id, at: r.at.toISOString() };
    if (r.hash === null) {
      if (!started) {
        beforeChain++;
        continue;
      }
      return { checked: rows.length, beforeChain, firstBreak: { ...where, reason: "the event carries no hash although the chain had begun" } };
    }
    if (started && r.prevHash !== prev) return { checked: rows.length, beforeChain, firstBreak: { ...where, reason: "its previous-event hash does not name the event before it (an event was removed, inserted or reordered)" } };
    if (!started && r.prevHash !== null) return { checked: rows.length, beforeChain, firstBreak: { ...where, reason: "the first chained event names a previous event that is not there" } };
    if (eventHash(r.prevHash, r) !== r.hash) return { checked: rows.length, beforeChain, firstBreak: { ...where, reason: "its content no longer matches its hash (the row was altered)" } };
    prev = r.hash;
    started = true;
  }
  return { checked: rows.length, beforeChain, firstBreak: null };
}
