import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditEvents, importBatches, importMappings, months, readings, streams } from "@/db/schema";
import type { ImportMappingInput } from "@/lib/import/mapping";
import { closeTestDb, asLifecycle, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";

vi.mock("@/auth", () => import("../support/mock-auth"));

const preview = (await import("@/app/api/v1/sites/[siteId]/imports/preview/route")).POST;
const commit = (await import("@/app/api/v1/sites/[siteId]/imports/commit/route")).POST;

let org: FixtureOrg;
let other: FixtureOrg;

const MAPPING: ImportMappingInput = {
  name: "Historian daily totals",
  layout: "long",
  delimiter: ",",
  dateColumn: "Date",
  dateFormat: "DD/MM/YYYY",
  streamColumn: "Tag",
  quantityColumn: "Total",
  unitColumn: "Unit",
};

const BAD = ["Date,Tag,Total,Unit", "01/03/2026,IT-FQ-101,850000.5,Sm3", "31/02/2026,nh3,1449,t", "02/03/2026,nh3,-3,t", "02/03/2026,IT-FQ-999,1,Sm3", "03/03/2026,nh3,1451.3,Sm3"].join("\n");
const GOOD = [
  "Date,Tag,Total,Unit",
  "01/03/2026,IT-FQ-101,850000.5,Sm3",
  "01/03/2026,nh3,1450.2,t",
  "02/03/2026,IT-FQ-101,851000,Sm3",
  "02/03/2026,nh3,1449,t",
  "03/03/2026,IT-FQ-101,849999.25,Sm3",
  "03/03/2026,nh3,1451.3,t",
  "01/04/2026,IT-FQ-101,860000,Sm3",
].join("\n");

function call(route: typeof commit, siteId: string, text: string, opts: { mapping?: ImportMappingInput; confirm?: boolean; accept?: string; name?: string } = {}) {
  const form = new FormData();
  form.set("file", new File([text], opts.name ?? "daily.csv", { type: "text/csv" }));
  form.set("mapping", JSON.stringify(opts.mapping ?? MAPPING));
  if (opts.confirm) form.set("confirmReplace", "true");
  const req = new Request(`http://test/api/v1/sites/${siteId}/imports`, { method: "POST", body: form, headers: opts.accept ? { accept: opts.accept } : {} });
  return route(req, { params: Promise.resolve({ siteId }) });
}

async function siteReadings(period: string) {
  return testDb()
    .select({ stream: streams.key, quantity: readings.quantity, unit: readings.unit })
    .from(readings)
    .innerJoin(months, eq(months.id, readings.monthId))
    .innerJoin(streams, eq(streams.id, readings.streamId))
    .where(and(eq(months.siteId, org.siteId), eq(months.period, period)))
    .orderBy(streams.key);
}
const importAudit = () => testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.channel, "import")));
const batches = () => testDb().select().from(importBatches).where(eq(importBatches.siteId, org.siteId));

beforeAll(async () => {
  org = await createOrg(testDb(), "Import");
  other = await createOrg(testDb(), "ImportOther");
  await testDb().insert(streams).values([
    { siteId: org.siteId, key: "feed", name: "Feed gas", kind: "feed-gas", unit: "Sm3", analysisKey: "ng", meterTag: "IT-FQ-101" },
    { siteId: org.siteId, key: "nh3", name: "Ammonia", kind: "ammonia", unit: "t", meterTag: "IT-WQ-501" },
  ]);
});
afterAll(closeTestDb);

