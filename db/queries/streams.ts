import "server-only";
import { and, asc, desc, eq, lt } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { gasAnalyses, months, sites, streams } from "../schema";
import type { StreamValues } from "@/lib/validations/stream";
import { UUID } from "./uuid";


/** All streams of a site (archived ones too) in display order. The site must already be checked. */
export async function listStreams(db: Db | Tx, siteId: string) {
  return db.select().from(streams).where(eq(streams.siteId, siteId)).orderBy(asc(streams.sortOrder), asc(streams.key));
}
export type StreamRecord = typeof streams.$inferSelect;

/** One stream, only if its site belongs to the organisation (otherwise null: "not found"). */
export async function findStream(db: Db | Tx, organisationId: string, siteId: string, streamId: string) {
  if (!UUID.test(siteId) || !UUID.test(streamId)) return null;
  const [row] = await db
    .select({ stream: streams })
    .from(streams)
    .innerJoin(sites, eq(sites.id, streams.siteId))
    .where(and(eq(streams.id, streamId), eq(streams.siteId, siteId), eq(sites.organisationId, organisationId)))
    .limit(1);
  return row?.stream ?? null;
}

/** Same as findStream, with the row locked for the rest of the transaction. */
export async function lockStream(tx: Tx, organisationId: string, siteId: string, streamId: string) {
  const found = await findStream(tx, organisationId, siteId, streamId);
  if (!found) return null;
  const [row] = await tx.select().from(streams).where(eq(streams.id, found.id)).for("update");
  return row ?? null;
}

export async function insertStream(tx: Tx, siteId: string, values: StreamValues) {
  const [row] = await tx.insert(streams).values({ siteId, ...values }).returning();
  return row;
}

export async function updateStream(tx: Tx, streamId: string, values: Partial<StreamValues> & { archivedAt?: Date | null }) {
  const [row] = await tx.update(streams).set(values).where(eq(streams.id, streamId)).returning();
  return row;
}

/** The fields of a stream an audit event shows before and after a change. */
export function streamSnapshot(s: StreamRecord) {
  return {
    key: s.key,
    name: s.name,
    kind: s.kind,
    unit: s.unit,
    analysisKey: s.analysisKey,
    destination: s.destination,
    fate: s.fate,
    uncertaintyPct: s.uncertaintyPct,
    metered: s.metered,
    systematicPct: s.systematicPct,
    indirectFactor: s.indirectFactor,
    meterTag: s.meterTag,
    calibratedOn: s.calibratedOn,
    calibrationIntervalMonths: s.calibrationIntervalMonths,
    sortOrder: s.sortOrder,
    archived: s.archivedAt !== null,
  };
}

/**
 * The latest analyses entered before `period` at this site: offered in the month form so a new
 * month's composition can start from last month's instead of from an empty table.
 */
export async function previousAnalyses(db: Db | Tx, siteId: string, period: string) {
  const [prev] = await db
    .select({ id: months.id, period: months.period })
    .from(months)
    .innerJoin(gasAnalyses, eq(gasAnalyses.monthId, months.id))
    .where(and(eq(months.siteId, siteId), lt(months.period, period)))
    .orderBy(desc(months.period))
    .limit(1);
  if (!prev) return null;
  const rows = await db.select().from(gasAnalyses).where(eq(gasAnalyses.monthId, prev.id)).orderBy(asc(gasAnalyses.key));
  return { period: prev.period, analyses: rows.map((a) => ({ key: a.key, components: a.components })) };
}
