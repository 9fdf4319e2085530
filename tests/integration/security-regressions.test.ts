/**
 * One reproduction per finding of the hostile review (issue 11), each against the real handlers
 * and PostgreSQL. Findings that need the real HTTP server (forwarding headers, the proxy's body
 * buffering, response headers set by next.config) are reproduced in tests/e2e/security.ts; the
 * sign-in lock-out in sign-in.test.ts.
 */
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { apiTokens, sites, userSessions, users } from "@/db/schema";
import { endSession } from "@/db/queries/sessions";
import { hashApiToken } from "@/lib/api/tokens";
import { LIMITS } from "@/lib/balance/limits";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { addExampleStreams, ctx, errorOf, EXAMPLE_TEXT, exampleFor, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

const yearExport = await import("@/app/api/v1/sites/[siteId]/years/[year]/export/route");
const calculateRoute = await import("@/app/api/v1/calculate/route");
const readingRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/readings/[stream]/route");
const importRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/import/route");
const sitesRoute = await import("@/app/api/v1/sites/route");

let org: FixtureOrg;
let other: FixtureOrg;

beforeAll(async () => {
  org = await createOrg(testDb(), "Hostile11");
  other = await createOrg(testDb(), "Hostile11b");
  await addExampleStreams(testDb(), org.siteId);
  await addExampleStreams(testDb(), other.siteId);
});
afterAll(closeTestDb);

const exportYear = (siteId: string, year: string, query: string) =>
  yearExport.GET(request("GET", `/api/v1/sites/${siteId}/years/${encodeURIComponent(year)}/export?${query}`), ctx({ siteId, year }));
const putReading = (siteId: string, month: string, stream: string, json: unknown, token?: string) =>
  readingRoute.PUT(request("PUT", `/api/v1/sites/${siteId}/months/${month}/readings/${stream}`, { json, token }), ctx({ siteId, month, stream }));

describe("year export: the path's year never becomes a pattern", () => {
  it("a backtracking pattern as the year is a 400 at once, whatever the month", async () => {
    actAs(org.session("auditor"));
    const t0 = performance.now();
    const res = await exportYear(org.siteId, "(a+)+", `format=csv&month=${"a".repeat(40)}!`);
    const ms = performance.now() - t0;
    expect(res.status).toBe(400);
    expect((await errorOf(res)).issues).toEqual([{ path: "year", message: "must be four digits, 2000..2100" }]);
    expect(ms).toBeLessThan(250);
  });

  it("an unbalanced parenthesis as the year is a 400, not a 500", async () => {
    actAs(org.session("auditor"));
    const res = await exportYear(org.siteId, "(", "format=csv&month=2026-01");
    expect(res.status).toBe(400);
  });

  it("a month of another year is named as the month's problem", async () => {
    actAs(org.session("auditor"));
    const res = await exportYear(org.siteId, "2026", "format=csv&month=2025-03");
    expect(res.status).toBe(400);
    expect((await errorOf(res)).issues?.[0].path).toBe("month");
  });
});

describe("CSV exports carry no formula, header lines included", () => {
  const NAME = 'X,=HYPERLINK("http://evil.example/x")';

  beforeAll(async () => {
    await testDb().update(sites).set({ name: NAME }).where(eq(sites.id, org.siteId));
    actAs(org.session("process_engineer"));
    const text = EXAMPLE_TEXT.replace(/"site": "[^"]*"/, `"site": ${JSON.stringify(NAME)}`);
    const res = await importRoute.POST(request("POST", "/i", { text }), ctx({ siteId: org.siteId, month: "2026-03" }));
    expect(res.status).toBe(200);
  });

  const formulaCells = (csv: string) =>
    Papa.parse<string[]>(csv.trim(), { skipEmptyLines: true })
      .data.flat()
      .filter((cell) => /^[=+\-@\t\r]/.test(cell) && !/^-?\d+(\.\d+)?([eE][+-]?\d+)?$/.test(cell));

  it.each(["table=months", "table=sources", "table=rule-sets", "month=2026-03"])("the year export (%s) has none", async (query) => {
    actAs(org.session("auditor"));
    const res = await exportYear(org.siteId, "2026", `format=csv&${query}`);
    expect(res.status).toBe(200);
    const csv = await res.text();
    expect(csv).toContain("HYPERLINK"); // the name is there, as text
    expect(formulaCells(csv)).toEqual([]);
    // Each comment line is one cell, so a comma in the name starts no second cell.
    const comments = Papa.parse<string[]>(csv.trim()).data.filter((row) => row[0]?.startsWith("#"));
    expect(comments.length).toBeGreaterThan(0);
    expect(comments.every((row) => row.length === 1)).toBe(true);
  });
});

describe("bounds of one plant-month", () => {
  const doc = JSON.parse(EXAMPLE_TEXT) as { streams: Record<string, unknown>[] };
  const withStreams = (n: number) => {
    const extra = Array.from({ length: n - doc.streams.length }, (_, i) => ({ id: `extra-${i}`, kind: "electricity-import", quantity: "1", unit: "MWh" }));
    return JSON.stringify({ ...doc, streams: [...doc.streams, ...extra] });
  };

  it(`6 000 streams (about 850 KB) are refused before any calculation, naming streams and the bound of ${LIMITS.streams}`, async () => {
    actAs(org.session("auditor"));
    const body = withStreams(6000);
    expect(body.length).toBeLessThan(LIMITS.fileBytes);
    const t0 = performance.now();
    const res = await calculateRoute.POST(request("POST", "/c", { text: body }), ctx({}));
    const ms = performance.now() - t0;
    expect(res.status).toBe(400);
    expect((await errorOf(res)).issues).toEqual([{ path: "streams", message: `holds more than ${LIMITS.streams} streams` }]);
    expect(ms).toBeLessThan(1000);
  });

  it("exactly the bound is accepted", async () => {
    actAs(org.session("auditor"));
    const res = await calculateRoute.POST(request("POST", "/c", { text: withStreams(LIMITS.streams) }), ctx({}));
    expect(res.status).toBe(200);
  });

  it("a quantity of 131 072 nines is refused when entered, naming the field and the bound", async () => {
    actAs(org.session("process_engineer"));
    const res = await putReading(org.siteId, "2026-04", "nh3", { quantity: "9".repeat(131_072), unit: "t" });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).issues).toEqual([{ path: "quantity", message: `Quantity is longer than ${LIMITS.numberChars} characters` }]);
  });

  it(`a note over ${LIMITS.noteChars} characters is refused; one of ${LIMITS.noteChars} is kept`, async () => {
    actAs(org.session("process_engineer"));
    const over = await putReading(org.siteId, "2026-04", "nh3", { quantity: "100", unit: "t", note: "n".repeat(LIMITS.noteChars + 1) });
    expect((await errorOf(over)).issues).toEqual([{ path: "note", message: `Note is longer than ${LIMITS.noteChars} characters` }]);
    const at = await putReading(org.siteId, "2026-04", "nh3", { quantity: "100", unit: "t", note: "n".repeat(LIMITS.noteChars) });
    expect(at.status).toBe(200);
  });
});

