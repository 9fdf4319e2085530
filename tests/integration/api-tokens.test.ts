import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { apiTokens, auditEvents, sites, streams } from "@/db/schema";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, errorOf, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));

const { createSiteApiToken, revokeSiteApiToken } = await import("@/app/(app)/settings/api-tokens/actions");
const monthRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/route");
const readingRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/readings/[stream]/route");
const streamsRoute = await import("@/app/api/v1/sites/[siteId]/streams/route");
const sitesRoute = await import("@/app/api/v1/sites/route");
const analysisRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/analyses/[key]/route");
const calculateRoute = await import("@/app/api/v1/calculate/route");

let org: FixtureOrg;
let secondSiteId: string;
let token: string;
let tokenId: string;

function form(fields: Record<string, string>): FormData {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

const putReading = (siteId: string, stream: string, json: unknown, bearer = token) =>
  readingRoute.PUT(request("PUT", `/api/v1/sites/${siteId}/months/2026-03/readings/${stream}`, { json, token: bearer }), ctx({ siteId, month: "2026-03", stream }));

beforeAll(async () => {
  org = await createOrg(testDb(), "ApiTokens");
  const [second] = await testDb().insert(sites).values({ organisationId: org.id, name: "Second works", code: `s2-${org.id.slice(0, 6)}` }).returning();
  secondSiteId = second.id;
  for (const siteId of [org.siteId, secondSiteId]) {
    await testDb().insert(streams).values([
      { siteId, key: "nh3", name: "Ammonia", kind: "ammonia", unit: "t" },
      { siteId, key: "power", name: "Grid", kind: "electricity-import", unit: "MWh" },
    ]);
  }
});
afterAll(closeTestDb);

describe("API tokens in settings (administrator)", () => {
  it("creates a token for one site, shows the secret once and stores only its hash and prefix", async () => {
    actAs(org.session("administrator"));
    const r = await createSiteApiToken(null, form({ siteId: org.siteId, label: "DCS historian" }));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    token = r.data!.token;
    expect(token).toMatch(/^syl_[A-Za-z0-9_-]{43}$/);
    const [row] = await testDb().select().from(apiTokens).where(eq(apiTokens.organisationId, org.id));
    tokenId = row.id;
    expect(row).toMatchObject({ label: "DCS historian", siteId: org.siteId, prefix: token.slice(0, 12), revokedAt: null, lastUsedAt: null });
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(row)).not.toContain(token);
    const [event] = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.action, "api-token.created")));
    expect(event.after).toMatchObject({ label: "DCS historian", prefix: token.slice(0, 12) });
    expect(JSON.stringify(event.after)).not.toContain(token);
  });

  it("names the bad field and refuses people without site:manage", async () => {
    actAs(org.session("administrator"));
    const bad = await createSiteApiToken(null, form({ siteId: org.siteId, label: "  " }));
    expect(bad).toMatchObject({ ok: false, errors: { label: expect.stringContaining("label") } });
    const twice = await createSiteApiToken(null, form({ siteId: org.siteId, label: "dcs HISTORIAN" }));
    expect(twice).toMatchObject({ ok: false, errors: { label: expect.stringContaining("already labelled") } });
    actAs(org.session("process_engineer"));
    expect(await createSiteApiToken(null, form({ siteId: org.siteId, label: "x" }))).toEqual({ ok: false, message: "Your role does not allow you to manage API tokens." });
  });
});

