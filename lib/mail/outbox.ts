import "server-only";
import type { Db, Tx } from "@/db/client";
import { claimDueMail, insertMail, markMailFailed, markMailRetry, markMailSent, type OutboxMessage } from "@/db/queries/outbox";
import { mailTransport } from "./transport";
import { env } from "@/lib/env";

/** What the worker needs of a nodemailer transport; tests pass a fake. */
export interface MailSender {
  sendMail(mail: { from: string; to: string; subject: string; text: string; html: string; messageId?: string }): Promise<unknown>;
}

/**
 * Queues a notification inside the caller's transaction: it is sent if and only if the change it
 * announces commits, and a slow or absent mail server never holds up a signature.
 */
export async function enqueueMail(tx: Db | Tx, msg: OutboxMessage): Promise<number> {
  return insertMail(tx, msg);
}

/** Delay before attempt n+1 after n failures: 1, 2, 4 … minutes, at most 6 hours. */
export function backoffSeconds(failures: number): number {
  return Math.min(60 * 2 ** Math.max(0, failures - 1), 6 * 3600);
}

export interface DeliveryOptions {
  limit?: number;
  /** After this many attempts a message is marked failed and left for a person to look at. */
  maxAttempts?: number;
  leaseSeconds?: number;
  from?: string;
}

/** Sends what is due; call from a timer or a job. Returns counts so the caller can log them. */
export async function deliverPending(
  db: Db,
  sender: MailSender = mailTransport(),
  opts: DeliveryOptions = {},
): Promise<{ sent: number; retried: number; failed: number }> {
  const maxAttempts = opts.maxAttempts ?? 8;
  const from = opts.from ?? env().MAIL_FROM;
  const due = await claimDueMail(db, opts.limit ?? 20, opts.leaseSeconds ?? 300);
  const counts = { sent: 0, retried: 0, failed: 0 };
  for (const m of due) {
    try {
      // The outbox row names itself in the Message-ID: a receiver (and a test) can tell a repeat from a new message.
      await sender.sendMail({ from, to: m.to, subject: m.subject, text: m.text, html: m.html, messageId: `<outbox-${m.id}@synledger.invalid>` });
      await markMailSent(db, m.id);
      counts.sent++;
    } catch (err) {
      const message = (err instanceof Error ? err.message : String(err)).slice(0, 500);
      if (m.attempts >= maxAttempts) {
        await markMailFailed(db, m.id, message);
        counts.failed++;
      } else {
        await markMailRetry(db, m.id, message, backoffSeconds(m.attempts));
        counts.retried++;
      }
    }
  }
  return counts;
}
