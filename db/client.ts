import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";
import { env } from "../lib/env";

export type Db = NodePgDatabase<typeof schema> & { $client: Pool };
/** A transaction handle, usable wherever a `Db` is. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

/**
 * A managed PostgreSQL over TLS: DATABASE_CA_FILE names the CA that signed the server's
 * certificate; the URL then gets sslmode=verify-full (the certificate must chain to that CA and
 * name the host) unless it states an sslmode of its own. A URL may also carry sslmode and
 * sslrootcert itself, as libpq's do.
 */
export function withTls(url: string, caFile = env().DATABASE_CA_FILE): string {
  if (!caFile) return url;
  const u = new URL(url);
  if (!u.searchParams.has("sslmode")) u.searchParams.set("sslmode", "verify-full");
  if (!u.searchParams.has("sslrootcert")) u.searchParams.set("sslrootcert", caFile);
  return u.toString();
}


/** One pool per process (DB_POOL_MAX connections, default 10). Scripts and tests call this; the app uses the singleton in db/index.ts. */
export function createDb(url: string, max = env().DB_POOL_MAX): Db {
  if (!url) throw new Error("DATABASE_URL is not set: npm start sets it, or point it at your PostgreSQL");
  const pool = new Pool({
    connectionString: withTls(url),
    max,
    idleTimeoutMillis: 30_000,
    // Server-side limits per connection, ms: a runaway statement or a transaction left open ends instead of holding locks.
    statement_timeout: env().DB_STATEMENT_TIMEOUT_MS,
    idle_in_transaction_session_timeout: env().DB_IDLE_IN_TRANSACTION_MS,
  });
  // A dropped connection (server restart) must not crash the process; the pool reconnects.
  pool.on("error", (err) => console.error("[db] idle client error:", err.message));
  // The pool listens only while a client is idle; one checked out for a transaction that is
  // waiting between queries (an import reporting progress) would otherwise raise an uncaught
  // exception when the server goes away. The transaction's next query fails and rolls back.
  pool.on("connect", (client) => client.on("error", (err) => console.error("[db] connection lost:", err.message)));
  return drizzle(pool, { schema }) as Db;
}
