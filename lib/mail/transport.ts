import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

const g = globalThis as unknown as { __synledgerMail?: Transporter };

/** Thrown when a message could not be handed to the mail server; the caller rolls back. */
export class MailNotSent extends Error {}

/**
 * One transport per process, built from SMTP_URL (scripts/start.sh points it at the local
 * sink). Short timeouts: an invitation waits for the send inside its database transaction.
 */
export function mailTransport(): Transporter {
  if (!g.__synledgerMail) {
    const url = env().SMTP_URL;
    if (!url) throw new MailNotSent("SMTP_URL is not set, so no e-mail can be sent.");
    g.__synledgerMail = nodemailer.createTransport(url, {
      connectionTimeout: 8_000,
      greetingTimeout: 8_000,
      socketTimeout: 15_000,
    });
  }
  return g.__synledgerMail;
}

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  const from = env().MAIL_FROM;
  try {
    await mailTransport().sendMail({ from, ...mail });
  } catch (err) {
    if (err instanceof MailNotSent) throw err;
    console.error("[mail] send failed:", err instanceof Error ? err.message : err);
    throw new MailNotSent("The mail server did not accept the message.");
  }
}

/** Base URL for links in e-mails; APP_URL is set by scripts/start.sh. */
export { appUrl } from "@/lib/env";
