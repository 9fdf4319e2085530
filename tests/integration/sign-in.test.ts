import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { users } from "@/db/schema";
import { MAX_FAILURES_PER_EMAIL } from "@/db/queries/users";
import { authenticate } from "@/lib/auth/credentials";
import { hashPassword } from "@/lib/auth/password";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, FIXTURE_PASSWORD, type FixtureOrg } from "../support/fixtures";

let org: FixtureOrg;
const ip = () => `10.0.0.${Math.floor(Math.random() * 250)}-${randomUUID().slice(0, 4)}`;

beforeAll(async () => {
  org = await createOrg(testDb(), "SignIn");
});
afterAll(closeTestDb);

describe("authenticate (credentials sign-in)", () => {
  it("signs in a member with the right password and carries organisation and roles", async () => {
    const m = org.members.process_engineer;
    const r = await authenticate(testDb(), m.email.toUpperCase(), FIXTURE_PASSWORD, ip());
    expect(r).toEqual({
      ok: true,
      user: expect.objectContaining({ id: m.id, organisationId: org.id, roles: ["process_engineer"] }),
    });
  });

  it("refuses a wrong password and an unknown e-mail with the same reason", async () => {
    const wrong = await authenticate(testDb(), org.members.auditor.email, "Not#ThePassw0rd", ip());
    const unknown = await authenticate(testDb(), `nobody-${randomUUID()}@fixture.example`, FIXTURE_PASSWORD, ip());
    expect(wrong).toEqual({ ok: false, reason: "bad-credentials" });
    expect(unknown).toEqual(wrong);
  });

  it("blocks an e-mail after repeated failures, even with the right password", async () => {
    const m = org.members.signatory;
    for (let i = 0; i < MAX_FAILURES_PER_EMAIL; i++) {
      expect(await authenticate(testDb(), m.email, `Wrong#Passw0rd${i}`, ip())).toEqual({ ok: false, reason: "bad-credentials" });
    }
    expect(await authenticate(testDb(), m.email, FIXTURE_PASSWORD, ip())).toEqual({ ok: false, reason: "rate-limited" });
  });

  it("refuses a user without any role", async () => {
    const email = `loner-${randomUUID().slice(0, 8)}@fixture.example`;
    await testDb().insert(users).values({ email, name: "No role", passwordHash: await hashPassword(FIXTURE_PASSWORD) });
    expect(await authenticate(testDb(), email, FIXTURE_PASSWORD, ip())).toEqual({ ok: false, reason: "no-role" });
  });

  it("refuses a disabled account", async () => {
    const m = org.members.auditor;
    await testDb().update(users).set({ disabled: true }).where(eq(users.id, m.id));
    expect(await authenticate(testDb(), m.email, FIXTURE_PASSWORD, ip())).toEqual({ ok: false, reason: "disabled" });
  });
});
