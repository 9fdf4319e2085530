import { and, asc, arrayContains, eq, ne, sql } from "drizzle-orm";
import type { Role } from "@/lib/auth/roles";
import type { Db, Tx } from "../client";
import { memberships, userSessions, users } from "../schema";

/** Members of an organisation with their roles, by name. */
export async function listMembers(db: Db | Tx, organisationId: string) {
  return db
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      disabled: users.disabled,
      roles: memberships.roles,
      since: memberships.createdAt,
      // Each sign-in is a session row: the newest one is the last sign-in (null: never signed in).
      lastSignIn: sql<Date | null>`(select max(${userSessions.createdAt}) from ${userSessions} where ${userSessions.userId} = ${users.id})`.mapWith((v) => (v === null ? null : new Date(v as string))),
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.organisationId, organisationId))
    .orderBy(asc(users.name));
}

/** One membership, locked for the rest of the transaction so concurrent role edits queue up. */
export async function lockMembership(tx: Tx, organisationId: string, userId: string) {
  const [row] = await tx
    .select({ id: memberships.id, roles: memberships.roles, name: users.name, email: users.email, disabled: users.disabled })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.userId, userId)))
    .for("update", { of: memberships })
    .limit(1);
  return row ?? null;
}

/**
 * Other members who hold the administrator role, locked: two administrators demoting each
 * other at the same moment must not leave the organisation with none.
 */
export async function lockOtherAdministrators(tx: Tx, organisationId: string, exceptUserId: string) {
  return tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(
      and(
        eq(memberships.organisationId, organisationId),
        ne(memberships.userId, exceptUserId),
        arrayContains(memberships.roles, ["administrator"]),
      ),
    )
    .for("update");
}

export async function setMemberRoles(tx: Tx, membershipId: string, roles: Role[]) {
  await tx.update(memberships).set({ roles }).where(eq(memberships.id, membershipId));
}

/** Adds a membership, or merges roles into an existing one (an invitation to a current member). */
export async function grantMembership(tx: Tx, organisationId: string, userId: string, roles: Role[]) {
  const [existing] = await tx
    .select({ id: memberships.id, roles: memberships.roles })
    .from(memberships)
    .where(and(eq(memberships.organisationId, organisationId), eq(memberships.userId, userId)))
    .for("update")
    .limit(1);
  if (!existing) {
    await tx.insert(memberships).values({ organisationId, userId, roles });
    return { before: null, after: roles };
  }
  const merged = [...new Set([...existing.roles, ...roles])] as Role[];
  await tx.update(memberships).set({ roles: merged }).where(eq(memberships.id, existing.id));
  return { before: existing.roles, after: merged };
}

export async function isMemberByEmail(db: Db | Tx, organisationId: string, email: string): Promise<boolean> {
  const rows = await db
    .select({ id: memberships.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organisationId, organisationId), sql`lower(${users.email}) = ${email.trim().toLowerCase()}`))
    .limit(1);
  return rows.length > 0;
}

/** How many organisations a user belongs to: an administrator may disable an account only if it is theirs alone. */
export async function membershipCount(db: Db | Tx, userId: string): Promise<number> {
  const [row] = await db.select({ n: sql<number>`count(*)`.mapWith(Number) }).from(memberships).where(eq(memberships.userId, userId));
  return row.n;
}

export async function setUserDisabled(tx: Tx, userId: string, disabled: boolean) {
  await tx.update(users).set({ disabled }).where(eq(users.id, userId));
}

export async function deleteMembership(tx: Tx, membershipId: string) {
  await tx.delete(memberships).where(eq(memberships.id, membershipId));
}
