/** Administrators see when each person last signed in (issue 19): the newest session row, or "never". */
import { afterAll, describe, expect, it } from "vitest";
import { listMembers } from "@/db/queries/members";
import { memberships, userSessions, users } from "@/db/schema";
import { closeTestDb, testDb } from "../support/db";
import { createOrg } from "../support/fixtures";

afterAll(closeTestDb);

describe("members list: last sign-in", () => {
  it("is the newest sign-in of the person (ended ones count), null for one who never signed in", async () => {
    const db = testDb();
    const org = await createOrg(db, "Seen");
    const officer = org.members.environmental_officer;
    // Later than the fixture's own sign-in (now): this one, though ended, is the newest.
    await db.insert(userSessions).values([
      { userId: officer.id, address: "127.0.0.1", createdAt: new Date("2030-01-02T08:00:00Z") },
      { userId: officer.id, address: "127.0.0.1", createdAt: new Date("2030-01-30T16:45:00Z"), endedAt: new Date("2030-01-30T18:00:00Z"), endedReason: "signed-out" },
    ]);
    const [fresh] = await db.insert(users).values({ email: `never.${org.id.slice(0, 8)}@fixture.example`, name: "Never Signed-In", passwordHash: "x" }).returning();
    await db.insert(memberships).values({ userId: fresh.id, organisationId: org.id, roles: ["auditor"] });
    const members = await listMembers(db, org.id);
    expect(members.find((m) => m.userId === officer.id)!.lastSignIn?.toISOString()).toBe("2030-01-30T16:45:00.000Z");
    expect(members.find((m) => m.userId === fresh.id)!.lastSignIn).toBeNull();
  });
});
