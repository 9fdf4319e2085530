import { and, eq, gt, or, sql } from "drizzle-orm";
import { SIGN_IN_WINDOW_MINUTES, type FailureCounts } from "@/lib/auth/sign-in-policy";
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

export async function recordSignInAttempt(db: Db, email: string, ip: string, succeeded: boolean) {
  await db.insert(signInAttempts).values({ email: email.trim().toLowerCase(), ip, succeeded });
}

/** Failed attempts within the window: this account from this address, this address, this account. */
export async function signInFailureCounts(db: Db, email: string, ip: string): Promise<FailureCounts & { addresses: string[] }> {
  const since = new Date(Date.now() - SIGN_IN_WINDOW_MINUTES * 60_000);
  const e = email.trim().toLowerCase();
  const [row] = await db
    .select({
      accountAndAddress: sql<number>`count(*) filter (where ${signInAttempts.email} = ${e} and ${signInAttempts.ip} = ${ip})`.mapWith(Number),
      address: sql<number>`count(*) filter (where ${signInAttempts.ip} = ${ip})`.mapWith(Number),
      account: sql<number>`count(*) filter (where ${signInAttempts.email} = ${e})`.mapWith(Number),
      addresses: sql<string[]>`coalesce(array_agg(distinct ${signInAttempts.ip}) filter (where ${signInAttempts.email} = ${e}), '{}')`,
    })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since), or(eq(signInAttempts.email, e), eq(signInAttempts.ip, ip))));
  return { accountAndAddress: row.accountAndAddress, address: row.address, account: row.account, addresses: row.addresses ?? [] };
}
