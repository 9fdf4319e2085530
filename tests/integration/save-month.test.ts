import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditEvents, months, readings, streams } from "@/db/schema";
import { HttpError } from "@/lib/auth/errors";
import { saveMonthFigures, type Editor } from "@/lib/ledger/save-month";
import { closeTestDb, asLifecycle, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";

let org: FixtureOrg;
let other: FixtureOrg;
let editor: Editor;

async function refusal(run: () => Promise<unknown>): Promise<HttpError> {
  try {
    await run();
  } catch (err) {
    if (err instanceof HttpError) return err;
    throw err;
  }
  throw new Error("expected a refusal");
}

beforeAll(async () => {
  org = await createOrg(testDb(), "Save");
  other = await createOrg(testDb(), "SaveOther");
  editor = { organisationId: org.id, userId: org.members.process_engineer.id, label: "engineer", channel: "form" };
  await testDb().insert(streams).values([
    { siteId: org.siteId, key: "feed", name: "Feed", kind: "feed-gas", unit: "Sm3", analysisKey: "ng" },
    { siteId: org.siteId, key: "nh3", name: "Ammonia", kind: "ammonia", unit: "t" },
  ]);
});
afterAll(closeTestDb);

describe("saveMonthFigures", () => {
  it("saves readings and an analysis, bumps the version and audits each change", async () => {
    const r = await saveMonthFigures(testDb(), editor, org.siteId, "2026-04", {
      expectedVersion: 0,
      readings: [
        { stream: "feed", quantity: "26000000.5", unit: "Sm3" },
        { stream: "nh3", quantity: "45000", unit: "t", source: "meter" },
      ],
      analyses: [{ key: "ng", components: { CH4: "95.2", C2H6: "2.8", N2: "1.0", CO2: "1.0" } }],
    });
    expect(r).toMatchObject({ version: 1, changed: 3 });
    const rows = await testDb().select().from(readings).where(eq(readings.monthId, r.monthId));
    expect(rows.map((x) => x.quantity).sort()).toEqual(["26000000.5", "45000"]);
    const events = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.entity, "reading")));
    expect(events.map((e) => e.action).sort()).toEqual(["reading.added", "reading.added"]);
  });

  it("refuses a save from a stale version and says who changed what", async () => {
    await saveMonthFigures(testDb(), { ...editor, label: "first editor" }, org.siteId, "2026-04", {
      expectedVersion: 1,
      readings: [{ stream: "nh3", quantity: "45100", unit: "t" }],
    });
    const err = await refusal(() =>
      saveMonthFigures(testDb(), { ...editor, label: "second editor" }, org.siteId, "2026-04", {
        expectedVersion: 1,
        readings: [{ stream: "nh3", quantity: "44900", unit: "t" }],
      }),
    );
    expect(err.status).toBe(409);
    expect(err.code).toBe("version_conflict");
    expect(err.issues).toEqual([{ path: "readings.nh3", message: expect.stringMatching(/^first editor changed it at .*: 45000 → 45100$/) }]);
    const [row] = await testDb().select().from(readings).innerJoin(months, eq(months.id, readings.monthId)).where(eq(months.siteId, org.siteId));
    expect(row).toBeDefined();
  });

  it("names every bad field and writes nothing", async () => {
    const err = await refusal(() =>
      saveMonthFigures(testDb(), editor, org.siteId, "2026-05", {
        expectedVersion: 0,
        readings: [
          { stream: "nosuch", quantity: "1", unit: "t" },
          { stream: "nh3", quantity: "12", unit: "Sm3" },
        ],
        analyses: [{ key: "ng", components: { CH4: "90", N2: "1" } }],
      }),
    );
    expect(err.status).toBe(400);
    expect(err.issues.map((i) => i.path)).toEqual(["readings[0].stream", "readings[1].unit", "analyses[0].components"]);
    const [m] = await testDb().select().from(months).where(and(eq(months.siteId, org.siteId), eq(months.period, "2026-05")));
    expect(m).toBeUndefined();
  });

  it("refuses text in a number with the field path (thousands separators are not guessed)", async () => {
    const attempt = saveMonthFigures(testDb(), editor, org.siteId, "2026-05", {
      expectedVersion: 0,
      readings: [{ stream: "nh3", quantity: "1,200", unit: "t" }],
    });
    await expect(attempt).rejects.toMatchObject({
      issues: [expect.objectContaining({ path: ["readings", 0, "quantity"], message: expect.stringMatching(/non-negative number/) })],
    });
  });

  it("refuses figures for a month that has not begun", async () => {
    const next = new Date();
    next.setUTCMonth(next.getUTCMonth() + 1, 1);
    const period = `${next.getUTCFullYear()}-${String(next.getUTCMonth() + 1).padStart(2, "0")}`;
    const err = await refusal(() => saveMonthFigures(testDb(), editor, org.siteId, period, { expectedVersion: 0 }));
    expect(err).toMatchObject({ status: 400, code: "future_month", issues: [{ path: "month", message: "is a month in the future" }] });
  });

  it("treats another organisation's site as not found", async () => {
    const err = await refusal(() => saveMonthFigures(testDb(), editor, other.siteId, "2026-04", { expectedVersion: 0 }));
    expect(err.status).toBe(404);
  });

  it("refuses edits to a signed month", async () => {
    await asLifecycle((tx) => tx.update(months).set({ state: "signed" }).where(and(eq(months.siteId, org.siteId), eq(months.period, "2026-04"))));
    const [m] = await testDb().select().from(months).where(and(eq(months.siteId, org.siteId), eq(months.period, "2026-04")));
    const err = await refusal(() =>
      saveMonthFigures(testDb(), editor, org.siteId, "2026-04", { expectedVersion: m.version, readings: [{ stream: "nh3", quantity: "1", unit: "t" }] }),
    );
    expect(err).toMatchObject({ status: 409, code: "month_read_only" });
  });
});