describe("text that cannot be stored", () => {
  it("a lone surrogate in a note is a 400 naming where it is, not a 500", async () => {
    actAs(org.session("process_engineer"));
    const res = await readingRoute.PUT(
      request("PUT", "/r", { text: '{"quantity":"5","unit":"t","note":"x\\ud800y"}', headers: { "content-type": "application/json" } }),
      ctx({ siteId: org.siteId, month: "2026-04", stream: "nh3" }),
    );
    expect(res.status).toBe(400);
    const e = await errorOf(res);
    expect(e.code).toBe("invalid_json");
    expect(e.message).toContain("lone UTF-16 surrogate");
    expect(e.message).toContain("column 35"); // the string that holds it
  });

  it("duplicate keys in a JSON body are refused, naming the key", async () => {
    actAs(org.session("process_engineer"));
    const res = await readingRoute.PUT(request("PUT", "/r", { text: '{"quantity":"5","unit":"t","quantity":"7"}' }), ctx({ siteId: org.siteId, month: "2026-04", stream: "nh3" }));
    expect(res.status).toBe(400);
    expect((await errorOf(res)).message).toContain('duplicate property name "quantity"');
  });
});

describe("one month, many senders", () => {
  it("18 concurrent token PUTs to 9 streams without expectedVersion all succeed, each version once", async () => {
    const token = `syl_h11_${randomUUID().replace(/-/g, "")}`;
    await testDb()
      .insert(apiTokens)
      .values({ organisationId: other.id, siteId: other.siteId, label: "plant system", prefix: token.slice(0, 12), tokenHash: hashApiToken(token), scope: "readings:write" });
    actAs(null);
    const doc = JSON.parse(EXAMPLE_TEXT) as { streams: { id: string; unit: string }[] };
    const nine = doc.streams.slice(0, 9);
    expect(nine).toHaveLength(9);
    const sends = nine.flatMap((s) => [1, 2].map((k) => putReading(other.siteId, "2026-05", s.id, { quantity: String(1000 + k), unit: s.unit }, token)));
    const answers = await Promise.all(sends);
    const bodies = await Promise.all(answers.map((r) => r.json()));
    expect(answers.map((r) => r.status)).toEqual(Array(18).fill(200));
    expect(new Set(bodies.map((b: { version: number }) => b.version))).toEqual(new Set(Array.from({ length: 18 }, (_, i) => i + 1)));
  });
});

