import { createHash, randomBytes } from "node:crypto";
import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import type { Role } from "@/lib/auth/roles";
import type { Db, Tx } from "../client";
import { invitations, organisations, users } from "../schema";

export const INVITATION_LIFETIME_HOURS = 72;

/** The token goes only into the e-mail; the database keeps its SHA-256, so a leaked table grants nothing. */
export function newInvitationToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashInvitationToken(token) };
}

export function hashInvitationToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export type InvitationStatus = "pending" | "expired" | "accepted" | "revoked";

export function invitationStatus(inv: { acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date }, now = new Date()): InvitationStatus {
  if (inv.acceptedAt) return "accepted";
  if (inv.revokedAt) return "revoked";
  if (inv.expiresAt.getTime() <= now.getTime()) return "expired";
  return "pending";
}

export async function createInvitation(
  tx: Tx,
  values: { organisationId: string; email: string; roles: Role[]; tokenHash: string; invitedBy: string | null; expiresAt: Date },
) {
  const [row] = await tx.insert(invitations).values(values).returning();
  return row;
}

/** Invitations of an organisation, newest first, with the inviter's name as it is now. */
export async function listInvitations(db: Db | Tx, organisationId: string, limit = 50) {
  return db
    .select({
      id: invitations.id,
      email: invitations.email,
      roles: invitations.roles,
      invitedByName: users.name,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
      createdAt: invitations.createdAt,
    })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.organisationId, organisationId))
    .orderBy(desc(invitations.createdAt))
    .limit(limit);
}

/** An open (not used, not revoked, not expired) invitation for the address, if there is one. */
export async function findOpenInvitation(db: Db | Tx, organisationId: string, email: string) {
  const [row] = await db
    .select({ id: invitations.id })
    .from(invitations)
    .where(
      and(
        eq(invitations.organisationId, organisationId),
        sql`lower(${invitations.email}) = ${email.trim().toLowerCase()}`,
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, new Date()),
      ),
    )
    .limit(1);
  return row ?? null;
}

/** One invitation of the organisation, locked so revoking and accepting cannot cross. */
export async function lockInvitation(tx: Tx, organisationId: string, invitationId: string) {
  const [row] = await tx
    .select()
    .from(invitations)
    .where(and(eq(invitations.id, invitationId), eq(invitations.organisationId, organisationId)))
    .for("update")
    .limit(1);
  return row ?? null;
}

export async function revokeInvitation(tx: Tx, invitationId: string, at = new Date()) {
  await tx.update(invitations).set({ revokedAt: at }).where(eq(invitations.id, invitationId));
}

export async function markInvitationAccepted(tx: Tx, invitationId: string, at = new Date()) {
  await tx.update(invitations).set({ acceptedAt: at }).where(eq(invitations.id, invitationId));
}

/**
 * The invitation a token belongs to, with its organisation's name. Pass a transaction and
 * `lock` to hold the row while accepting it (a second click waits, then sees it used).
 */
export async function findInvitationByToken(db: Db | Tx, token: string, lock = false) {
  const query = db
    .select({
      id: invitations.id,
      organisationId: invitations.organisationId,
      organisationName: organisations.name,
      email: invitations.email,
      roles: invitations.roles,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
    })
    .from(invitations)
    .innerJoin(organisations, eq(organisations.id, invitations.organisationId))
    .where(eq(invitations.tokenHash, hashInvitationToken(token)))
    .limit(1);
  const [row] = lock ? await query.for("update", { of: invitations }) : await query;
  return row ?? null;
}
