import { and, desc, eq, isNull, ne, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { preparedQuery } from "../prepared";
import { memberships, organisations, userSessions, users } from "../schema";
import { UUID } from "./uuid";

export type SessionEndReason = "signed-out" | "signed-out-everywhere" | "password-changed" | "disabled" | "roles-removed" | "ended-by-holder";

/** Opens the session row a new sign-in's cookie will name. */
export async function openSession(db: Db | Tx, userId: string, address: string, userAgent: string): Promise<string> {
  const [row] = await db
    .insert(userSessions)
    .values({ userId, address: address.slice(0, 100), userAgent: userAgent.slice(0, 300) })
    .returning({ id: userSessions.id });
  return row.id;
}

/** Ends one session (its holder signed out); another user's session id ends nothing. */
export async function endSession(db: Db | Tx, userId: string, sessionId: string, reason: SessionEndReason): Promise<boolean> {
  const rows = await db
    .update(userSessions)
    .set({ endedAt: sql`now()`, endedReason: reason })
    .where(and(eq(userSessions.id, sessionId), eq(userSessions.userId, userId), isNull(userSessions.endedAt)))
    .returning({ id: userSessions.id });
  return rows.length > 0;
}

/** Ends every open session of a user, except `keep` when given; returns how many ended. */
export async function endSessionsOf(db: Db | Tx, userId: string, reason: SessionEndReason, keep?: string): Promise<number> {
  const rows = await db
    .update(userSessions)
    .set({ endedAt: sql`now()`, endedReason: reason })
    .where(and(eq(userSessions.userId, userId), isNull(userSessions.endedAt), keep ? ne(userSessions.id, keep) : undefined))
    .returning({ id: userSessions.id });
  return rows.length;
}

/** Open sessions of a user, most recently used first. */
export async function openSessionsOf(db: Db | Tx, userId: string) {
  return db
    .select({ id: userSessions.id, createdAt: userSessions.createdAt, lastSeenAt: userSessions.lastSeenAt, address: userSessions.address, userAgent: userSessions.userAgent })
    .from(userSessions)
    .where(and(eq(userSessions.userId, userId), isNull(userSessions.endedAt)))
    .orderBy(desc(userSessions.lastSeenAt));
}


/**
 * What the guard needs on every request, in one query: the membership in the active
 * organisation, and whether the account and this very session are still good. Null when any of
 * them is not: no membership, a disabled account, a session ended or never opened.
 */
export async function liveMembership(db: Db | Tx, userId: string, organisationId: string, sessionId: string) {
  if (!UUID.test(userId) || !UUID.test(organisationId) || !UUID.test(sessionId)) return null;
  const [row] = await liveMembershipQuery(db).execute({ userId, organisationId, sessionId });
  return row ?? null;
}

// Run on every request of a signed-in person, so prepared (db/prepared.ts).
const liveMembershipQuery = preparedQuery((db) =>
  db
    .select({ roles: memberships.roles, organisationName: organisations.name, lastSeenAt: userSessions.lastSeenAt })
    .from(memberships)
    .innerJoin(organisations, eq(organisations.id, memberships.organisationId))
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(userSessions, and(eq(userSessions.userId, users.id), eq(userSessions.id, sql.placeholder("sessionId"))))
    .where(
      and(
        eq(memberships.userId, sql.placeholder("userId")),
        eq(memberships.organisationId, sql.placeholder("organisationId")),
        eq(users.disabled, false),
        isNull(userSessions.endedAt),
      ),
    )
    .limit(1)
    .prepare("live_membership"),
);

/** Records use of a session at most every five minutes, so reading a page is not a write each time. */
export async function touchSession(db: Db | Tx, sessionId: string, lastSeenAt: Date): Promise<void> {
  if (Date.now() - lastSeenAt.getTime() < 5 * 60_000) return;
  await db.update(userSessions).set({ lastSeenAt: sql`now()` }).where(eq(userSessions.id, sessionId));
}
