import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditEvents, months, readings, streams } from "@/db/schema";
import { asLifecycle, closeTestDb, testDb } from "../support/db";
import { createOrg, newMonth, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";

vi.mock("@/auth", () => import("../support/mock-auth"));
const revalidatePath = vi.hoisted(() => vi.fn());
vi.mock("next/cache", () => ({ revalidatePath }));
const failAudit = vi.hoisted(() => ({ after: -1 }));
vi.mock("@/db/queries/audit", async (importOriginal) => {
  const real = await importOriginal<typeof import("@/db/queries/audit")>();
  return { ...real, recordAudit: async (...args: Parameters<typeof real.recordAudit>) => {
    // Fails the n-th audit write of a save, after the first reading was already written.
    if (failAudit.after >= 0 && failAudit.after-- === 0) throw new Error("audit write failed");
    return real.recordAudit(...args);
  } };
});
process.env.DATABASE_URL ??= "";

const { saveMonthForm } = await import("@/app/(app)/sites/[siteId]/months/[month]/actions");

let org: FixtureOrg;
let other: FixtureOrg;
const figures = (expectedVersion: number, nh3 = "45000") => ({
  expectedVersion,
  readings: [
    { stream: "feed", quantity: "26000000.125", unit: "Sm3" as const, source: "meter" as const },
    { stream: "nh3", quantity: nh3, unit: "t" as const, source: "estimate" as const, note: "weighbridge down" },
  ],
  removeReadings: [],
  analyses: [{ key: "ng", components: { CH4: "95.2", C2H6: "2.8", N2: "1.0", CO2: "1.0" } }],
});
const monthRow = async (period: string) => (await testDb().select().from(months).where(and(eq(months.siteId, org.siteId), eq(months.period, period))))[0];

beforeAll(async () => {
  org = await createOrg(testDb(), "Form");
  other = await createOrg(testDb(), "FormOther");
  await testDb().insert(streams).values([
    { siteId: org.siteId, key: "feed", name: "Feed", kind: "feed-gas", unit: "Sm3", analysisKey: "ng" },
    { siteId: org.siteId, key: "nh3", name: "Ammonia", kind: "ammonia", unit: "t" },
  ]);
});
afterAll(closeTestDb);

describe("saveMonthForm", () => {
  it("saves the engineer's figures exactly, through channel form, and revalidates the page", async () => {
    actAs(org.session("process_engineer"));
    const r = await saveMonthForm(org.siteId, "2026-02", figures(0));
    expect(r).toMatchObject({ ok: true, data: { version: 1, changed: 3 } });
    const m = await monthRow("2026-02");
    const rows = await testDb().select().from(readings).where(eq(readings.monthId, m.id));
    expect(rows.map((x) => [x.quantity, x.source, x.note]).sort()).toEqual([["26000000.125", "meter", null], ["45000", "estimate", "weighbridge down"]]);
    const ev = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.entity, "reading")));
    expect(ev.every((e) => e.channel === "form" && e.actorUserId === org.members.process_engineer.id)).toBe(true);
    expect(revalidatePath).toHaveBeenCalledWith(`/sites/${org.siteId}/months/2026-02`);
  });

  // Regression (issue 17): one edit was reported as three, with two empty analysis.changed events.
  it("one changed figure is one change and one audit event, whatever order the analysis arrives in", async () => {
    actAs(org.session("process_engineer"));
    const first = await saveMonthForm(org.siteId, "2026-06", figures(0));
    expect(first).toMatchObject({ ok: true, data: { changed: 3 } });
    const m = await monthRow("2026-06");
    const before = (await testDb().select().from(auditEvents).where(eq(auditEvents.organisationId, org.id))).length;
    // The form sends the analysis again, components in its own order and with trailing zeros.
    const again = { ...figures(m.version, "45100"), analyses: [{ key: "ng", components: { CO2: "1.00", N2: "1.0", C2H6: "2.80", CH4: "95.20" } }] };
    const r = await saveMonthForm(org.siteId, "2026-06", again);
    expect(r).toMatchObject({ ok: true, message: "Saved 1 change.", data: { changed: 1 } });
    const events = await testDb().select().from(auditEvents).where(eq(auditEvents.organisationId, org.id));
    expect(events.length - before).toBe(1);
    expect(events.filter((e) => e.action === "analysis.changed")).toEqual([]);
  });

  it("answers a stale version with the conflict code and what changed, by whom", async () => {
    actAs(org.session("process_engineer"));
    await saveMonthForm(org.siteId, "2026-02", figures(1, "45100"));
    const r = await saveMonthForm(org.siteId, "2026-02", figures(1, "44900"));
    expect(r).toMatchObject({ ok: false, code: "version_conflict", message: expect.stringContaining("your entries are still in the form") });
    expect(r.changes).toEqual([{ path: "readings.nh3", message: expect.stringMatching(new RegExp(`^${org.members.process_engineer.name} changed it at .*: 45000 → 45100$`)) }]);
  });

  it("returns validation errors keyed by the field path", async () => {
    actAs(org.session("process_engineer"));
    const bad = { ...figures(2), readings: [{ stream: "feed", quantity: "12,5", unit: "Sm3" as const }, { stream: "nh3", quantity: "1", unit: "Sm3" as const }] };
    const r1 = await saveMonthForm(org.siteId, "2026-02", bad);
    expect(r1).toMatchObject({ ok: false, errors: { "readings[0].quantity": expect.stringContaining("dot for decimals") } });
    const r2 = await saveMonthForm(org.siteId, "2026-02", { ...bad, readings: [bad.readings[1]], analyses: [{ key: "ng", components: { CH4: "90" } }] });
    expect(r2).toMatchObject({ ok: false, errors: { "readings[0].unit": expect.stringContaining("not a unit for ammonia"), "analyses[0].components": expect.stringContaining("sum to 90") } });
  });

  it("refuses the signed-out (401) and every role without month:enter (403)", async () => {
    actAs(null);
    expect(await saveMonthForm(org.siteId, "2026-03", figures(0))).toMatchObject({ ok: false, message: "Sign in first." });
    for (const role of ["administrator", "environmental_officer", "signatory", "auditor"] as const) {
      actAs(org.session(role));
      expect(await saveMonthForm(org.siteId, "2026-03", figures(0))).toMatchObject({ ok: false, message: "Your role does not allow you to enter monthly figures." });
    }
    expect(await monthRow("2026-03")).toBeUndefined();
  });

  it("another organisation's site is not found, and nothing is written there", async () => {
    actAs(other.session("process_engineer"));
    expect(await saveMonthForm(org.siteId, "2026-04", figures(0))).toMatchObject({ ok: false, code: "not_found", message: "The site was not found." });
    expect(await monthRow("2026-04")).toBeUndefined();
  });

  it("a read-only month refuses the save and says why", async () => {
    actAs(org.session("process_engineer"));
    await asLifecycle((tx) => tx.insert(months).values({ ...newMonth(org.siteId, "2026-01"), state: "signed", version: 3 }));
    const r = await saveMonthForm(org.siteId, "2026-01", figures(3));
    expect(r).toMatchObject({ ok: false, code: "month_read_only", message: expect.stringContaining("signed") });
  });

  it("a failing audit write rolls back the readings written before it", async () => {
    actAs(org.session("process_engineer"));
    failAudit.after = 1;
    await expect(saveMonthForm(org.siteId, "2026-05", figures(0))).rejects.toThrow("audit write failed");
    failAudit.after = -1;
    expect(await monthRow("2026-05")).toBeUndefined();
    const ev = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.entityId, "2026-05/feed")));
    expect(ev).toEqual([]);
  });
});
