import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditEvents, months, streams } from "@/db/schema";
import type { Role } from "@/lib/auth/roles";
import { closeTestDb, asLifecycle, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, errorOf, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

const monthRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/route");
const monthsRoute = await import("@/app/api/v1/sites/[siteId]/months/route");
const readingRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/readings/[stream]/route");
const analysesRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/analyses/route");
const analysisRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/analyses/[key]/route");

let org: FixtureOrg;
let other: FixtureOrg;
const NG = { CH4: "95.2", C2H6: "2.8", N2: "1.0", CO2: "1.0" };

const putMonth = (siteId: string, month: string, json: unknown) =>
  monthRoute.PUT(request("PUT", `/api/v1/sites/${siteId}/months/${month}`, { json }), ctx({ siteId, month }));
const getMonth = (siteId: string, month: string) => monthRoute.GET(request("GET", `/api/v1/sites/${siteId}/months/${month}`), ctx({ siteId, month }));
const putReading = (siteId: string, month: string, stream: string, body: { json?: unknown; text?: string }) =>
  readingRoute.PUT(request("PUT", `/api/v1/sites/${siteId}/months/${month}/readings/${stream}`, body), ctx({ siteId, month, stream }));
const putAnalysis = (siteId: string, month: string, key: string, json: unknown) =>
  analysisRoute.PUT(request("PUT", `/api/v1/sites/${siteId}/months/${month}/analyses/${key}`, { json }), ctx({ siteId, month, key }));

beforeAll(async () => {
  org = await createOrg(testDb(), "ApiMonths");
  other = await createOrg(testDb(), "ApiMonthsOther");
  for (const o of [org, other]) {
    await testDb().insert(streams).values([
      { siteId: o.siteId, key: "feed", name: "Feed", kind: "feed-gas", unit: "Sm3", analysisKey: "ng" },
      { siteId: o.siteId, key: "nh3", name: "Ammonia", kind: "ammonia", unit: "t" },
    ]);
  }
});
afterAll(closeTestDb);

describe("PUT and GET /api/v1/sites/{siteId}/months/{month}", () => {
  it("saves readings and an analysis, keeps every digit, and reads them back with the new version", async () => {
    actAs(org.session("process_engineer"));
    const res = await putMonth(org.siteId, "2026-04", {
      expectedVersion: 0,
      readings: [
        { stream: "feed", quantity: "26000000.123456789012345", unit: "Sm3" },
        { stream: "nh3", quantity: "45000", unit: "t" },
      ],
      analyses: [{ key: "ng", components: NG }],
    });
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ month: "2026-04", version: 1, changed: 3 });
    const got = await (await getMonth(org.siteId, "2026-04")).json();
    expect(got).toMatchObject({ month: "2026-04", state: "open", revision: 1, version: 1 });
    expect(got.readings.map((r: { stream: string; quantity: string }) => [r.stream, r.quantity])).toEqual([
      ["feed", "26000000.123456789012345"],
      ["nh3", "45000"],
    ]);
    // Stored as exact decimals: "1.0" and "1" are the same value.
    expect(got.analyses[0]).toMatchObject({ key: "ng", components: { ...NG, N2: "1", CO2: "1" } });
    const [event] = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.entityId, "2026-04/nh3")));
    expect(event).toMatchObject({ channel: "form", actorLabel: org.members.process_engineer.name });
  });

  it("keeps the digits of a JSON number too (read as text, never as a double)", async () => {
    actAs(org.session("process_engineer"));
    const text = '{"expectedVersion": 1, "readings": [{"stream": "nh3", "quantity": 45000.100000000000000001, "unit": "t"}]}';
    const res = await monthRoute.PUT(request("PUT", `/api/v1/sites/${org.siteId}/months/2026-04`, { text }), ctx({ siteId: org.siteId, month: "2026-04" }));
    expect(res.status).toBe(200);
    const got = await (await getMonth(org.siteId, "2026-04")).json();
    expect(got.readings.find((r: { stream: string }) => r.stream === "nh3").quantity).toBe("45000.100000000000000001");
  });

  it("answers 400 naming each bad field", async () => {
    actAs(org.session("process_engineer"));
    const res = await putMonth(org.siteId, "2026-05", { expectedVersion: 0, readings: [{ stream: "nh3", quantity: "1,200", unit: "t" }, { stream: "feed", quantity: "5", unit: "furlong" }] });
    expect(res.status).toBe(400);
    const err = await errorOf(res);
    expect(err.code).toBe("invalid_input");
    expect(err.issues?.map((i) => i.path)).toEqual(["readings[0].quantity", "readings[1].unit"]);
    const bad = await putMonth(org.siteId, "2026-05", { expectedVersion: 0, readings: [{ stream: "nosuch", quantity: "1", unit: "t" }] });
    expect((await errorOf(bad)).issues).toEqual([{ path: "readings[0].stream", message: expect.stringContaining('no stream "nosuch"') }]);
  });

  it("answers 400 for bad JSON and for a month that is not YYYY-MM", async () => {
    actAs(org.session("process_engineer"));
    const res = await monthRoute.PUT(request("PUT", `/api/v1/sites/${org.siteId}/months/2026-05`, { text: '{"expectedVersion": 0,' }), ctx({ siteId: org.siteId, month: "2026-05" }));
    expect(res.status).toBe(400);
    expect((await errorOf(res)).code).toBe("invalid_json");
    const month = await putMonth(org.siteId, "2026-13", { expectedVersion: 0 });
    expect(await errorOf(month)).toMatchObject({ code: "invalid_input", issues: [{ path: "month", message: expect.any(String) }] });
  });

  it("answers 409 with who changed what when the version is stale", async () => {
    actAs(org.session("process_engineer"));
    const res = await putMonth(org.siteId, "2026-04", { expectedVersion: 1, readings: [{ stream: "nh3", quantity: "1", unit: "t" }] });
    expect(res.status).toBe(409);
    const err = await errorOf(res);
    expect(err.code).toBe("version_conflict");
    expect(err.issues).toEqual([{ path: "readings.nh3", message: expect.stringMatching(/45000 → 45000.100000000000000001$/) }]);
  });

  it("refuses edits of a signed month with 409", async () => {
    actAs(org.session("process_engineer"));
    await putMonth(org.siteId, "2026-01", { expectedVersion: 0, readings: [{ stream: "nh3", quantity: "1", unit: "t" }] });
    await asLifecycle((tx) => tx.update(months).set({ state: "signed" }).where(and(eq(months.siteId, org.siteId), eq(months.period, "2026-01"))));
    const res = await putMonth(org.siteId, "2026-01", { expectedVersion: 1, readings: [{ stream: "nh3", quantity: "2", unit: "t" }] });
    expect(res.status).toBe(409);
    expect((await errorOf(res)).code).toBe("month_read_only");
  });

  it("answers 401 signed out, for reads and writes", async () => {
    actAs(null);
    expect((await getMonth(org.siteId, "2026-04")).status).toBe(401);
    const res = await putMonth(org.siteId, "2026-04", { expectedVersion: 1 });
    expect(res.status).toBe(401);
    expect(await errorOf(res)).toEqual({ code: "unauthorized", message: "Sign in first." });
  });

  it.each<Role>(["administrator", "environmental_officer", "signatory", "auditor"])("answers 403 to %s for writes but lets them read", async (role) => {
    actAs(org.session(role));
    const res = await putMonth(org.siteId, "2026-04", { expectedVersion: 2, readings: [{ stream: "nh3", quantity: "1", unit: "t" }] });
    expect(res.status).toBe(403);
    expect((await errorOf(res)).message).toBe("Your role does not allow you to enter monthly figures.");
    expect((await putReading(org.siteId, "2026-04", "nh3", { json: { quantity: "1", unit: "t" } })).status).toBe(403);
    expect((await putAnalysis(org.siteId, "2026-04", "ng", { components: NG })).status).toBe(403);
    expect((await getMonth(org.siteId, "2026-04")).status).toBe(200);
  });

  it("answers 404 for another organisation's site and for a malformed id, alike", async () => {
    actAs(org.session("process_engineer"));
    const read = await getMonth(other.siteId, "2026-04");
    expect(read.status).toBe(404);
    expect(await errorOf(read)).toEqual({ code: "not_found", message: "The site was not found." });
    expect((await putMonth(other.siteId, "2026-04", { expectedVersion: 0, readings: [{ stream: "nh3", quantity: "1", unit: "t" }] })).status).toBe(404);
    expect((await putReading(other.siteId, "2026-04", "nh3", { json: { quantity: "1", unit: "t" } })).status).toBe(404);
    expect((await getMonth("not-a-uuid", "2026-04")).status).toBe(404);
  });

  it("answers 413 for a body over 1 MiB, saving nothing", async () => {
    actAs(org.session("process_engineer"));
    const text = JSON.stringify({ expectedVersion: 0, note: "x".repeat(1024 * 1024) });
    const res = await monthRoute.PUT(request("PUT", `/api/v1/sites/${org.siteId}/months/2026-06`, { text }), ctx({ siteId: org.siteId, month: "2026-06" }));
    expect(res.status).toBe(413);
    expect(await errorOf(res)).toMatchObject({ code: "payload_too_large", message: expect.stringContaining("1 MiB") });
  });
});

