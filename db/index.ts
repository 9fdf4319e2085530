import "server-only";
import { createDb, type Db } from "./client";
import { env } from "@/lib/env";

const g = globalThis as unknown as { __synledgerDb?: Db };

/** The app's database client, created on first use and kept across hot reloads in development. */
export function getDb(): Db {
  if (!g.__synledgerDb) g.__synledgerDb = createDb(env().DATABASE_URL ?? "");
  return g.__synledgerDb;
}

export type { Db, Tx } from "./client";
