import { sql } from "drizzle-orm";
import { createDb, type Db } from "@/db/client";

let db: Db | null = null;

/** The test database as the app's own role sees it (DATABASE_URL, set by scripts/test.sh). */
export function testDb(): Db {
  if (!process.env.DATABASE_URL) {
    throw new Error("DATABASE_URL is not set: run integration tests through `npm test` (scripts/test.sh)");
  }
  db ??= createDb(process.env.DATABASE_URL, 4);
  return db;
}

export async function closeTestDb(): Promise<void> {
  await db?.$client.end();
  db = null;
}

/**
 * Runs `fn` in a transaction marked as the life cycle's (the transaction-local setting the
 * frozen-month triggers check), for fixtures that must start a month in a given state. Only tests
 * use this; the app goes through lib/lifecycle.
 */
export async function asLifecycle<T>(fn: (tx: Parameters<Parameters<Db["transaction"]>[0]>[0]) => Promise<T>): Promise<T> {
  return testDb().transaction(async (tx) => {
    await tx.execute(sql`select set_config('synledger.lifecycle', 'on', true)`);
    return fn(tx);
  });
}
