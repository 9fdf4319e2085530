"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import {
  INVITATION_LIFETIME_HOURS,
  createInvitation,
  findOpenInvitation,
  invitationStatus,
  lockInvitation,
  newInvitationToken,
  revokeInvitation,
} from "@/db/queries/invitations";
import type { Tx } from "@/db/client";
import { deleteMembership, isMemberByEmail, lockMembership, lockOtherAdministrators, membershipCount, setMemberRoles, setUserDisabled } from "@/db/queries/members";
import { endSessionsOf } from "@/db/queries/sessions";
import { guardedAction, type ActionResult } from "@/lib/auth/guard";
import { invitationMail } from "@/lib/mail/invitation-mail";
import { MailNotSent, sendMail } from "@/lib/mail/transport";
import { formFields, inviteSchema, memberAccessSchema, memberRolesSchema, removeMemberSchema, revokeSchema } from "@/lib/validations/members";

const PAGE = "/settings/users";

/** Replaces a member's roles. The organisation always keeps at least one administrator. */
export async function changeMemberRoles(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction("org:manage-users", "change members' roles", async (actor) => {
    const input = memberRolesSchema.parse(formFields(formData, ["roles"]));
    return getDb().transaction(async (tx): Promise<ActionResult> => {
      const member = await lockMembership(tx, actor.organisationId, input.userId);
      if (!member) return { ok: false, message: "That person is not a member of your organisation (any more); reload the page." };
      const before = [...member.roles].sort();
      const after = [...input.roles].sort();
      if (before.join() === after.join()) return { ok: true, message: "Nothing changed." };
      if (member.roles.includes("administrator") && !input.roles.includes("administrator")) {
        const others = await lockOtherAdministrators(tx, actor.organisationId, input.userId);
        if (others.length === 0) {
          const self = input.userId === actor.userId;
          const message = self
            ? "You are the only administrator, so you cannot give up that role. Make another member an administrator first."
            : "This is the only administrator; make another member an administrator first.";
          return { ok: false, message, errors: { roles: message } };
        }
      }
      await setMemberRoles(tx, member.id, input.roles);
      await recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.userId,
        actorLabel: actor.name,
        channel: "form",
        action: "member.roles-changed",
        entity: "membership",
        entityId: member.id,
        before: { user: member.email, roles: before },
        after: { user: member.email, roles: after },
      });
      return { ok: true, message: `Roles of ${member.name} saved.` };
    });
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}

/**
 * Creates an invitation and e-mails its one-time link. Order: the row and its audit event are
 * written in a transaction and the mail is sent last inside it, so a send failure rolls both
 * back and leaves no half-made invitation. (If the commit failed after a successful send, the
 * mailed link would only show "unknown link"; nothing would be granted.)
 */
