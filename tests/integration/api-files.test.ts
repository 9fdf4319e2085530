import { readFileSync } from "node:fs";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditEvents, streams } from "@/db/schema";
import type { Role } from "@/lib/auth/roles";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { EXAMPLE_TEXT, addExampleStreams, exampleFor, ctx, errorOf, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

const calculateRoute = await import("@/app/api/v1/calculate/route");
const resultRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/result/route");
const exportRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/export/route");
const importRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/import/route");
const monthRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/route");

let org: FixtureOrg;
let other: FixtureOrg;

const calc = (text: string) => calculateRoute.POST(request("POST", "/api/v1/calculate", { text }), ctx({}));
const importFile = (siteId: string, month: string, text: string, query = "") =>
  importRoute.POST(request("POST", `/api/v1/sites/${siteId}/months/${month}/import${query}`, { text }), ctx({ siteId, month }));
const exportMonth = (siteId: string, month: string) => exportRoute.GET(request("GET", `/api/v1/sites/${siteId}/months/${month}/export`), ctx({ siteId, month }));
const result = (siteId: string, month: string) => resultRoute.GET(request("GET", `/api/v1/sites/${siteId}/months/${month}/result`), ctx({ siteId, month }));
const figures = async (siteId: string, month: string) => {
  const b = await (await monthRoute.GET(request("GET", `/api/v1/sites/${siteId}/months/${month}`), ctx({ siteId, month }))).json();
  return { readings: b.readings.map((r: { stream: string; quantity: string; unit: string }) => [r.stream, r.quantity, r.unit]), analyses: b.analyses.map((a: { key: string; components: unknown }) => [a.key, a.components]) };
};

beforeAll(async () => {
  org = await createOrg(testDb(), "ApiFiles");
  other = await createOrg(testDb(), "ApiFilesOther");
  await addExampleStreams(testDb(), org.siteId);
  await addExampleStreams(testDb(), other.siteId);
});
afterAll(closeTestDb);

describe("POST /api/v1/calculate", () => {
  it("returns the result document of a plant-month file, for any member", async () => {
    actAs(org.session("auditor"));
    const res = await calc(EXAMPLE_TEXT);
    expect(res.status).toBe(200);
    const doc = await res.json();
    expect(doc).toMatchObject({ format: "synledger.result/1", month: "2026-03" });
    expect(typeof doc.balances.carbon.closure_pct).toBe("string");
  });

  it("answers 400 with the JSON path of a bad figure, and of a syntax error", async () => {
    actAs(org.session("signatory"));
    const res = await calc(readFileSync("examples/bad-estuary-2026-03.json", "utf8"));
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toMatchObject({ code: "invalid_plant_month", issues: [{ path: "streams[4].quantity", message: expect.stringContaining("negative") }] });
    const syntax = await calc('{"format": ');
    expect((await errorOf(syntax)).issues?.[0].message).toMatch(/line 1 column/);
  });

  it("401 signed out; 413 over 1 MiB", async () => {
    actAs(null);
    expect((await calc(EXAMPLE_TEXT)).status).toBe(401);
    actAs(org.session("auditor"));
    expect((await calc(" ".repeat(1024 * 1024 + 1))).status).toBe(413);
  });
});

describe("import, result and export of a stored month", () => {
  it("imports the example file: readings and analyses in one save, channel import", async () => {
    actAs(org.session("process_engineer"));
    const res = await importFile(org.siteId, "2026-03", exampleFor(org));
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ month: "2026-03", version: 1, readings: 9, analyses: 2 });
    const events = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.entity, "reading")));
    expect(new Set(events.map((e) => e.channel))).toEqual(new Set(["import"]));
  });

  it("GET result computes the stored month like the file itself", async () => {
    actAs(org.session("environmental_officer"));
    const stored = await (await result(org.siteId, "2026-03")).json();
    const direct = await (await calc(EXAMPLE_TEXT)).json();
    expect(stored).toMatchObject({ state: "open", version: 1 });
    expect(stored.result.balances).toEqual(direct.balances);
    expect(stored.result.streams.map((s: { id: string; kmol: string }) => [s.id, s.kmol])).toEqual(direct.streams.map((s: { id: string; kmol: string }) => [s.id, s.kmol]));
  });

  it("export → import round trip gives the same figures", async () => {
    actAs(org.session("auditor"));
    const res = await exportMonth(org.siteId, "2026-03");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="synledger-w[0-9a-f]{8}-2026-03\.plant-month\.json"$/);
    const file = await res.text();
    actAs(org.session("process_engineer"));
    const copy = await importFile(org.siteId, "2026-02", file.replace('"month": "2026-03"', '"month": "2026-02"'));
    expect(copy.status).toBe(200);
    actAs(org.session("auditor"));
    expect(await figures(org.siteId, "2026-02")).toEqual(await figures(org.siteId, "2026-03"));
    const again = await (await exportMonth(org.siteId, "2026-02")).text();
    expect(again).toBe(file.replace('"month": "2026-03"', '"month": "2026-02"'));
  });

  it("names streams[i].id for a stream the site does not have, and saves nothing", async () => {
    actAs(org.session("process_engineer"));
    const doc = JSON.parse(exampleFor(org));
    doc.month = "2026-05";
    doc.streams[2].id = "air-2";
    const res = await importFile(org.siteId, "2026-05", JSON.stringify(doc));
    expect(res.status).toBe(400);
    expect((await errorOf(res)).issues).toEqual([{ path: "streams[2].id", message: expect.stringContaining('has no stream "air-2"') }]);
    expect((await figures(org.siteId, "2026-05")).readings).toEqual([]);
  });

  it("names the month of a file sent to another month, and the kind that differs from the site's", async () => {
    actAs(org.session("process_engineer"));
    const doc = JSON.parse(exampleFor(org));
    doc.streams[3].kind = "fuel-gas";
    delete doc.streams[3].fate;
    const res = await importFile(org.siteId, "2026-06", JSON.stringify(doc));
    expect((await errorOf(res)).issues?.map((i) => i.path)).toEqual(["month", "streams[3].kind"]);
  });

  it("a bad file is 400 with its JSON path; a stale expectedVersion is 409", async () => {
    actAs(org.session("process_engineer"));
    const bad = await importFile(org.siteId, "2026-03", exampleFor(org, readFileSync("examples/bad-estuary-2026-03.json", "utf8")));
    expect(await errorOf(bad)).toMatchObject({ code: "invalid_plant_month", issues: [{ path: "streams[4].quantity" }] });
    const stale = await importFile(org.siteId, "2026-03", exampleFor(org), "?expectedVersion=0");
    expect(stale.status).toBe(409);
  });

  it.each<Role>(["administrator", "environmental_officer", "signatory", "auditor"])("import is 403 for %s", async (role) => {
    actAs(org.session(role));
    const res = await importFile(org.siteId, "2026-07", EXAMPLE_TEXT.replace('"month": "2026-03"', '"month": "2026-07"'));
    expect(res.status).toBe(403);
    expect((await errorOf(res)).message).toBe("Your role does not allow you to import monthly figures.");
  });

  it("another organisation's site is 404 for result, export and import; signed out is 401", async () => {
    actAs(org.session("process_engineer"));
    expect((await result(other.siteId, "2026-03")).status).toBe(404);
    expect((await exportMonth(other.siteId, "2026-03")).status).toBe(404);
    expect((await importFile(other.siteId, "2026-03", EXAMPLE_TEXT)).status).toBe(404);
    actAs(null);
    expect((await result(org.siteId, "2026-03")).status).toBe(401);
    expect((await exportMonth(org.siteId, "2026-03")).status).toBe(401);
    expect((await importFile(org.siteId, "2026-03", exampleFor(org))).status).toBe(401);
  });

  it("a month nobody started is 404; a stored month that cannot be computed is 422 with paths", async () => {
    actAs(org.session("process_engineer"));
    expect((await result(org.siteId, "2025-01")).status).toBe(404);
    await testDb().update(streams).set({ analysisKey: null }).where(and(eq(streams.siteId, org.siteId), eq(streams.key, "fuel")));
    try {
      const res = await result(org.siteId, "2026-03");
      expect(res.status).toBe(422);
      expect(await errorOf(res)).toMatchObject({ code: "not_computable", issues: [{ path: "streams[1].analysis", message: expect.stringContaining("needs an analysis") }] });
    } finally {
      await testDb().update(streams).set({ analysisKey: "estuary-grid-gas" }).where(and(eq(streams.siteId, org.siteId), eq(streams.key, "fuel")));
    }
  });
});
