import "server-only";
import { escapeHtml } from "@/lib/mail/html";
import type { Tx } from "@/db/client";
import { listMembers } from "@/db/queries/members";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { enqueueMail } from "@/lib/mail/outbox";
import { appUrl } from "@/lib/mail/transport";
import { monthLabel } from "@/reports/format";
import { RULES, type TransitionName } from "./transitions";
import { STATE_LABELS } from "@/lib/month-states";

const NEXT_STEP: Record<TransitionName, string> = {
  balance: "An environmental officer can now check the method and factor set and send the statement for sign-off.",
  "send-for-review": "A signatory can now review the statement and sign it or return it with comments.",
  return: "Please read the comments, correct what is needed and send the statement again.",
  sign: "An environmental officer can now submit it to the authority and record the reference.",
  "record-submission": "Nothing more is needed unless the authority asks for a correction.",
  reopen: "A process engineer can now correct the figures and close the balance again for the new revision.",
};

export interface NoticeInput {
  organisationId: string;
  siteId: string;
  siteName: string;
  period: string;
  transition: TransitionName;
  actorName: string;
  actorUserId: string;
  revision: number;
  reason?: string | null;
  extra?: string | null;
}

/**
 * Queues one e-mail per member holding a role that acts next, in the transition's own
 * transaction: it goes out only if the transition commits, and a mail server that is down
 * delays the message (deliverPending retries) but never the transition.
 */
export async function queueTransitionNotice(tx: Tx, n: NoticeInput): Promise<number> {
  const rule = RULES[n.transition];
  const members = await listMembers(tx, n.organisationId);
  const recipients = members.filter(
    (m) => !m.disabled && m.userId !== n.actorUserId && m.roles.some((r) => (rule.notify as readonly Role[]).includes(r)),
  );
  const month = monthLabel(n.period);
  const link = `${appUrl()}/sites/${n.siteId}/months/${n.period}/review`;
  const subject = `${n.siteName}, ${month} (rev. ${n.revision}): ${STATE_LABELS[rule.to]}`;
  const lines = [
    `${n.actorName} ${rule.done} for ${n.siteName}, ${month}, revision ${n.revision}. The month is now ${STATE_LABELS[rule.to]}.`,
    ...(n.reason ? ["", `Their words: ${n.reason}`] : []),
    ...(n.extra ? ["", n.extra] : []),
    "",
    NEXT_STEP[n.transition],
    "",
    `Open the review page: ${link}`,
  ];
  for (const m of recipients) {
    const roles = m.roles.filter((r) => (rule.notify as readonly Role[]).includes(r)).map((r) => ROLE_LABELS[r as Role]).join(", ");
    const text = [...lines, "", `You receive this as ${roles} of your organisation on Synledger.`].join("\n");
    const html = text
      .split("\n\n")
      .map((p) => `<p>${escapeHtml(p).replace(/\n/g, "<br>").replace(escapeHtml(link), `<a href="${escapeHtml(link)}">${escapeHtml(link)}</a>`)}</p>`)
      .join("\n");
    await enqueueMail(tx, { to: m.email, subject, text, html });
  }
  return recipients.length;
}