export async function inviteMember(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction("org:manage-users", "invite people", async (actor): Promise<ActionResult> => {
    const input = inviteSchema.parse(formFields(formData, ["roles"]));
    const db = getDb();
    if (await isMemberByEmail(db, actor.organisationId, input.email)) {
      return { ok: false, message: "Check the highlighted fields.", errors: { email: `${input.email} is already a member; change their roles in the list above instead.` } };
    }
    if (await findOpenInvitation(db, actor.organisationId, input.email)) {
      return { ok: false, message: "Check the highlighted fields.", errors: { email: `An invitation to ${input.email} is still open. Revoke it below to send a new one.` } };
    }
    const { token, tokenHash } = newInvitationToken();
    const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_HOURS * 3_600_000);
    try {
      await db.transaction(async (tx) => {
        const invitation = await createInvitation(tx, {
          organisationId: actor.organisationId,
          email: input.email,
          roles: input.roles,
          tokenHash,
          invitedBy: actor.userId,
          expiresAt,
        });
        await recordAudit(tx, {
          organisationId: actor.organisationId,
          actorUserId: actor.userId,
          actorLabel: actor.name,
          channel: "form",
          action: "invitation.created",
          entity: "invitation",
          entityId: invitation.id,
          after: { email: input.email, roles: input.roles, expiresAt: expiresAt.toISOString() },
        });
        await sendMail(invitationMail({ to: input.email, token, organisationName: actor.organisationName, inviterName: actor.name, roles: input.roles, expiresAt }));
      });
    } catch (err) {
      if (err instanceof MailNotSent) {
        return {
          ok: false,
          message: `The invitation e-mail to ${input.email} could not be sent, so no invitation was created. Check that the mail server is reachable (SMTP_URL) and try again.`,
        };
      }
      throw err;
    }
    return { ok: true, message: `Invitation sent to ${input.email}. The link works once and expires in ${INVITATION_LIFETIME_HOURS} hours.` };
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}

/** Withdraws an open invitation; its link then says it was revoked. */
export async function revokeMemberInvitation(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction("org:manage-users", "revoke invitations", async (actor) => {
    const input = revokeSchema.parse(formFields(formData));
    return getDb().transaction(async (tx): Promise<ActionResult> => {
      const inv = await lockInvitation(tx, actor.organisationId, input.invitationId);
      if (!inv) return { ok: false, message: "That invitation was not found; reload the page." };
      const status = invitationStatus(inv);
      if (status !== "pending") return { ok: false, message: `The invitation to ${inv.email} is already ${status}; there is nothing to revoke.` };
      await revokeInvitation(tx, inv.id);
      await recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.userId,
        actorLabel: actor.name,
        channel: "form",
        action: "invitation.revoked",
        entity: "invitation",
        entityId: inv.id,
        before: { email: inv.email, roles: inv.roles, status },
        after: { email: inv.email, roles: inv.roles, status: "revoked" },
      });
      return { ok: true, message: `Invitation to ${inv.email} revoked.` };
    });
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}

/** The organisation must keep an administrator who can still sign in. */
async function lastAdministratorRefusal(tx: Tx, organisationId: string, member: { roles: string[] }, userId: string, what: string): Promise<string | null> {
  if (!member.roles.includes("administrator")) return null;
  const others = await lockOtherAdministrators(tx, organisationId, userId);
  return others.length === 0 ? `This is the only administrator, so you cannot ${what}. Make another member an administrator first.` : null;
}

/**
 * Disables or enables a member's account. Disabling ends every session of theirs at its next
 * request and refuses their sign-in; it is refused for one's own account, for the last
 * administrator, and for an account that belongs to other organisations too (whose
 * administrators did not agree; remove the member from this one instead).
 */
export async function setMemberAccess(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction("org:manage-users", "disable or enable accounts", async (actor) => {
    const input = memberAccessSchema.parse(formFields(formData));
    if (input.userId === actor.userId) return { ok: false, message: "You cannot disable your own account; ask another administrator." };
    return getDb().transaction(async (tx): Promise<ActionResult> => {
      const member = await lockMembership(tx, actor.organisationId, input.userId);
      if (!member) return { ok: false, message: "That person is not a member of your organisation (any more); reload the page." };
      const disable = input.access === "disable";
      if (member.disabled === disable) return { ok: true, message: `${member.name}'s account is already ${disable ? "disabled" : "enabled"}.` };
      if ((await membershipCount(tx, input.userId)) > 1) {
        return { ok: false, message: `${member.name} also belongs to other organisations, so the account cannot be ${disable ? "disabled" : "enabled"} from here. Remove them from ${actor.organisationName} instead.` };
      }
      if (disable) {
        const refusal = await lastAdministratorRefusal(tx, actor.organisationId, member, input.userId, "disable the account");
        if (refusal) return { ok: false, message: refusal };
      }
      await setUserDisabled(tx, input.userId, disable);
      const ended = disable ? await endSessionsOf(tx, input.userId, "disabled") : 0;
      await recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.userId,
        actorLabel: actor.name,
        channel: "form",
        action: disable ? "user.disabled" : "user.enabled",
        entity: "user",
        entityId: input.userId,
        before: { user: member.email, disabled: member.disabled },
        after: { user: member.email, disabled: disable, ...(disable ? { sessionsEnded: ended } : {}) },
      });
      return { ok: true, message: disable ? `${member.name}'s account is disabled; their sessions have ended.` : `${member.name}'s account is enabled again.` };
    });
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}

/** Takes every role of a member away by removing them from the organisation; their sessions end. */
export async function removeMember(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction("org:manage-users", "remove members", async (actor) => {
    const input = removeMemberSchema.parse(formFields(formData));
    return getDb().transaction(async (tx): Promise<ActionResult> => {
      const member = await lockMembership(tx, actor.organisationId, input.userId);
      if (!member) return { ok: false, message: "That person is not a member of your organisation (any more); reload the page." };
      const refusal = await lastAdministratorRefusal(tx, actor.organisationId, member, input.userId, "remove them");
      if (refusal) return { ok: false, message: refusal };
      await deleteMembership(tx, member.id);
      const ended = await endSessionsOf(tx, input.userId, "roles-removed");
      await recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.userId,
        actorLabel: actor.name,
        channel: "form",
        action: "member.removed",
        entity: "membership",
        entityId: member.id,
        before: { user: member.email, roles: member.roles },
        after: { user: member.email, roles: [], sessionsEnded: ended },
      });
      return { ok: true, message: `${member.name} no longer belongs to ${actor.organisationName}; their sessions have ended.` };
    });
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}
