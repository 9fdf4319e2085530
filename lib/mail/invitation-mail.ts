import "server-only";
import { escapeHtml } from "@/lib/mail/html";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { appUrl, type OutgoingMail } from "./transport";

/** The invitation e-mail: plain text first (many plant mail systems strip HTML), a simple HTML copy. */
export function invitationMail(input: {
  to: string;
  token: string;
  organisationName: string;
  inviterName: string;
  roles: Role[];
  expiresAt: Date;
}): OutgoingMail {
  const link = `${appUrl()}/invitations/${input.token}`;
  const roles = input.roles.map((r) => ROLE_LABELS[r]).join(", ");
  const until = input.expiresAt.toISOString().replace("T", " ").slice(0, 16) + " UTC";
  const text = [
    `${input.inviterName} has invited you to ${input.organisationName} on Synledger.`,
    "",
    `Roles: ${roles}`,
    "",
    "Open this link to set up your account (it works once and expires at " + until + "):",
    link,
    "",
    "If you did not expect this invitation, ignore this e-mail; nothing happens unless the link is opened and accepted.",
  ].join("\n");
  const html = `<p>${escapeHtml(input.inviterName)} has invited you to <strong>${escapeHtml(input.organisationName)}</strong> on Synledger.</p>
<p>Roles: ${escapeHtml(roles)}</p>
<p><a href="${escapeHtml(link)}">Accept the invitation</a> &mdash; the link works once and expires at ${escapeHtml(until)}.</p>
<p style="color:#555">If you did not expect this invitation, ignore this e-mail.</p>`;
  return { to: input.to, subject: `Invitation to ${input.organisationName} on Synledger`, text, html };
}
