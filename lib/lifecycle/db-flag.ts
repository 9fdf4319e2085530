import "server-only";
import { sql } from "drizzle-orm";
import type { Tx } from "@/db/client";

/**
 * Marks the transaction as the life cycle's: the database triggers (migration frozen_months)
 * let only such a transaction move a month's state or revision, change a frozen month, or write a
 * month snapshot. Transaction-local (set_config(..., true)), so it ends with the transaction.
 */
export async function actAsLifecycle(tx: Tx): Promise<void> {
  await tx.execute(sql`select set_config('synledger.lifecycle', 'on', true)`);
}
