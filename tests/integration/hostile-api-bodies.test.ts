/**
 * Hostile request bodies against the real /api/v1 handlers and PostgreSQL: random JSON, random
 * text, mutated valid bodies, giant and exotic numbers. Every answer must be a JSON error body
 * (code, message, issues with paths for 400), never a 500, and a refused call must leave
 * readings, months and audit events exactly as they were. Oversized bodies are 413.
 */
import { count, eq, inArray } from "drizzle-orm";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditEvents, months, readings, streams } from "@/db/schema";
import { MAX_BODY_BYTES } from "@/lib/api/body";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { addExampleStreams, ctx, EXAMPLE_TEXT, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

const monthRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/route");
const readingRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/readings/[stream]/route");
const analysisRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/analyses/[key]/route");
const importRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/import/route");
const calculateRoute = await import("@/app/api/v1/calculate/route");

const RUNS = { numRuns: 150 };
const MONTH = "2026-03";
let org: FixtureOrg;

type Call = (text: string) => Promise<Response>;
const calls: Record<string, Call> = {
  "PUT month": (text) => monthRoute.PUT(request("PUT", "/m", { text, headers: { "content-type": "application/json" } }), ctx({ siteId: org.siteId, month: MONTH })),
  "PUT reading": (text) => readingRoute.PUT(request("PUT", "/r", { text }), ctx({ siteId: org.siteId, month: MONTH, stream: "nh3" })),
  "PUT analysis": (text) => analysisRoute.PUT(request("PUT", "/a", { text }), ctx({ siteId: org.siteId, month: MONTH, key: "estuary-grid-gas" })),
  "POST import": (text) => importRoute.POST(request("POST", "/i", { text }), ctx({ siteId: org.siteId, month: MONTH })),
  "POST calculate": (text) => calculateRoute.POST(request("POST", "/c", { text }), ctx({})),
};

/** Rows of the organisation a refused call must not have touched. */
async function footprint() {
  const db = testDb();
  const monthIds = (await db.select({ id: months.id }).from(months).where(eq(months.siteId, org.siteId))).map((m) => m.id);
  const [r] = monthIds.length ? await db.select({ n: count() }).from(readings).where(inArray(readings.monthId, monthIds)) : [{ n: 0 }];
  const [a] = await db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.organisationId, org.id));
  return { months: monthIds.length, readings: r.n, audit: a.n };
}

/** Checks one answer; returns a description of what is wrong, or null. */
async function judge(name: string, text: string, res: Response, before: Awaited<ReturnType<typeof footprint>>): Promise<string | null> {
  const where = `${name} with ${JSON.stringify(text.slice(0, 120))}`;
  if (res.status >= 500) return `${where} → ${res.status} ${await res.text()}`;
  if (res.status < 400) return null;
  const body = await res.json().catch(() => null);
  const e = body?.error;
  if (typeof e?.code !== "string" || typeof e?.message !== "string" || !e.message) return `${where} → ${res.status} without an error body`;
  if (res.status === 400 && e.code !== "invalid_json" && !(Array.isArray(e.issues) && e.issues.length && e.issues.every((i: { path: unknown; message: unknown }) => typeof i.path === "string" && typeof i.message === "string" && i.message))) {
    return `${where} → 400 ${e.code} without issues naming paths`;
  }
  const after = await footprint();
  if (JSON.stringify(after) !== JSON.stringify(before)) return `${where} → ${res.status} but wrote ${JSON.stringify(before)} → ${JSON.stringify(after)}`;
  return null;
}

const VALID: Record<string, unknown> = {
  "PUT month": { expectedVersion: 0, readings: [{ stream: "nh3", quantity: "43763.5", unit: "t" }], analyses: [{ key: "estuary-grid-gas", components: { CH4: "92.4", C2H6: "4.1", N2: "2.3", CO2: "1.2" } }] },
  "PUT reading": { quantity: "43763.5", unit: "t", source: "meter", note: "monthly total" },
  "PUT analysis": { components: { CH4: "92.4", C2H6: "4.1", N2: "2.3", CO2: "1.2" }, sampledOn: "2026-03-14", laboratory: "Lab" },
  "POST import": JSON.parse(EXAMPLE_TEXT),
  "POST calculate": JSON.parse(EXAMPLE_TEXT),
};

const weird = fc.oneof(
  fc.jsonValue({ maxDepth: 2 }),
  fc.constantFrom("9".repeat(200_000), `0.${"1".repeat(20_000)}`, "1e999999999999", "1e-999999999999", "-0", "0000001", "1.", ".5", "NaN", "١٢", "\u0000", "'; DROP TABLE readings; --"),
  fc.constantFrom(1e308, -1, 2 ** 53 + 1, 0.1, null, [], {}),
);

/** Replaces one leaf (or adds one key) somewhere in a valid body. */
function mutate(doc: unknown, pick: number, value: unknown, add: boolean): unknown {
  const copy = structuredClone(doc);
  const slots: [Record<string, unknown>, string][] = [];
  const walk = (v: unknown) => {
    if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) {
      slots.push([v as Record<string, unknown>, k]);
      walk(x);
    }
  };
  walk(copy);
  const [parent, key] = slots[pick % slots.length];
  if (add) parent[`${key}_extra`] = value;
  else parent[key] = value;
  return copy;
}

beforeAll(async () => {
  org = await createOrg(testDb(), "Hostile");
  await addExampleStreams(testDb(), org.siteId);
  actAs(org.session("all"));
});
afterAll(closeTestDb);

describe("hostile request bodies", () => {
  for (const name of Object.keys(calls)) {
    describe(name, () => {
      it("random JSON and random text: a JSON error with paths, never a 500, nothing written", async () => {
        actAs(org.session("all"));
        const bodies = fc.oneof(fc.json({ maxDepth: 4 }), fc.string({ unit: "grapheme", maxLength: 200 }), fc.jsonValue({ maxDepth: 3 }).map((v) => JSON.stringify(v)));
        await fc.assert(
          fc.asyncProperty(bodies, async (text) => {
            const before = await footprint();
            const p = await judge(name, text, await calls[name](text), before);
            // Thrown, so fast-check's report names the request and the answer.
            if (p) throw new Error(p);
          }),
          RUNS,
        );
      });

      it("a valid body with one field made hostile: never a 500; a refusal writes nothing", async () => {
        actAs(org.session("all"));
        await fc.assert(
          fc.asyncProperty(fc.nat(), weird, fc.boolean(), async (pick, value, add) => {
            const text = JSON.stringify(mutate(VALID[name], pick, value, add)) ?? "";
            const before = await footprint();
            const p = await judge(name, text, await calls[name](text), before);
            // Thrown, so fast-check's report names the request and the answer.
            if (p) throw new Error(p);
          }),
          RUNS,
        );
      });

      it(`a body over ${MAX_BODY_BYTES} bytes is 413, declared or not`, async () => {
        const big = `{"note":"${"x".repeat(MAX_BODY_BYTES)}"}`;
        const before = await footprint();
        const res = await calls[name](big);
        expect(res.status).toBe(413);
        expect((await res.json()).error.code).toBe("payload_too_large");
        expect(await footprint()).toEqual(before);
      });
    });
  }

  it("the fixture site is intact and still takes a good save (the tables were not harmed)", async () => {
    actAs(org.session("all"));
    expect((await testDb().select({ n: count() }).from(streams).where(eq(streams.siteId, org.siteId)))[0].n).toBeGreaterThan(5);
    const res = await calls["PUT reading"](JSON.stringify(VALID["PUT reading"]));
    expect(res.status).toBe(200);
  });
});
