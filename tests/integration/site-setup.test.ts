import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditEvents, sites, streams } from "@/db/schema";
import { SITE_DEFAULTS } from "@/lib/validations/site";
import { STREAM_DEFAULTS } from "@/lib/validations/stream";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: vi.fn() }));
// Lets a test make the audit write fail, to show the change it records is rolled back with it.
const failAudit = vi.hoisted(() => ({ on: false }));
vi.mock("@/db/queries/audit", async (importOriginal) => {
  const real = await importOriginal<typeof import("@/db/queries/audit")>();
  return { ...real, recordAudit: async (...args: Parameters<typeof real.recordAudit>) => {
    if (failAudit.on) throw new Error("audit write failed");
    return real.recordAudit(...args);
  } };
});
process.env.DATABASE_URL ??= "";

const { createSite, editSite, createStream, editStream, archiveStream } = await import("@/app/(app)/settings/sites/actions");

let org: FixtureOrg;
let other: FixtureOrg;
const tag = Math.random().toString(36).slice(2, 8);
const feed = { ...STREAM_DEFAULTS, key: "feed", name: "Feed gas", kind: "feed-gas" as const, unit: "Sm3", analysisKey: "ng", uncertaintyPct: "1.5", sortOrder: "0" };

beforeAll(async () => {
  org = await createOrg(testDb(), "Setup");
  other = await createOrg(testDb(), "SetupOther");
});
afterAll(closeTestDb);

const events = (orgId: string, entity: string) =>
  testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, orgId), eq(auditEvents.entity, entity)));

describe("site actions", () => {
  it("creates a site for the administrator's organisation with an audit event", async () => {
    actAs(org.session("administrator"));
    const r = await createSite({ ...SITE_DEFAULTS, name: "Harbour Works", code: `HARB-${tag}`, closureTolerancePct: "1.5" });
    expect(r).toMatchObject({ ok: true, data: { id: expect.any(String) } });
    const id = r.ok ? r.data!.id : "";
    const [row] = await testDb().select().from(sites).where(eq(sites.id, id));
    expect(row).toMatchObject({ organisationId: org.id, code: `harb-${tag}`, closureTolerancePct: "1.5" });
    const ev = (await events(org.id, "site")).filter((e) => e.entityId === id);
    expect(ev).toEqual([expect.objectContaining({ action: "site.created", channel: "form", before: null, after: expect.objectContaining({ code: `harb-${tag}` }) })]);
  });

  it("reports a duplicate code on the code field", async () => {
    actAs(org.session("administrator"));
    const r = await createSite({ ...SITE_DEFAULTS, name: "Again", code: `harb-${tag}` });
    expect(r).toMatchObject({ ok: false, errors: { code: expect.stringContaining("already uses the code") } });
  });

  it("names the fields that fail validation", async () => {
    actAs(org.session("administrator"));
    const r = await createSite({ ...SITE_DEFAULTS, name: "", code: "X", closureTolerancePct: "2,5", gwp: "AR9" as never });
    expect(r.ok).toBe(false);
    expect(Object.keys(r.ok ? {} : r.errors ?? {}).sort()).toEqual(["closureTolerancePct", "code", "gwp", "name"]);
  });

  it("refuses the signed-out (401) and every role but the administrator (403)", async () => {
    actAs(null);
    expect(await createSite({ ...SITE_DEFAULTS, name: "N", code: `n-${tag}` })).toEqual({ ok: false, message: "Sign in first." });
    for (const role of ["process_engineer", "environmental_officer", "signatory", "auditor"] as const) {
      actAs(org.session(role));
      expect(await createSite({ ...SITE_DEFAULTS, name: "N", code: `n-${tag}` })).toEqual({ ok: false, message: "Your role does not allow you to set up sites." });
    }
  });

  it("edits a site with before and after in the audit event; another organisation's site is not found", async () => {
    actAs(org.session("administrator"));
    const r = await editSite(org.siteId, { ...SITE_DEFAULTS, name: "Renamed works", code: `ren-${tag}`, gwp: "AR6" });
    expect(r.ok).toBe(true);
    const [ev] = (await events(org.id, "site")).filter((e) => e.action === "site.changed");
    expect(ev.before).toMatchObject({ gwp: "AR5" });
    expect(ev.after).toMatchObject({ gwp: "AR6", name: "Renamed works" });
    expect(await editSite(other.siteId, { ...SITE_DEFAULTS, name: "Stolen", code: "stolen" })).toMatchObject({ ok: false, message: expect.stringMatching(/not found/) });
    const [untouched] = await testDb().select().from(sites).where(eq(sites.id, other.siteId));
    expect(untouched.name).not.toBe("Stolen");
  });

  it("a failing audit write leaves no site behind", async () => {
    actAs(org.session("administrator"));
    failAudit.on = true;
    await expect(createSite({ ...SITE_DEFAULTS, name: "Ghost", code: `ghost-${tag}` })).rejects.toThrow("audit write failed");
    failAudit.on = false;
    expect(await testDb().select().from(sites).where(eq(sites.code, `ghost-${tag}`))).toEqual([]);
  });
});

