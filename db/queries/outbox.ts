import { eq, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { mailOutbox, type MailOutboxRow } from "../schema";

export interface OutboxMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export async function insertMail(tx: Db | Tx, msg: OutboxMessage): Promise<number> {
  const [row] = await tx.insert(mailOutbox).values(msg).returning({ id: mailOutbox.id });
  return row.id;
}

/**
 * Takes up to `limit` due messages for this worker. Each claimed row counts an attempt and is
 * pushed `leaseSeconds` into the future, so a worker that dies mid-send leaves it to be retried
 * later rather than lost; SKIP LOCKED lets several workers run without sending anything twice.
 */
export async function claimDueMail(db: Db, limit: number, leaseSeconds: number): Promise<MailOutboxRow[]> {
  const { rows } = await db.execute<Record<string, unknown>>(sql`
    UPDATE mail_outbox SET attempts = attempts + 1, next_attempt_at = now() + make_interval(secs => ${leaseSeconds})
    WHERE id IN (
      SELECT id FROM mail_outbox
      WHERE status = 'pending' AND next_attempt_at <= now()
      ORDER BY next_attempt_at, id
      LIMIT ${limit}
      FOR UPDATE SKIP LOCKED
    )
    RETURNING id, "to", subject, text, html, status, attempts, next_attempt_at, last_error, created_at, sent_at`);
  return rows.map((r) => ({
    id: Number(r.id),
    to: String(r.to),
    subject: String(r.subject),
    text: String(r.text),
    html: String(r.html),
    status: r.status as MailOutboxRow["status"],
    attempts: Number(r.attempts),
    nextAttemptAt: new Date(r.next_attempt_at as string),
    lastError: (r.last_error as string | null) ?? null,
    createdAt: new Date(r.created_at as string),
    sentAt: r.sent_at ? new Date(r.sent_at as string) : null,
  }));
}

export async function markMailSent(db: Db, id: number): Promise<void> {
  await db.update(mailOutbox).set({ status: "sent", sentAt: sql`now()`, lastError: null }).where(eq(mailOutbox.id, id));
}

export async function markMailRetry(db: Db, id: number, error: string, delaySeconds: number): Promise<void> {
  await db
    .update(mailOutbox)
    .set({ lastError: error, nextAttemptAt: sql`now() + make_interval(secs => ${delaySeconds})` })
    .where(eq(mailOutbox.id, id));
}

export async function markMailFailed(db: Db, id: number, error: string): Promise<void> {
  await db.update(mailOutbox).set({ status: "failed", lastError: error }).where(eq(mailOutbox.id, id));
}
