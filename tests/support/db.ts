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
