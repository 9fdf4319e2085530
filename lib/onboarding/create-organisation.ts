/**
 * Creates an organisation and a one-time invitation for its first administrator (issue 19): the
 * command line's way in for a new company, since nobody in the app can yet invite anyone there.
 * One transaction with its audit event; the invitation link is returned once and only its
 * SHA-256 is stored, like any invitation. The link is valid for INVITATION_LIFETIME_HOURS.
 */
import { z } from "zod";
import type { Db } from "@/db/client";
import { recordAudit } from "@/db/queries/audit";
import { INVITATION_LIFETIME_HOURS, createInvitation, newInvitationToken } from "@/db/queries/invitations";
import { organisations } from "@/db/schema";

export const createOrganisationInput = z.strictObject({
  name: z.string().trim().min(2, "the organisation's name needs at least 2 characters").max(120, "at most 120 characters"),
  adminEmail: z.email({ error: "the administrator's e-mail must read name@domain" }).max(200).transform((e) => e.toLowerCase()),
});

/** A URL-safe slug from the name, with a short random tail so two companies of one name never clash. */
export function slugOf(name: string, tail: string): string {
  const base = name.normalize("NFKD").replace(/[\u0300-\u036f]/g, "").toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 40) || "org";
  return `${base}-${tail}`;
}

export async function createOrganisation(db: Db, input: z.input<typeof createOrganisationInput>, appUrl: string) {
  const { name, adminEmail } = createOrganisationInput.parse(input);
  const { token, tokenHash } = newInvitationToken();
  const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_HOURS * 3_600_000);
  return db.transaction(async (tx) => {
    const [org] = await tx.insert(organisations).values({ name, slug: slugOf(name, token.slice(0, 6).toLowerCase().replace(/[^a-z0-9]/g, "x")) }).returning();
    const invitation = await createInvitation(tx, { organisationId: org.id, email: adminEmail, roles: ["administrator"], tokenHash, invitedBy: null, expiresAt });
    await recordAudit(tx, {
      organisationId: org.id, actorLabel: "command line (org:create)", channel: "system", action: "organisation.created", entity: "organisation", entityId: org.id,
      after: { name, firstAdministrator: adminEmail, invitation: invitation.id, expiresAt: expiresAt.toISOString() },
    });
    return { organisation: org, invitationId: invitation.id, link: `${appUrl.replace(/\/+$/, "")}/invitations/${token}`, expiresAt };
  });
}
