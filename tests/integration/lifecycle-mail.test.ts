import { inArray, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailOutbox } from "@/db/schema";
import { deliverPending, type MailSender } from "@/lib/mail/outbox";
import { closeTestDb, testDb } from "../support/db";
import { act, lifecycleOrg, monthRow, type LifecycleOrg } from "./lifecycle-support";

let org: LifecycleOrg;

beforeAll(async () => {
  org = await lifecycleOrg("Mail");
}, 90_000);
afterAll(closeTestDb);

const ours = (to: string[]) => testDb().select().from(mailOutbox).where(inArray(mailOutbox.to, to));

describe("notifications", () => {
  it("each transition queues mail to the people who act next, in the same transaction", async () => {
    await act(org, "process_engineer", org.estuaryId, "2026-01", "balance");
    const officer = org.members.environmental_officer.email;
    const toOfficer = await ours([officer]);
    expect(toOfficer).toHaveLength(1);
    expect(toOfficer[0].subject).toMatch(/January 2026 \(rev\. 1\): Balanced$/);
    expect(toOfficer[0].text).toContain(`/sites/${org.estuaryId}/months/2026-01/review`);
    // Nobody else hears about it: the signatory acts only after the officer.
    expect(await ours([org.members.signatory.email, org.members.auditor.email, org.members.administrator.email])).toHaveLength(0);

    await act(org, "environmental_officer", org.estuaryId, "2026-01", "send-for-review");
    expect((await ours([org.members.signatory.email])).map((m) => m.subject)).toEqual([expect.stringMatching(/In review$/)]);
  });

  it("a failing mail server does not stop the transition; the message goes out once it works again", async () => {
    const failing: MailSender = { sendMail: async () => Promise.reject(new Error("connection refused (test)")) };
    const sent: string[] = [];
    const working: MailSender = {
      sendMail: async (m) => {
        sent.push(m.to);
      },
    };
    const out = await act(org, "signatory", org.estuaryId, "2026-01", "return", { reason: "Please add the steam import to the intensities." });
    expect(out.state).toBe("balanced");
    expect((await monthRow(org.estuaryId, "2026-01")).state).toBe("balanced");

    const to = [org.members.environmental_officer.email, org.members.process_engineer.email];
    const queued = (await ours(to)).filter((m) => m.subject.endsWith("Balanced") && m.text.includes("steam import"));
    expect(queued.map((m) => m.to).sort()).toEqual([...to].sort());
    const ids = queued.map((m) => m.id);

    // Other tests' messages may be due too (hundreds, by now); the worker is run until ours have been tried.
    const tried = async () => (await testDb().select().from(mailOutbox).where(inArray(mailOutbox.id, ids))).every((m) => m.attempts > 0);
    for (let i = 0; i < 50 && !(await tried()); i++) await deliverPending(testDb(), failing, { limit: 500 });
    const afterFail = await testDb().select().from(mailOutbox).where(inArray(mailOutbox.id, ids));
    for (const m of afterFail) expect(m).toMatchObject({ status: "pending", attempts: 1, lastError: "connection refused (test)" });

    // Time passes beyond the back-off.
    await testDb().update(mailOutbox).set({ nextAttemptAt: sql`now()` }).where(inArray(mailOutbox.id, ids));
    const sentAll = async () => (await testDb().select().from(mailOutbox).where(inArray(mailOutbox.id, ids))).every((m) => m.status === "sent");
    for (let i = 0; i < 50 && !(await sentAll()); i++) await deliverPending(testDb(), working, { limit: 500 });
    const delivered = await testDb().select().from(mailOutbox).where(inArray(mailOutbox.id, ids));
    for (const m of delivered) expect(m).toMatchObject({ status: "sent", attempts: 2 });
    expect(sent).toEqual(expect.arrayContaining(to));
  });
});
