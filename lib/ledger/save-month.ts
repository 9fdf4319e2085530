import "server-only";
import { and, eq, gt, inArray, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { recordAudit, type Channel } from "@/db/queries/audit";
import { lockMonth } from "@/db/queries/months";
import { findSite } from "@/db/queries/sites";
import { auditEvents, gasAnalyses, months, readings, streams } from "@/db/schema";
import { Dec, HUNDRED, sum } from "@/lib/balance/decimal";
import { SUM_TOLERANCE_PCT } from "@/lib/balance/gas-properties";
import { UNITS_BY_KIND } from "@/lib/balance/schema";
import type { StreamKind } from "@/lib/balance/types";
import type { Unit } from "@/lib/balance/units";
import { HttpError, notFound, quoted, type IssueDetail } from "@/lib/auth/errors";
import { currentMonthKey, isMonthKey } from "@/lib/period";
import { actAsLifecycle } from "@/lib/lifecycle/db-flag";
import { monthFiguresSchema, type MonthFiguresInput } from "@/lib/validations/month";

/** Months in these states are frozen: only the life cycle (reopen) may change them. */
export const READ_ONLY_STATES = ["in_review", "signed", "submitted"] as const;

/** The calendar month now, "YYYY-MM" (UTC): figures of later months cannot exist yet. */
export const currentPeriod = currentMonthKey;

export interface Editor {
  organisationId: string;
  userId: string | null;
  label: string;
  channel: Channel;
}

export interface SaveResult {
  monthId: string;
  version: number;
  changed: number;
}

/**
 * Saves a site-month's readings and analyses in one transaction with optimistic locking: the
 * editor says which version they started from, and a save over a newer version is refused with
 * what changed since (from the audit trail), so nothing anyone typed is silently lost.
 */
interface AnalysisValues {
  components: Record<string, string>;
  sampledOn: string | null;
  laboratory: string | null;
  carbonUncertaintyPct: string | null;
  cvUncertaintyPct: string | null;
  note: string | null;
}
const samePct = (a: string | null, b: string | null) => (a === null || b === null ? a === b : new Dec(a).eq(b));

function sameAnalysis(old: AnalysisValues, next: AnalysisValues): boolean {
  const a = Object.entries(old.components).filter(([, v]) => v !== undefined && v !== "");
  const b = Object.entries(next.components).filter(([, v]) => v !== undefined && v !== "");
  if (a.length !== b.length) return false;
  const byKey = new Map(b);
  if (!a.every(([k, v]) => byKey.has(k) && new Dec(v).eq(byKey.get(k)!))) return false;
  return (
    (old.sampledOn || null) === next.sampledOn &&
    (old.laboratory || null) === next.laboratory &&
    samePct(old.carbonUncertaintyPct, next.carbonUncertaintyPct) &&
    samePct(old.cvUncertaintyPct, next.cvUncertaintyPct) &&
    (old.note || null) === next.note
  );
}

export interface SaveOptions {
  /**
   * Save against the version current when the month's row is locked, not the one the caller
   * read: for a plant system sending one total, which has nothing of anyone else's to
   * overwrite. Deciding it under the lock means concurrent senders queue instead of refusing
   * each other. `expectedVersion` of the input is then ignored.
   */
  againstCurrentVersion?: boolean;
  /** The last day the month's figures cover, when the sender knows it (daily imports); left as it was when absent. */
  coveredThrough?: string | null;
}

export const archivedSiteRefusal = (name: string) =>
  new HttpError(409, "site_archived", `${name} is archived: it takes no new figures. An administrator can restore it under Settings → Sites.`);

export async function saveMonthFigures(db: Db, editor: Editor, siteId: string, period: string, raw: MonthFiguresInput, options: SaveOptions = {}): Promise<SaveResult> {
  if (!isMonthKey(period)) throw new HttpError(400, "invalid_input", `${quoted(period)} is not a month (YYYY-MM).`, [{ path: "month", message: "must be YYYY-MM" }]);
  if (period > currentPeriod()) {
    throw new HttpError(400, "future_month", `${period} has not begun yet; its figures can be entered from its first day.`, [{ path: "month", message: "is a month in the future" }]);
  }
  const input = monthFiguresSchema.parse(raw);
  return db.transaction(async (tx) => {
    const site = await findSite(tx, editor.organisationId, siteId);
    if (!site) throw notFound("The site");
    if (site.archivedAt) throw archivedSiteRefusal(site.name);
    const month = await lockMonth(tx, site, period);
    if ((READ_ONLY_STATES as readonly string[]).includes(month.state)) {
      throw new HttpError(409, "month_read_only", `${period} is ${month.state.replace("_", " ")}: its figures can no longer be edited.`);
    }
    if (!options.againstCurrentVersion && month.version !== input.expectedVersion) {
      const since = await tx
        .select({ actor: auditEvents.actorLabel, at: auditEvents.at, entityId: auditEvents.entityId, before: auditEvents.before, after: auditEvents.after, action: auditEvents.action })
        .from(auditEvents)
        .where(and(eq(auditEvents.entity, "reading"), sql`${auditEvents.after}->>'monthId' = ${month.id}`, gt(sql`(${auditEvents.after}->>'version')::int`, input.expectedVersion)))
        .orderBy(auditEvents.at);
      const issues: IssueDetail[] = since.map((e) => ({
        path: `readings.${(e.after as { stream?: string } | null)?.stream ?? e.entityId}`,
        message: `${e.actor} changed it at ${e.at.toISOString()}: ${(e.before as { quantity?: string } | null)?.quantity ?? "empty"} → ${(e.after as { quantity?: string } | null)?.quantity ?? "removed"}`,
      }));
      throw new HttpError(
        409,
        "version_conflict",
        `Someone saved ${period} after you opened it (version ${month.version}, you started from ${input.expectedVersion}). Reload to see their figures; your entries are still in the form.`,
        issues,
      );
    }

    const siteStreams = await tx.select().from(streams).where(eq(streams.siteId, site.id));
    const byKey = new Map(siteStreams.map((s) => [s.key, s]));
    const issues: IssueDetail[] = [];
    input.readings.forEach((r, i) => {
      const s = byKey.get(r.stream);
      if (!s) issues.push({ path: `readings[${i}].stream`, message: `no stream "${r.stream}" at ${site.name}` });
      else if (!UNITS_BY_KIND[s.kind as StreamKind].includes(r.unit as Unit))
        issues.push({ path: `readings[${i}].unit`, message: `${r.unit} is not a unit for ${s.kind} (use ${UNITS_BY_KIND[s.kind as StreamKind].join(", ")})` });
    });
    input.removeReadings.forEach((k, i) => {
      if (!byKey.has(k)) issues.push({ path: `removeReadings[${i}]`, message: `no stream "${k}" at ${site.name}` });
    });
    input.analyses.forEach((a, i) => {
      const total = sum(Object.values(a.components).map((v) => new Dec(v)));
      if (total.minus(HUNDRED).abs().gt(SUM_TOLERANCE_PCT))
        issues.push({ path: `analyses[${i}].components`, message: `components sum to ${total.toFixed()} mol %, more than ${SUM_TOLERANCE_PCT.toFixed()} from 100` });
    });
    if (issues.length) throw new HttpError(400, "invalid_input", "Some figures need attention; nothing was saved.", issues);

    const version = month.version + 1;
    const existing = await tx.select().from(readings).where(eq(readings.monthId, month.id));
    const current = new Map(existing.map((r) => [r.streamId, r]));
    const audit = (action: string, stream: string, before: unknown, after: unknown) =>
      recordAudit(tx, {
        organisationId: editor.organisationId,
        siteId: site.id,
        actorUserId: editor.userId,
        actorLabel: editor.label,
        channel: editor.channel,
        action,
        entity: "reading",
        entityId: `${period}/${stream}`,
        before,
        after: { monthId: month.id, stream, version, ...(after as object) },
      });

    let changed = 0;
    for (const r of input.readings) {
      const s = byKey.get(r.stream)!;
      const old = current.get(s.id);
      const next = { quantity: new Dec(r.quantity).toFixed(), unit: r.unit, source: r.source, note: r.note || null };
      if (old && new Dec(old.quantity).eq(next.quantity) && old.unit === next.unit && old.source === next.source && (old.note ?? null) === next.note) continue;
      await tx
        .insert(readings)
        .values({ monthId: month.id, streamId: s.id, ...next, updatedBy: editor.userId })
        .onConflictDoUpdate({ target: [readings.monthId, readings.streamId], set: { ...next, updatedBy: editor.userId, updatedAt: new Date() } });
      await audit(old ? "reading.changed" : "reading.added", r.stream, old ? { quantity: old.quantity, unit: old.unit, source: old.source, note: old.note } : null, next);
      changed++;
    }
    const removeIds = input.removeReadings.map((k) => byKey.get(k)!.id).filter((id) => current.has(id));
    if (removeIds.length) {
      await tx.delete(readings).where(and(eq(readings.monthId, month.id), inArray(readings.streamId, removeIds)));
      for (const id of removeIds) {
        const old = current.get(id)!;
        const key = siteStreams.find((s) => s.id === id)!.key;
        await audit("reading.removed", key, { quantity: old.quantity, unit: old.unit }, {});
        changed++;
      }
    }
    for (const a of input.analyses) {
      const components = Object.fromEntries(Object.entries(a.components).map(([c, v]) => [c, new Dec(v).toFixed()]));
      const [old] = await tx.select().from(gasAnalyses).where(and(eq(gasAnalyses.monthId, month.id), eq(gasAnalyses.key, a.key)));
      const values: AnalysisValues = {
        components, sampledOn: a.sampledOn || null, laboratory: a.laboratory || null,
        // Absent keeps what was stored (an import that does not carry it); "" clears it.
        carbonUncertaintyPct: a.carbonUncertaintyPct === undefined ? (old?.carbonUncertaintyPct ?? null) : a.carbonUncertaintyPct || null,
        cvUncertaintyPct: a.cvUncertaintyPct === undefined ? (old?.cvUncertaintyPct ?? null) : a.cvUncertaintyPct || null,
        note: a.note || null,
      };
      // Unchanged when every component has the same value (93.10 = 93.1, in any order) and the
      // sample's date, laboratory and note are the same: a form re-sending it is not a change.
      if (old && sameAnalysis(old, values)) continue;
      await tx
        .insert(gasAnalyses)
        .values({ monthId: month.id, key: a.key, ...values })
        .onConflictDoUpdate({ target: [gasAnalyses.monthId, gasAnalyses.key], set: values });
      await recordAudit(tx, {
        organisationId: editor.organisationId,
        siteId: site.id,
        actorUserId: editor.userId,
        actorLabel: editor.label,
        channel: editor.channel,
        action: old ? "analysis.changed" : "analysis.added",
        entity: "analysis",
        entityId: `${period}/${a.key}`,
        before: old ? { components: old.components, sampledOn: old.sampledOn, laboratory: old.laboratory, carbonUncertaintyPct: old.carbonUncertaintyPct, cvUncertaintyPct: old.cvUncertaintyPct, note: old.note } : null,
        after: { monthId: month.id, version, ...values },
      });
      changed++;
    }
    // Editing figures of a balanced month sends it back to Open: the balance must be closed again.
    const state = month.state === "balanced" && changed > 0 ? "open" : month.state;
    // Sending a balanced month back to Open is a life-cycle rule (edited figures must be balanced again).
    if (state !== month.state) await actAsLifecycle(tx);
    const coveredThrough = options.coveredThrough !== undefined ? options.coveredThrough : month.coveredThrough;
    await tx
      .update(months)
      .set({ version, state, coveredThrough, balanceNote: input.balanceNote ?? month.balanceNote, updatedBy: editor.userId, updatedAt: new Date() })
      .where(eq(months.id, month.id));
    if (state !== month.state) {
      await recordAudit(tx, {
        organisationId: editor.organisationId, siteId: site.id, actorUserId: editor.userId, actorLabel: editor.label, channel: editor.channel,
        action: "month.state", entity: "month", entityId: month.id, before: { state: month.state }, after: { state, version }, reason: "figures changed after balancing",
      });
    }
    return { monthId: month.id, version, changed };
  });
}