describe("a site token as caller", () => {
  it("writes a reading of its own site, audited as api-token under its label, and marks the token used", async () => {
    actAs(null);
    const res = await putReading(org.siteId, "nh3", { quantity: "43763.5", unit: "t" });
    expect(res.status).toBe(200);
    const [event] = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.entityId, "2026-03/nh3")));
    expect(event).toMatchObject({ channel: "api-token", actorLabel: "DCS historian", actorUserId: null });
    const [row] = await testDb().select().from(apiTokens).where(eq(apiTokens.id, tokenId));
    expect(row.lastUsedAt).toBeInstanceOf(Date);
  });

  it("may PUT the month with readings only", async () => {
    const put = (json: unknown) => monthRoute.PUT(request("PUT", `/api/v1/sites/${org.siteId}/months/2026-03`, { json, token }), ctx({ siteId: org.siteId, month: "2026-03" }));
    expect((await put({ expectedVersion: 1, readings: [{ stream: "power", quantity: "9120.25", unit: "MWh" }] })).status).toBe(200);
    const refused = await put({ expectedVersion: 2, analyses: [{ key: "ng", components: { CH4: "100" } }] });
    expect(refused.status).toBe(403);
    expect(await errorOf(refused)).toMatchObject({ code: "token_scope", message: expect.stringMatching(/^API tokens are limited to writing readings/) });
  });

  it("reads its own site's streams but not months, sites, analyses or calculations", async () => {
    const own = await streamsRoute.GET(request("GET", `/api/v1/sites/${org.siteId}/streams`, { token }), ctx({ siteId: org.siteId }));
    expect(own.status).toBe(200);
    expect((await own.json()).streams.map((s: { key: string }) => s.key).sort()).toEqual(["nh3", "power"]);
    const refusals = [
      await monthRoute.GET(request("GET", `/api/v1/sites/${org.siteId}/months/2026-03`, { token }), ctx({ siteId: org.siteId, month: "2026-03" })),
      await sitesRoute.GET(request("GET", "/api/v1/sites", { token }), ctx({})),
      await analysisRoute.PUT(request("PUT", `/api/v1/sites/${org.siteId}/months/2026-03/analyses/ng`, { json: { components: { CH4: "100" } }, token }), ctx({ siteId: org.siteId, month: "2026-03", key: "ng" })),
      await calculateRoute.POST(request("POST", "/api/v1/calculate", { text: "{}", token }), ctx({})),
    ];
    for (const res of refusals) {
      expect(res.status).toBe(403);
      expect((await errorOf(res)).message).toMatch(/^API tokens are limited to writing readings of their own site/);
    }
  });

  it("is refused for another site of the same organisation", async () => {
    const res = await putReading(secondSiteId, "nh3", { quantity: "1", unit: "t" });
    expect(res.status).toBe(403);
    expect((await errorOf(res)).message).toContain("belongs to another site");
    const read = await streamsRoute.GET(request("GET", `/api/v1/sites/${secondSiteId}/streams`, { token }), ctx({ siteId: secondSiteId }));
    expect(read.status).toBe(403);
  });

  it("wins over a session cookie: the bearer is who acts", async () => {
    actAs(org.session("administrator"));
    const res = await putReading(org.siteId, "nh3", { quantity: "43763.6", unit: "t" });
    expect(res.status).toBe(200);
    const events = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.entityId, "2026-03/nh3")));
    expect(events.map((e) => e.actorLabel)).toEqual(["DCS historian", "DCS historian"]);
    actAs(null);
  });

  it("unknown or malformed tokens are 401", async () => {
    const unknown = await putReading(org.siteId, "nh3", { quantity: "1", unit: "t" }, "syl_not-a-real-token");
    expect(unknown.status).toBe(401);
    expect(unknown.headers.get("www-authenticate")).toContain("Bearer");
    expect((await errorOf(unknown)).code).toBe("invalid_token");
    const malformed = await readingRoute.PUT(
      request("PUT", `/api/v1/sites/${org.siteId}/months/2026-03/readings/nh3`, { json: { quantity: "1", unit: "t" }, headers: { authorization: "Basic abc" } }),
      ctx({ siteId: org.siteId, month: "2026-03", stream: "nh3" }),
    );
    expect(malformed.status).toBe(401);
  });

  it("once revoked (audited) it is 401 at once", async () => {
    actAs(org.session("administrator"));
    expect(await revokeSiteApiToken(null, form({ tokenId }))).toMatchObject({ ok: true });
    expect(await revokeSiteApiToken(null, form({ tokenId }))).toMatchObject({ ok: false, message: expect.stringContaining("already revoked") });
    actAs(null);
    const res = await putReading(org.siteId, "nh3", { quantity: "1", unit: "t" });
    expect(res.status).toBe(401);
    const [event] = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.action, "api-token.revoked")));
    expect(event).toMatchObject({ entityId: tokenId, after: { status: "revoked" } });
  });

  it("another organisation's administrator cannot revoke it", async () => {
    const other = await createOrg(testDb(), "ApiTokensOther");
    actAs(other.session("administrator"));
    expect(await revokeSiteApiToken(null, form({ tokenId }))).toEqual({ ok: false, message: "That token was not found; reload the page." });
    expect(await createSiteApiToken(null, form({ siteId: org.siteId, label: "sneaky" }))).toMatchObject({ ok: false, errors: { siteId: expect.any(String) } });
  });
});
