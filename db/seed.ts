/**
 * Seeds the invented demo organisation (Vellmar Nitrogen Co.): one user per role, two sites with
 * their streams, and twelve months of figures from lib/demo. Idempotent: running it again
 * changes nothing that exists.
 */
import { fileURLToPath } from "node:url";
import { createDb, type Db } from "./client";
import { seedDemo } from "./seed-demo";
import { env } from "../lib/env";

export async function runSeed(db: Db): Promise<void> {
  await seedDemo(db);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const db = createDb(env().DATABASE_URL ?? "", 2);
  runSeed(db)
    .then(() => console.error("[synledger] demo organisation seeded"))
    .catch((err) => {
      console.error("[synledger] seeding failed:", err);
      process.exitCode = 1;
    })
    .finally(() => db.$client.end());
}
