import type { Db, Tx } from "./client";

/**
 * A hot query built once per database handle and run as a named prepared statement: drizzle
 * skips building the SQL text and PostgreSQL skips parsing and planning it on every request
 * (the guard's membership check went from 0.73 to 0.12 ms). Parameters are `sql.placeholder`s
 * bound at execute time, never text.
 *
 * The statement belongs to the handle it was built on, so a transaction gets one of its own and
 * never runs outside itself. Each PostgreSQL connection prepares a name the first time it runs
 * it; behind PgBouncer this needs transaction pooling with prepared-statement support (1.21 or
 * later, max_prepared_statements > 0), or session pooling.
 */
export function preparedQuery<Q>(build: (db: Db | Tx) => Q): (db: Db | Tx) => Q {
  const byHandle = new WeakMap<object, Q>();
  return (db) => {
    let q = byHandle.get(db);
    if (!q) {
      q = build(db);
      byHandle.set(db, q);
    }
    return q;
  };
}

/**
 * Runs independent reads together on the pool (each on a connection of its own), or one after
 * another inside a transaction, whose single connection takes one query at a time (node-postgres
 * queues overlapping queries on a client, deprecated and gone in pg 9).
 */
export async function readAll<T extends readonly unknown[]>(db: Db | Tx, reads: { [K in keyof T]: () => Promise<T[K]> }): Promise<T> {
  if (isPool(db)) return Promise.all(reads.map((r) => r())) as unknown as Promise<T>;
  const out: unknown[] = [];
  for (const r of reads) out.push(await r());
  return out as unknown as T;
}

// drizzle sets $client (the pool) on the database it makes, not on its transactions.
const isPool = (db: Db | Tx): db is Db => "$client" in db;
