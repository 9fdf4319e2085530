import { and, desc, eq, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { monthSnapshots, type MonthSnapshotRow } from "../schema";

export type NewSnapshot = Omit<typeof monthSnapshots.$inferInsert, "id" | "seq" | "createdAt">;

/** Appends a snapshot of a month revision; `seq` counts the times this revision was frozen. */
export async function insertSnapshot(tx: Tx, row: NewSnapshot): Promise<MonthSnapshotRow> {
  const [{ next }] = await tx
    .select({ next: sql<number>`coalesce(max(${monthSnapshots.seq}), 0) + 1`.mapWith(Number) })
    .from(monthSnapshots)
    .where(and(eq(monthSnapshots.monthId, row.monthId), eq(monthSnapshots.revision, row.revision)));
  const [created] = await tx.insert(monthSnapshots).values({ ...row, seq: next }).returning();
  return created;
}

/** The latest snapshot of a month revision (the one a frozen month shows), or null. */
export async function latestSnapshot(db: Db | Tx, monthId: string, revision: number): Promise<MonthSnapshotRow | null> {
  const [row] = await db
    .select()
    .from(monthSnapshots)
    .where(and(eq(monthSnapshots.monthId, monthId), eq(monthSnapshots.revision, revision)))
    .orderBy(desc(monthSnapshots.seq))
    .limit(1);
  return row ?? null;
}

export async function snapshotById(db: Db | Tx, organisationId: string, id: string): Promise<MonthSnapshotRow | null> {
  const [row] = await db
    .select()
    .from(monthSnapshots)
    .where(and(eq(monthSnapshots.id, id), eq(monthSnapshots.organisationId, organisationId)))
    .limit(1);
  return row ?? null;
}