describe("an archived site takes no figures", () => {
  it("by session and by token: 409 site_archived", async () => {
    const o = await createOrg(testDb(), "Archived11");
    await addExampleStreams(testDb(), o.siteId);
    const token = `syl_h11_${randomUUID().replace(/-/g, "")}`;
    await testDb().insert(apiTokens).values({ organisationId: o.id, siteId: o.siteId, label: "plant", prefix: token.slice(0, 12), tokenHash: hashApiToken(token), scope: "readings:write" });
    await testDb().update(sites).set({ archivedAt: new Date() }).where(eq(sites.id, o.siteId));
    actAs(o.session("process_engineer"));
    const bySession = await putReading(o.siteId, "2026-04", "nh3", { quantity: "10", unit: "t" });
    actAs(null);
    const byToken = await putReading(o.siteId, "2026-04", "nh3", { quantity: "10", unit: "t" }, token);
    for (const res of [bySession, byToken]) {
      expect(res.status).toBe(409);
      expect((await errorOf(res)).code).toBe("site_archived");
    }
  });
});

describe("a plant-month file names its site", () => {
  it("a file of another site is refused, naming site", async () => {
    actAs(other.session("process_engineer"));
    const res = await importRoute.POST(request("POST", "/i", { text: EXAMPLE_TEXT }), ctx({ siteId: other.siteId, month: "2026-03" }));
    expect(res.status).toBe(400);
    expect((await errorOf(res)).issues).toEqual([{ path: "site", message: expect.stringContaining(`but it was sent to ${other.siteName}`) }]);
    const own = await importRoute.POST(request("POST", "/i", { text: exampleFor(other) }), ctx({ siteId: other.siteId, month: "2026-03" }));
    expect(own.status).toBe(200);
  });
});

describe("sessions end when they should", () => {
  const listSites = () => sitesRoute.GET(request("GET", "/api/v1/sites"), ctx({}));

  it("a user disabled in the database reads nothing more with the session they hold", async () => {
    const o = await createOrg(testDb(), "Disabled11");
    actAs(o.session("auditor"));
    expect((await listSites()).status).toBe(200);
    await testDb().update(users).set({ disabled: true }).where(eq(users.id, o.members.auditor.id));
    expect((await listSites()).status).toBe(401);
  });

  it("a copy of the cookie after sign-out reads nothing", async () => {
    const o = await createOrg(testDb(), "SignedOut11");
    const copy = o.session("auditor");
    actAs(copy);
    expect((await listSites()).status).toBe(200);
    await endSession(testDb(), o.members.auditor.id, o.members.auditor.sessionId, "signed-out");
    actAs(copy);
    expect((await listSites()).status).toBe(401);
    const [row] = await testDb().select().from(userSessions).where(eq(userSessions.id, o.members.auditor.sessionId));
    expect(row.endedReason).toBe("signed-out");
  });

  it("a session id that was never opened, or is another user's, is refused", async () => {
    const o = await createOrg(testDb(), "Forged11");
    const forged = o.session("auditor");
    actAs({ ...forged, user: { ...forged.user, sessionId: randomUUID() } });
    expect((await listSites()).status).toBe(401);
    actAs({ ...forged, user: { ...forged.user, sessionId: o.members.signatory.sessionId } });
    expect((await listSites()).status).toBe(401);
  });
});
