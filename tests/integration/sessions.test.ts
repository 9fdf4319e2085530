/**
 * Sessions end when they should (issue 11, build 2): disabling a user, removing them from the
 * organisation, "sign out everywhere" and a password change end every session of theirs at the
 * next request. Each case: the session works, the action, the same session is refused.
 */
import { eq } from "drizzle-orm";
import { afterAll, beforeEach, describe, expect, it, vi } from "vitest";
import { auditEvents, memberships, userSessions, users } from "@/db/schema";
import { openSession } from "@/db/queries/sessions";
import { currentActor } from "@/lib/auth/guard";
import { verifyPassword } from "@/lib/auth/password";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, FIXTURE_PASSWORD, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));

const account = await import("@/app/(app)/account/actions");
const usersActions = await import("@/app/(app)/settings/users/actions");

const form = (fields: Record<string, string>) => {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.append(k, v);
  return fd;
};

let org: FixtureOrg;
beforeEach(async () => {
  org = await createOrg(testDb(), "Sessions");
});
afterAll(closeTestDb);

/** Whether the session the test holds for a member still works. */
async function works(role: keyof FixtureOrg["members"]): Promise<boolean> {
  actAs(org.session(role));
  return (await currentActor()) !== null;
}

async function openSessionsOf(userId: string) {
  return (await testDb().select().from(userSessions).where(eq(userSessions.userId, userId))).filter((s) => s.endedAt === null);
}

describe("an administrator ends someone's access", () => {
  it("disabling an account ends its sessions at once; enabling lets it sign in again but revives none", async () => {
    const auditor = org.members.auditor;
    await openSession(testDb(), auditor.id, "192.0.2.20", "second browser");
    expect(await works("auditor")).toBe(true);
    actAs(org.session("administrator"));
    const r = await usersActions.setMemberAccess(null, form({ userId: auditor.id, access: "disable" }));
    expect(r).toMatchObject({ ok: true });
    expect(await works("auditor")).toBe(false);
    expect(await openSessionsOf(auditor.id)).toEqual([]);
    const [u] = await testDb().select().from(users).where(eq(users.id, auditor.id));
    expect(u.disabled).toBe(true);
    actAs(org.session("administrator"));
    expect(await usersActions.setMemberAccess(null, form({ userId: auditor.id, access: "enable" }))).toMatchObject({ ok: true });
    expect(await works("auditor")).toBe(false);
    const events = await testDb().select({ action: auditEvents.action }).from(auditEvents).where(eq(auditEvents.entityId, auditor.id));
    expect(events.map((e) => e.action)).toEqual(expect.arrayContaining(["user.disabled", "user.enabled"]));
  });

  it("removing a member (every role gone) ends their sessions", async () => {
    expect(await works("signatory")).toBe(true);
    actAs(org.session("administrator"));
    expect(await usersActions.removeMember(null, form({ userId: org.members.signatory.id }))).toMatchObject({ ok: true });
    expect(await works("signatory")).toBe(false);
    expect(await openSessionsOf(org.members.signatory.id)).toEqual([]);
  });

  it("refuses one's own account, the last administrator, and an account of several organisations", async () => {
    actAs(org.session("administrator"));
    expect(await usersActions.setMemberAccess(null, form({ userId: org.members.administrator.id, access: "disable" }))).toMatchObject({
      ok: false,
      message: expect.stringContaining("your own account"),
    });

    const lone = await createOrg(testDb(), "Lone");
    actAs(lone.session("administrator"));
    expect(await usersActions.removeMember(null, form({ userId: lone.members.all.id }))).toMatchObject({ ok: true });
    expect(await usersActions.removeMember(null, form({ userId: lone.members.administrator.id }))).toMatchObject({
      ok: false,
      message: expect.stringContaining("only administrator"),
    });

    const elsewhere = await createOrg(testDb(), "Elsewhere");
    await testDb().insert(memberships).values({ userId: org.members.auditor.id, organisationId: elsewhere.id, roles: ["auditor"] });
    actAs(org.session("administrator"));
    expect(await usersActions.setMemberAccess(null, form({ userId: org.members.auditor.id, access: "disable" }))).toMatchObject({
      ok: false,
      message: expect.stringContaining("also belongs to other organisations"),
    });
    expect(await works("auditor")).toBe(true);
  });
});

describe("the holder ends their own sessions", () => {
  it("sign out everywhere ends every session of the account, this one included", async () => {
    const m = org.members.process_engineer;
    await openSession(testDb(), m.id, "192.0.2.30", "phone");
    actAs(org.session("process_engineer"));
    expect(await account.signOutEverywhere(null, form({}))).toMatchObject({ ok: true });
    expect(await openSessionsOf(m.id)).toEqual([]);
    expect(await works("process_engineer")).toBe(false);
  });

  it("ending one other session leaves this one working", async () => {
    const m = org.members.environmental_officer;
    const phone = await openSession(testDb(), m.id, "192.0.2.31", "phone");
    actAs(org.session("environmental_officer"));
    expect(await account.endOneSession(null, form({ sessionId: phone }))).toMatchObject({ ok: true });
    expect((await openSessionsOf(m.id)).map((s) => s.id)).toEqual([m.sessionId]);
    expect(await works("environmental_officer")).toBe(true);
    // Another user's session is not one's own to end.
    expect(await account.endOneSession(null, form({ sessionId: org.members.auditor.sessionId }))).toMatchObject({ ok: false });
    expect(await works("auditor")).toBe(true);
  });

  it("a password change checks the current password, then ends every session", async () => {
    const m = org.members.signatory;
    actAs(org.session("signatory"));
    const wrong = await account.changePassword(null, form({ current: "Not#TheCurrent0ne", password: "Fresh#Passw0rd-77", confirm: "Fresh#Passw0rd-77" }));
    expect(wrong).toMatchObject({ ok: false, errors: { current: "That is not your current password." } });
    const weak = await account.changePassword(null, form({ current: FIXTURE_PASSWORD, password: "short", confirm: "short" }));
    expect(weak).toMatchObject({ ok: false, errors: { password: expect.stringContaining("at least 12 characters") } });
    expect(await works("signatory")).toBe(true);
    const done = await account.changePassword(null, form({ current: FIXTURE_PASSWORD, password: "Fresh#Passw0rd-77", confirm: "Fresh#Passw0rd-77" }));
    expect(done).toMatchObject({ ok: true });
    expect(await works("signatory")).toBe(false);
    const [u] = await testDb().select().from(users).where(eq(users.id, m.id));
    expect(await verifyPassword("Fresh#Passw0rd-77", u.passwordHash)).toBe(true);
  });
});
