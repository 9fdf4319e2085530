import type { InvitationStatus } from "@/db/queries/invitations";

/** One distinct message per reason a link cannot be used, shared by the page and its action. */
export const STATUS_MESSAGES: Record<Exclude<InvitationStatus, "pending"> | "unknown", string> = {
  unknown:
    "This invitation link is not valid. Check that the whole link from the e-mail was copied; if it was, ask the administrator who invited you for a new invitation.",
  expired: "This invitation has expired: links are valid for 72 hours. Ask the administrator who invited you to send a new one.",
  revoked: "This invitation was withdrawn by an administrator of the organisation. Ask them if you still need access.",
  accepted: "This invitation has already been used. Sign in with the account it was accepted for.",
};
