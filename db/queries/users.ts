import { and, count, eq, gt, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { memberships, organisations, signInAttempts, users } from "../schema";

export async function findUserByEmail(db: Db | Tx, email: string) {
  const [row] = await db
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = ${email.trim().toLowerCase()}`)
    .limit(1);
  return row ?? null;
}

/** Memberships of a user with their organisation's name, oldest first. */
export async function membershipsOf(db: Db | Tx, userId: string) {
  return db
    .select({
      organisationId: memberships.organisationId,
      organisationName: organisations.name,
      roles: memberships.roles,
    })
    .from(memberships)
    .innerJoin(organisations, eq(organisations.id, memberships.organisationId))
    .where(eq(memberships.userId, userId))
    .orderBy(memberships.createdAt);
}

export async function membership(db: Db | Tx, userId: string, organisationId: string) {
  const [row] = await db
    .select({ roles: memberships.roles, organisationName: organisations.name })
    .from(memberships)
    .innerJoin(organisations, eq(organisations.id, memberships.organisationId))
    .where(and(eq(memberships.userId, userId), eq(memberships.organisationId, organisationId)))
    .limit(1);
  return row ?? null;
}

export const SIGN_IN_WINDOW_MINUTES = 15;
export const MAX_FAILURES_PER_EMAIL = 5;
export const MAX_FAILURES_PER_IP = 30;

export async function recordSignInAttempt(db: Db, email: string, ip: string, succeeded: boolean) {
  await db.insert(signInAttempts).values({ email: email.trim().toLowerCase(), ip, succeeded });
}

/** True when the e-mail or the address has failed too often within the window. */
export async function signInBlocked(db: Db, email: string, ip: string): Promise<boolean> {
  const since = new Date(Date.now() - SIGN_IN_WINDOW_MINUTES * 60_000);
  const failed = (col: typeof signInAttempts.email | typeof signInAttempts.ip, value: string) =>
    db
      .select({ n: count() })
      .from(signInAttempts)
      .where(and(eq(col, value), eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since)));
  const [[byEmail], [byIp]] = await Promise.all([failed(signInAttempts.email, email.trim().toLowerCase()), failed(signInAttempts.ip, ip)]);
  return byEmail.n >= MAX_FAILURES_PER_EMAIL || byIp.n >= MAX_FAILURES_PER_IP;
}
