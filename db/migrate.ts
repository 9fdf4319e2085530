/** Applies the committed SQL migrations, then grants the app role what it needs (DML only). */
import { fileURLToPath } from "node:url";
import { sql } from "drizzle-orm";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { createDb } from "./client";
import { env } from "../lib/env";

export async function runMigrations(url: string): Promise<void> {
  const db = createDb(url, 1);
  try {
    await migrate(db, { migrationsFolder: fileURLToPath(new URL("./migrations", import.meta.url)) });
    // When the project runs its own cluster the app connects as synledger_app, which owns
    // nothing: it cannot drop triggers or alter tables, only read and write rows.
    await db.execute(sql`
      DO $$
      BEGIN
        IF EXISTS (SELECT 1 FROM pg_roles WHERE rolname = 'synledger_app') THEN
          GRANT USAGE ON SCHEMA public TO synledger_app;
          GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO synledger_app;
          GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO synledger_app;
        END IF;
      END $$;`);
  } finally {
    await db.$client.end();
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const url = env().MIGRATION_DATABASE_URL ?? env().DATABASE_URL ?? "";
  runMigrations(url)
    .then(() => console.error("[synledger] migrations applied"))
    .catch((err) => {
      console.error("[synledger] migration failed:", err.message);
      process.exit(1);
    });
}
