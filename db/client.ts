import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";

export type Db = NodePgDatabase<typeof schema> & { $client: Pool };
/** A transaction handle, usable wherever a `Db` is. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

/** One pool per process. Scripts and tests call this; the app uses the singleton in db/index.ts. */
export function createDb(url: string, max = Number(process.env.DB_POOL_MAX ?? 10)): Db {
  if (!url) throw new Error("DATABASE_URL is not set: npm start sets it, or point it at your PostgreSQL");
  const pool = new Pool({ connectionString: url, max, idleTimeoutMillis: 30_000 });
  // A dropped connection (server restart) must not crash the process; the pool reconnects.
  pool.on("error", (err) => console.error("[db] idle client error:", err.message));
  // The pool listens only while a client is idle; one checked out for a transaction that is
  // waiting between queries (an import reporting progress) would otherwise raise an uncaught
  // exception when the server goes away. The transaction's next query fails and rolls back.
  pool.on("connect", (client) => client.on("error", (err) => console.error("[db] connection lost:", err.message)));
  return drizzle(pool, { schema }) as Db;
}