describe("stream actions", () => {
  let streamId = "";
  it("adds a stream with an audit event", async () => {
    actAs(org.session("administrator"));
    const r = await createStream(org.siteId, feed);
    expect(r.ok).toBe(true);
    streamId = r.ok ? r.data!.id : "";
    const [row] = await testDb().select().from(streams).where(eq(streams.id, streamId));
    expect(row).toMatchObject({ key: "feed", kind: "feed-gas", analysisKey: "ng", uncertaintyPct: "1.5", archivedAt: null });
    expect((await events(org.id, "stream")).map((e) => e.action)).toContain("stream.created");
  });

  it("reports a duplicate key on the key field and writes no audit row", async () => {
    actAs(org.session("administrator"));
    const before = (await events(org.id, "stream")).length;
    const r = await createStream(org.siteId, feed);
    expect(r).toMatchObject({ ok: false, errors: { key: expect.stringContaining('already has a stream with the key "feed"') } });
    expect((await events(org.id, "stream")).length).toBe(before);
  });

  it("sets up a stream no meter measures: no meter facts allowed, stored as not metered", async () => {
    actAs(org.session("administrator"));
    const vent = { ...STREAM_DEFAULTS, key: "vent", name: "CO2 vent", kind: "co2-vent" as const, unit: "t", metered: false };
    const refused = await createStream(org.siteId, { ...vent, uncertaintyPct: "2", meterTag: "FT-9" });
    expect(refused.ok).toBe(false);
    expect(Object.keys(refused.ok ? {} : refused.errors ?? {}).sort()).toEqual(["meterTag", "uncertaintyPct"]);
    const r = await createStream(org.siteId, vent);
    expect(r.ok).toBe(true);
    const [row] = await testDb().select().from(streams).where(eq(streams.id, r.ok ? r.data!.id : ""));
    expect(row).toMatchObject({ key: "vent", metered: false, uncertaintyPct: null, meterTag: null });
  });

  it("checks the rules of each kind with field names", async () => {
    actAs(org.session("administrator"));
    const r = await createStream(org.siteId, { ...STREAM_DEFAULTS, key: "purge", name: "Purge", kind: "purge-gas", unit: "MWh", indirectFactor: "0.2" });
    expect(r.ok).toBe(false);
    expect(Object.keys(r.ok ? {} : r.errors ?? {}).sort()).toEqual(["analysisKey", "fate", "indirectFactor", "unit"]);
  });

  it("refuses other roles, and another organisation's site or stream is not found", async () => {
    actAs(org.session("process_engineer"));
    expect(await createStream(org.siteId, { ...feed, key: "x" })).toMatchObject({ ok: false, message: "Your role does not allow you to set up streams." });
    actAs(other.session("administrator"));
    expect(await createStream(org.siteId, { ...feed, key: "x" })).toMatchObject({ ok: false, message: expect.stringMatching(/not found/) });
    expect(await editStream(org.siteId, streamId, { ...feed, name: "Stolen" })).toMatchObject({ ok: false, message: expect.stringMatching(/not found/) });
    expect(await archiveStream(org.siteId, streamId, true)).toMatchObject({ ok: false, message: expect.stringMatching(/not found/) });
  });

  it("archives and restores, never deletes, with before → after in the trail", async () => {
    actAs(org.session("administrator"));
    expect(await archiveStream(org.siteId, streamId, true)).toMatchObject({ ok: true });
    const [row] = await testDb().select().from(streams).where(eq(streams.id, streamId));
    expect(row.archivedAt).not.toBeNull();
    const ev = (await events(org.id, "stream")).find((e) => e.action === "stream.archived");
    expect(ev).toMatchObject({ before: expect.objectContaining({ archived: false }), after: expect.objectContaining({ archived: true }) });
    expect(await archiveStream(org.siteId, streamId, false)).toMatchObject({ ok: true });
    const [back] = await testDb().select().from(streams).where(eq(streams.id, streamId));
    expect(back.archivedAt).toBeNull();
  });

  it("a failing audit write rolls the stream change back", async () => {
    actAs(org.session("administrator"));
    failAudit.on = true;
    await expect(editStream(org.siteId, streamId, { ...feed, name: "Renamed feed" })).rejects.toThrow("audit write failed");
    failAudit.on = false;
    const [row] = await testDb().select().from(streams).where(eq(streams.id, streamId));
    expect(row.name).toBe("Feed gas");
  });
});