describe("one reading, one analysis", () => {
  it("PUT a reading without a version saves against the current one", async () => {
    actAs(org.session("process_engineer"));
    const res = await putReading(org.siteId, "2026-04", "feed", { json: { quantity: "26100000", unit: "Sm3", source: "invoice", note: "from the supplier" } });
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ stream: "feed", version: 3, changed: 1 });
  });

  it("PUT a reading with a stale version is 409; bad fields name the body's own paths", async () => {
    actAs(org.session("process_engineer"));
    expect((await putReading(org.siteId, "2026-04", "feed", { json: { quantity: "1", unit: "Sm3", expectedVersion: 1 } })).status).toBe(409);
    const bad = await putReading(org.siteId, "2026-04", "nh3", { json: { quantity: "-3", unit: "Sm3" } });
    expect(bad.status).toBe(400);
    expect((await errorOf(bad)).issues?.map((i) => i.path)).toEqual(["quantity"]);
    const unit = await putReading(org.siteId, "2026-04", "nh3", { json: { quantity: "3", unit: "Sm3" } });
    expect((await errorOf(unit)).issues).toEqual([{ path: "unit", message: expect.stringContaining("not a unit for ammonia") }]);
    const stream = await putReading(org.siteId, "2026-04", "nosuch", { json: { quantity: "3", unit: "t" } });
    expect((await errorOf(stream)).issues).toEqual([{ path: "stream", message: expect.stringContaining('no stream "nosuch"') }]);
  });

  it("PUT an analysis by key, GET the month's analyses", async () => {
    actAs(org.session("process_engineer"));
    const res = await putAnalysis(org.siteId, "2026-04", "ng", { components: { CH4: "95.0", C2H6: "3.0", N2: "1.0", CO2: "1.0" }, laboratory: "Lab A" });
    expect(res.status).toBe(200);
    const list = await analysesRoute.GET(request("GET", `/api/v1/sites/${org.siteId}/months/2026-04/analyses`), ctx({ siteId: org.siteId, month: "2026-04" }));
    const body = await list.json();
    expect(body.analyses).toEqual([expect.objectContaining({ key: "ng", components: { CH4: "95", C2H6: "3", N2: "1", CO2: "1" } })]);
  });

  it("an analysis that does not sum to 100 or names an unknown component is 400 with paths", async () => {
    actAs(org.session("process_engineer"));
    const res = await putAnalysis(org.siteId, "2026-04", "ng", { components: { CH4: "90", Kr: "1" } });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).issues?.map((i) => i.path)).toEqual(["components.Kr"]);
    const sum = await putAnalysis(org.siteId, "2026-04", "ng", { components: { CH4: "90" } });
    expect((await errorOf(sum)).issues?.map((i) => i.path)).toEqual(["components"]);
    const key = await putAnalysis(org.siteId, "2026-04", "!bad", { components: NG });
    expect((await errorOf(key)).issues?.map((i) => i.path)).toEqual(["key"]);
  });
});

describe("GET /api/v1/sites/{siteId}/months?year=", () => {
  const list = (siteId: string, year?: string) =>
    monthsRoute.GET(request("GET", `/api/v1/sites/${siteId}/months${year ? `?year=${year}` : ""}`), ctx({ siteId }));

  it("lists the year's months with state, revision and version", async () => {
    actAs(org.session("auditor"));
    const body = await (await list(org.siteId, "2026")).json();
    expect(body.months.map((m: { month: string; state: string }) => [m.month, m.state])).toEqual([
      ["2026-01", "signed"],
      ["2026-04", "open"],
    ]);
    expect(body.months[1]).toMatchObject({ revision: 1, version: 4 });
  });
  it("400 for a bad year, 404 for another organisation, 401 signed out", async () => {
    actAs(org.session("auditor"));
    expect(await errorOf(await list(org.siteId, "26"))).toMatchObject({ issues: [{ path: "year" }] });
    expect((await list(other.siteId, "2026")).status).toBe(404);
    actAs(null);
    expect((await list(org.siteId, "2026")).status).toBe(401);
  });
});