describe("CSV import", () => {
  it("a bad file writes nothing: no readings, no batch, no audit; every bad row is named", async () => {
    actAs(org.session("process_engineer"));
    const res = await call(commit, org.siteId, BAD);
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.code).toBe("invalid_rows");
    expect(body.error.issues).toEqual([
      { path: "row 3, Date", message: '"31/02/2026": 2026-02 has no day 31 (read as DD/MM/YYYY)' },
      { path: "row 4, Total", message: '"-3" is negative; a quantity cannot be below zero' },
      { path: "row 5, Tag", message: `no stream or meter tag "IT-FQ-999" at ${"Import works"} ${org.name.split(" ")[1]}` },
      { path: "row 6, Unit", message: 'Sm3 is not a unit for the ammonia stream "nh3" (use t, kg)' },
    ]);
    expect(await siteReadings("2026-03")).toEqual([]);
    expect(await testDb().select().from(months).where(eq(months.siteId, org.siteId))).toEqual([]);
    expect(await batches()).toEqual([]);
    expect(await importAudit()).toEqual([]);
    expect(await testDb().select().from(importMappings).where(eq(importMappings.siteId, org.siteId))).toEqual([]);
  });

  it("the preview of the corrected file shows the month totals and writes nothing", async () => {
    actAs(org.session("process_engineer"));
    const res = await call(preview, org.siteId, GOOD);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({ issues: [], canCommit: true, previousImport: null, rowCount: 7, valueCount: 7 });
    expect(body.months.map((m: { month: string; readings: { stream: string; quantity: string }[] }) => [m.month, m.readings.map((r) => `${r.stream}=${r.quantity}`)])).toEqual([
      ["2026-03", ["feed=2550999.75", "nh3=4350.5"]],
      ["2026-04", ["feed=860000"]],
    ]);
    expect(await batches()).toEqual([]);
  });

  it("commits the corrected file in one go: totals by hand, audit with channel import, mapping saved", async () => {
    actAs(org.session("process_engineer"));
    const res = await call(commit, org.siteId, GOOD);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.months).toEqual([
      { month: "2026-03", readings: 2, analyses: 0, changed: 2, version: 1 },
      { month: "2026-04", readings: 1, analyses: 0, changed: 1, version: 1 },
    ]);
    // 850000.5 + 851000 + 849999.25 = 2550999.75 Sm3; 1450.2 + 1449 + 1451.3 = 4350.5 t
    expect(await siteReadings("2026-03")).toEqual([
      { stream: "feed", quantity: "2550999.75", unit: "Sm3" },
      { stream: "nh3", quantity: "4350.5", unit: "t" },
    ]);
    expect(await siteReadings("2026-04")).toEqual([{ stream: "feed", quantity: "860000", unit: "Sm3" }]);
    const events = await importAudit();
    expect(events.map((e) => `${e.action} ${e.entityId ?? ""}`).sort()).toEqual([
      `import.committed ${body.batchId}`,
      "reading.added 2026-03/feed",
      "reading.added 2026-03/nh3",
      "reading.added 2026-04/feed",
    ]);
    expect(events.every((e) => e.actorUserId === org.members.process_engineer.id)).toBe(true);
    const [batch] = await batches();
    expect(batch).toMatchObject({ fileName: "daily.csv", rowCount: 7, importedBy: org.members.process_engineer.id });
    expect(batch.fileSha256).toMatch(/^[0-9a-f]{64}$/);
    const [saved] = await testDb().select().from(importMappings).where(eq(importMappings.siteId, org.siteId));
    expect(saved).toMatchObject({ name: "Historian daily totals", mapping: expect.objectContaining({ layout: "long", streamColumn: "Tag" }) });
  });

  it("detects a second import of the same file, with the date of the first; a confirmed re-import replaces", async () => {
    actAs(org.session("process_engineer"));
    const pre = await (await call(preview, org.siteId, GOOD, { name: "renamed.csv" })).json();
    expect(pre.previousImport).toMatchObject({ fileName: "daily.csv" });
    const res = await call(commit, org.siteId, GOOD, { name: "renamed.csv" });
    expect(res.status).toBe(409);
    const body = await res.json();
    expect(body.error.code).toBe("already_imported");
    expect(body.error.message).toMatch(/^This file was already imported on \d{2} \w{3} \d{4} \d{2}:\d{2} UTC by process_engineer \w+ \(as "daily.csv"\)\. Confirm a re-import/);
    expect(await batches()).toHaveLength(1);

    const again = await call(commit, org.siteId, GOOD, { confirm: true });
    expect(again.status).toBe(200);
    const replaced = await again.json();
    expect(replaced.replaced).toMatchObject({ batchId: (await batches()).find((b) => b.id !== replaced.batchId)!.id });
    expect(replaced.changed).toBe(0); // same figures: the month service records no reading change
    expect((await importAudit()).filter((e) => e.action === "import.replaced")).toHaveLength(1);
  });

  it("a read-only month refuses the whole file, naming the month", async () => {
    actAs(org.session("process_engineer"));
    await asLifecycle((tx) => tx.update(months).set({ state: "signed" }).where(and(eq(months.siteId, org.siteId), eq(months.period, "2026-03"))));
    const before = (await importAudit()).length;
    const file = "Date,Tag,Total,Unit\n05/03/2026,nh3,1,t\n05/05/2026,nh3,2,t\n";
    const pre = await (await call(preview, org.siteId, file)).json();
    expect(pre.canCommit).toBe(false);
    expect(pre.months.map((m: { month: string; readOnly: boolean }) => [m.month, m.readOnly])).toEqual([["2026-03", true], ["2026-05", false]]);
    const res = await call(commit, org.siteId, file);
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatchObject({ code: "month_read_only", message: expect.stringMatching(/^2026-03 is signed: its figures can no longer be changed, so nothing was imported/) });
    expect(await siteReadings("2026-05")).toEqual([]);
    expect(await testDb().select().from(months).where(and(eq(months.siteId, org.siteId), eq(months.period, "2026-05")))).toEqual([]);
    expect((await importAudit()).length).toBe(before);
  });

  it("streams progress lines to a client that asks for them", async () => {
    actAs(org.session("process_engineer"));
    const lines = ["Date,Tag,Total,Unit"];
    for (let d = 1; d <= 30; d++) lines.push(`${String(d).padStart(2, "0")}/06/2026,nh3,0.1,t`);
    const res = await call(commit, org.siteId, lines.join("\n"), { accept: "application/x-ndjson" });
    expect(res.headers.get("content-type")).toMatch(/^application\/x-ndjson/);
    const events = (await res.text()).trim().split("\n").map((l) => JSON.parse(l));
    expect(events.map((e) => e.phase ?? e.type)).toEqual(["parse", "validate", "commit", "result"]);
    expect(events.at(-1)).toMatchObject({ status: 200, body: { months: [{ month: "2026-06", changed: 1 }] } });
    expect(await siteReadings("2026-06")).toEqual([{ stream: "nh3", quantity: "3", unit: "t" }]);
  });

  it("refuses files over the size and row limits with the limit named", async () => {
    actAs(org.session("process_engineer"));
    const big = await call(preview, org.siteId, "x".repeat(10 * 1024 * 1024 + 1));
    expect(big.status).toBe(413);
    expect((await big.json()).error.message).toMatch(/limit is 10\.0 MiB/);
    const many = await call(preview, org.siteId, "Date,Tag,Total,Unit\n" + "01/03/2026,nh3,1,t\n".repeat(200_001));
    expect(many.status).toBe(413);
    expect((await many.json()).error).toMatchObject({ code: "too_many_rows", message: expect.stringMatching(/more than 200.000 data rows/) });
  });

  it("answers 401 signed out, 403 to roles that do not enter figures, 404 for another organisation's site", async () => {
    actAs(null);
    expect((await call(preview, org.siteId, GOOD)).status).toBe(401);
    for (const role of ["auditor", "environmental_officer", "signatory", "administrator"] as const) {
      actAs(org.session(role));
      expect((await call(commit, org.siteId, GOOD)).status).toBe(403);
    }
    actAs(other.session("process_engineer"));
    expect((await call(preview, org.siteId, GOOD)).status).toBe(404);
    expect((await call(commit, org.siteId, GOOD, { confirm: true })).status).toBe(404);
    expect((await call(commit, "not-a-uuid", GOOD)).status).toBe(404);
  });
});
