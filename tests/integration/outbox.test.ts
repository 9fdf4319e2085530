import { randomUUID } from "node:crypto";
import { eq, inArray, sql } from "drizzle-orm";
import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { mailOutbox } from "@/db/schema";
import { backoffSeconds, deliverPending, enqueueMail, type MailSender } from "@/lib/mail/outbox";
import { closeTestDb, testDb } from "../support/db";

afterAll(closeTestDb);

const tag = randomUUID().slice(0, 8);
const msg = (n: string) => ({ to: `${n}.${tag}@outbox.example`, subject: `Statement signed ${n}`, text: "plain", html: "<p>html</p>" });
const rowOf = async (id: number) => (await testDb().select().from(mailOutbox).where(eq(mailOutbox.id, id)))[0];

/** Records what was sent; fails while `failing` is true. */
function fakeSender() {
  const sent: string[] = [];
  const s = {
    failing: false as boolean,
    sent,
    async sendMail(m: { to: string }) {
      if (s.failing) throw new Error("421 mail server busy");
      sent.push(m.to);
      return {};
    },
  } satisfies MailSender & { failing: boolean; sent: string[] };
  return s;
}

describe("mail outbox", () => {
  // The outbox is shared by every test file: deliver what earlier files queued, so each test
  // here sees only its own messages in a batch.
  beforeEach(async () => {
    for (;;) {
      const r = await deliverPending(testDb(), fakeSender(), { limit: 500 });
      if (r.sent + r.retried + r.failed === 0) break;
    }
  });

  it("a message queued in a transaction that rolls back is never stored", async () => {
    const m = msg("rolled-back");
    await testDb()
      .transaction(async (tx) => {
        await enqueueMail(tx, m);
        throw new Error("the change failed");
      })
      .catch(() => undefined);
    expect(await testDb().select().from(mailOutbox).where(eq(mailOutbox.to, m.to))).toHaveLength(0);
  });

  it("a committed message is delivered once and marked sent", async () => {
    const id = await testDb().transaction((tx) => enqueueMail(tx, msg("ok")));
    const sender = fakeSender();
    await deliverPending(testDb(), sender);
    expect(sender.sent).toContain(msg("ok").to);
    const row = await rowOf(id);
    expect(row).toMatchObject({ status: "sent", attempts: 1, lastError: null });
    expect(row.sentAt).toBeInstanceOf(Date);
    await deliverPending(testDb(), sender);
    expect(sender.sent.filter((t) => t === msg("ok").to)).toHaveLength(1);
  });

  it("a failed send is retried later with a growing delay, then marked failed", async () => {
    const id = await enqueueMail(testDb(), msg("flaky"));
    const sender = fakeSender();
    sender.failing = true;
    await deliverPending(testDb(), sender, { maxAttempts: 3 });
    let row = await rowOf(id);
    expect(row).toMatchObject({ status: "pending", attempts: 1, lastError: "421 mail server busy" });
    const delay = (row.nextAttemptAt.getTime() - Date.now()) / 1000;
    expect(delay).toBeGreaterThan(50);
    expect(delay).toBeLessThan(70);
    // Not due yet: a second run leaves it alone.
    await deliverPending(testDb(), sender, { maxAttempts: 3 });
    expect((await rowOf(id)).attempts).toBe(1);
    for (const expected of [2, 3]) {
      await testDb().update(mailOutbox).set({ nextAttemptAt: sql`now() - interval '1 second'` }).where(eq(mailOutbox.id, id));
      await deliverPending(testDb(), sender, { maxAttempts: 3 });
      row = await rowOf(id);
      expect(row.attempts).toBe(expected);
    }
    expect(row.status).toBe("failed");
    expect(sender.sent).toHaveLength(0);
  });

  it("two workers at once send each message once", async () => {
    const ids = await Promise.all(["a", "b", "c", "d"].map((n) => enqueueMail(testDb(), msg(`pair-${n}`))));
    const sender = fakeSender();
    await Promise.all([deliverPending(testDb(), sender, { limit: 3 }), deliverPending(testDb(), sender, { limit: 3 })]);
    const mine = sender.sent.filter((t) => t.startsWith("pair-"));
    expect(new Set(mine).size).toBe(mine.length);
    const rows = await testDb().select().from(mailOutbox).where(inArray(mailOutbox.id, ids));
    expect(rows.every((r) => r.status === "sent" && r.attempts === 1)).toBe(true);
  });

  it("backoff doubles from one minute and stops at six hours", () => {
    expect([1, 2, 3, 4].map(backoffSeconds)).toEqual([60, 120, 240, 480]);
    expect(backoffSeconds(20)).toBe(21_600);
  });
});
