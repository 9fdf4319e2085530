import "server-only";
import { lt, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { requestCounts } from "@/db/schema";

/**
 * A fixed one-minute window per purpose and caller address, counted in PostgreSQL
 * (request_counts) so every instance of the app shares it. One statement increments and reads
 * the count atomically; windows that have ended are deleted now and then.
 */
export interface RateVerdict {
  allowed: boolean;
  count: number;
  limit: number;
  /** Whole seconds until the window ends (the Retry-After of a refusal). */
  retryAfterSeconds: number;
}

export const VERIFY_LIMIT = { bucket: "verify", perMinute: 30 } as const;

export async function countRequest(db: Db, bucket: string, address: string, limit: number, now = new Date()): Promise<RateVerdict> {
  const windowStart = new Date(Math.floor(now.getTime() / 60_000) * 60_000);
  const [row] = await db
    .insert(requestCounts)
    .values({ bucket, address, windowStart, count: 1 })
    .onConflictDoUpdate({ target: [requestCounts.bucket, requestCounts.address, requestCounts.windowStart], set: { count: sql`${requestCounts.count} + 1` } })
    .returning({ count: requestCounts.count });
  const count = row?.count ?? 1;
  // Now and then (a first request of a window, one in fifty) ended windows are deleted.
  if (count === 1 && Math.random() < 0.02) await db.delete(requestCounts).where(lt(requestCounts.windowStart, new Date(windowStart.getTime() - 60_000)));
  const retryAfterSeconds = Math.max(1, Math.ceil((windowStart.getTime() + 60_000 - now.getTime()) / 1000));
  return { allowed: count <= limit, count, limit, retryAfterSeconds };
}
