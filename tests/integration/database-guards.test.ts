import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { recordAudit } from "@/db/queries/audit";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";

let org: FixtureOrg;
beforeAll(async () => {
  org = await createOrg(testDb(), "Guards");
  await recordAudit(testDb(), {
    organisationId: org.id,
    actorLabel: "test",
    channel: "system",
    action: "test.event",
    entity: "test",
  });
});
afterAll(closeTestDb);

/** The error PostgreSQL raised, looked up through drizzle's wrapper. */
async function pgError(run: () => Promise<unknown>): Promise<string> {
  try {
    await run();
  } catch (err) {
    const e = err as { cause?: { message?: string }; message: string };
    return e.cause?.message ?? e.message;
  }
  return "no error";
}

describe("the audit trail cannot be edited, even by the app's own database role", () => {
  it("refuses UPDATE", async () => {
    expect(await pgError(() => testDb().execute(sql`UPDATE audit_events SET action = 'x' WHERE organisation_id = ${org.id}`))).toMatch(
      /append-only: UPDATE refused/,
    );
  });
  it("refuses DELETE", async () => {
    expect(await pgError(() => testDb().execute(sql`DELETE FROM audit_events WHERE organisation_id = ${org.id}`))).toMatch(
      /append-only: DELETE refused/,
    );
  });
  it("refuses TRUNCATE and dropping the trigger", async () => {
    expect(await pgError(() => testDb().execute(sql`TRUNCATE audit_events`))).toMatch(/(append-only|permission denied)/);
    expect(await pgError(() => testDb().execute(sql`DROP TRIGGER audit_events_append_only ON audit_events`))).toMatch(
      /must be owner/,
    );
  });
  it("still accepts new events", async () => {
    const [{ n }] = (await testDb().execute<{ n: string }>(sql`SELECT count(*)::text AS n FROM audit_events WHERE organisation_id = ${org.id}`))
      .rows;
    expect(Number(n)).toBeGreaterThanOrEqual(1);
  });
});
