"use server";

import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { getDb } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { findInvitationByToken, invitationStatus, markInvitationAccepted } from "@/db/queries/invitations";
import { grantMembership } from "@/db/queries/members";
import { findUserByEmail } from "@/db/queries/users";
import { users } from "@/db/schema";
import { checkPassword } from "@/lib/auth/credentials";
import { hashPassword, passwordProblems } from "@/lib/auth/password";
import { isRole } from "@/lib/auth/roles";
import { clientAddressOf } from "@/lib/net/forwarded";
import { acceptExistingAccountSchema, acceptNewAccountSchema } from "@/lib/validations/invitation";
import { formFields } from "@/lib/validations/members";
import { STATUS_MESSAGES } from "./status-messages";

export interface AcceptState {
  message?: string;
  errors?: Record<string, string>;
  name?: string;
}

function firstErrors(issues: readonly { path: readonly PropertyKey[]; message: string }[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const i of issues) out[String(i.path[0] ?? "form")] ??= i.message;
  return out;
}

/**
 * Public: accepting needs no session, the token is the proof. Creates the account (or, for an
 * address that already has one, checks that account's password), adds the membership and
 * marks the invitation used in one transaction with its audit events.
 */
export async function acceptInvitation(_prev: AcceptState, formData: FormData): Promise<AcceptState> {
  const fields = formFields(formData);
  const token = String(fields.token ?? "");
  const db = getDb();
  const preview = token ? await findInvitationByToken(db, token) : null;
  if (!preview) return { message: STATUS_MESSAGES.unknown };
  const status = invitationStatus(preview);
  if (status !== "pending") return { message: STATUS_MESSAGES[status] };
  const roles = preview.roles.filter(isRole);
  const existing = await findUserByEmail(db, preview.email);

  let newAccount: { name: string; passwordHash: string } | null = null;
  if (existing) {
    const parsed = acceptExistingAccountSchema.safeParse(fields);
    if (!parsed.success) return { message: "Check the highlighted fields.", errors: firstErrors(parsed.error.issues) };
    // The same check, throttling and notice as the sign-in form, so this page cannot be used to guess passwords.
    const h = await headers();
    const checked = await checkPassword(db, existing.email, parsed.data.password, { address: clientAddressOf(h), userAgent: h.get("user-agent") ?? "" });
    if (!checked.ok && checked.reason === "rate-limited") {
      return { message: "Too many unsuccessful attempts. Wait about 15 minutes before trying again." };
    }
    if (!checked.ok) return { message: "Check the highlighted fields.", errors: { password: "That is not the password of this account." } };
    if (existing.disabled) return { message: "Your Synledger account is disabled. Ask the administrator who invited you to enable it." };
  } else {
    const parsed = acceptNewAccountSchema.safeParse(fields);
    const name = String(fields.name ?? "");
    const password = String(fields.password ?? "");
    // Both checks run so every problem shows at once, not one per attempt.
    const errors = parsed.success ? {} : firstErrors(parsed.error.issues);
    const problems = password ? passwordProblems(password, preview.email) : [];
    if (problems.length > 0) errors.password = `Choose a stronger password: ${problems.join("; ")}.`;
    if (!parsed.success || problems.length > 0) return { message: "Check the highlighted fields.", errors, name };
    newAccount = { name: parsed.data.name, passwordHash: await hashPassword(parsed.data.password) };
  }

  const outcome = await db.transaction(async (tx) => {
    // Locked and checked again: a revoke or a second click in the meantime wins cleanly.
    const inv = await findInvitationByToken(tx, token, true);
    if (!inv) return { message: STATUS_MESSAGES.unknown };
    const now = invitationStatus(inv);
    if (now !== "pending") return { message: STATUS_MESSAGES[now] };
    let userId: string;
    let label: string;
    if (newAccount) {
      const [created] = await tx
        .insert(users)
        .values({ email: inv.email.toLowerCase(), name: newAccount.name, passwordHash: newAccount.passwordHash })
        .returning({ id: users.id });
      userId = created.id;
      label = newAccount.name;
      await recordAudit(tx, {
        organisationId: inv.organisationId,
        actorUserId: userId,
        actorLabel: label,
        channel: "form",
        action: "user.created",
        entity: "user",
        entityId: userId,
        after: { email: inv.email, name: label, via: "invitation" },
      });
    } else {
      userId = existing!.id;
      label = existing!.name;
    }
    const change = await grantMembership(tx, inv.organisationId, userId, roles);
    await markInvitationAccepted(tx, inv.id);
    await recordAudit(tx, {
      organisationId: inv.organisationId,
      actorUserId: userId,
      actorLabel: label,
      channel: "form",
      action: "invitation.accepted",
      entity: "invitation",
      entityId: inv.id,
      before: { user: inv.email, roles: change.before },
      after: { user: inv.email, roles: change.after },
    });
    return null;
  });
  if (outcome) return outcome;
  redirect(`/sign-in?notice=${newAccount ? "joined" : "added"}`);
}
