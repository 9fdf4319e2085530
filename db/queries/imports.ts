import "server-only";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { importBatches, importMappings, months, readings, streams, users } from "../schema";
import type { ImportStream } from "@/lib/import/types";

/** The site's streams as the import validator sees them (archived ones too, to say so by name). */
export async function importStreams(db: Db | Tx, siteId: string): Promise<ImportStream[]> {
  const rows = await db.select().from(streams).where(eq(streams.siteId, siteId)).orderBy(asc(streams.sortOrder), asc(streams.key));
  return rows.map((s) => ({
    key: s.key,
    name: s.name,
    kind: s.kind,
    unit: s.unit,
    meterTag: s.meterTag,
    analysisKey: s.analysisKey,
    archived: s.archivedAt !== null,
  }));
}

export async function listMappings(db: Db | Tx, siteId: string) {
  return db
    .select({ id: importMappings.id, name: importMappings.name, mapping: importMappings.mapping, updatedAt: importMappings.updatedAt })
    .from(importMappings)
    .where(eq(importMappings.siteId, siteId))
    .orderBy(desc(importMappings.updatedAt));
}

/** Saved under its name: using a name again replaces that layout, so the list stays short. */
export async function saveMapping(tx: Db | Tx, siteId: string, name: string, mapping: unknown) {
  await tx
    .insert(importMappings)
    .values({ siteId, name, mapping })
    .onConflictDoUpdate({ target: [importMappings.siteId, importMappings.name], set: { mapping, updatedAt: new Date() } });
}

const batchColumns = {
  id: importBatches.id,
  fileName: importBatches.fileName,
  fileSha256: importBatches.fileSha256,
  rowCount: importBatches.rowCount,
  summary: importBatches.summary,
  importedAt: importBatches.importedAt,
  importedBy: users.name,
};

/** The first import of this exact file at this site, if any: the one a refusal should date. */
export async function firstBatchOfFile(db: Db | Tx, siteId: string, sha256: string) {
  const [row] = await db
    .select(batchColumns)
    .from(importBatches)
    .leftJoin(users, eq(users.id, importBatches.importedBy))
    .where(and(eq(importBatches.siteId, siteId), eq(importBatches.fileSha256, sha256)))
    .orderBy(asc(importBatches.importedAt))
    .limit(1);
  return row ?? null;
}

export async function listBatches(db: Db | Tx, siteId: string, limit = 10) {
  return db
    .select(batchColumns)
    .from(importBatches)
    .leftJoin(users, eq(users.id, importBatches.importedBy))
    .where(eq(importBatches.siteId, siteId))
    .orderBy(desc(importBatches.importedAt))
    .limit(limit);
}

export async function insertBatch(tx: Tx, values: typeof importBatches.$inferInsert) {
  const [row] = await tx.insert(importBatches).values(values).returning({ id: importBatches.id, importedAt: importBatches.importedAt });
  return row;
}

/** State of each listed month of the site that exists, and its current readings by stream key. */
export async function monthsWithReadings(db: Db | Tx, siteId: string, periods: string[]) {
  if (periods.length === 0) return [];
  const ms = await db
    .select({ id: months.id, period: months.period, state: months.state, version: months.version })
    .from(months)
    .where(and(eq(months.siteId, siteId), inArray(months.period, periods)));
  if (ms.length === 0) return [];
  const rs = await db
    .select({ monthId: readings.monthId, stream: streams.key, quantity: readings.quantity, unit: readings.unit })
    .from(readings)
    .innerJoin(streams, eq(streams.id, readings.streamId))
    .where(inArray(readings.monthId, ms.map((m) => m.id)));
  return ms.map((m) => ({ ...m, readings: rs.filter((r) => r.monthId === m.id) }));
}
