/**
 * One-shot delivery of the mail outbox: sends what is due and exits. For cron, or for an
 * installation that runs the app with MAIL_WORKER=0. lib/mail is marked server-only, so run
 * it with the react-server condition:
 *   node --conditions=react-server --import tsx scripts/deliver-mail.ts
 * (DATABASE_URL and SMTP_URL as for the app.)
 */
import { createDb } from "@/db/client";
import { env } from "@/lib/env";
import { deliverPending } from "@/lib/mail/outbox";
import { mailTransport } from "@/lib/mail/transport";

const db = createDb(env().DATABASE_URL ?? "", 2);
try {
  let total = { sent: 0, retried: 0, failed: 0 };
  // Batches until nothing due is left, so a backlog clears in one run.
  for (;;) {
    const c = await deliverPending(db, mailTransport(), { limit: 50 });
    total = { sent: total.sent + c.sent, retried: total.retried + c.retried, failed: total.failed + c.failed };
    if (c.sent + c.retried + c.failed < 50) break;
  }
  console.error(`[synledger] mail: sent ${total.sent}, retrying later ${total.retried}, given up ${total.failed}`);
} catch (err) {
  console.error("[synledger] mail delivery failed:", err instanceof Error ? err.message : err);
  process.exitCode = 1;
} finally {
  await db.$client.end();
  if (env().SMTP_URL) mailTransport().close();
}
