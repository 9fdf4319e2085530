import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { sites, streams } from "@/db/schema";
import { ROLES } from "@/lib/auth/roles";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, errorOf, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

const sitesRoute = await import("@/app/api/v1/sites/route");
const siteRoute = await import("@/app/api/v1/sites/[siteId]/route");
const streamsRoute = await import("@/app/api/v1/sites/[siteId]/streams/route");

let org: FixtureOrg;
let other: FixtureOrg;

const listSites = (query = "") => sitesRoute.GET(request("GET", `/api/v1/sites${query}`), ctx({}));
const getSite = (siteId: string) => siteRoute.GET(request("GET", `/api/v1/sites/${siteId}`), ctx({ siteId }));
const getStreams = (siteId: string) => streamsRoute.GET(request("GET", `/api/v1/sites/${siteId}/streams`), ctx({ siteId }));

beforeAll(async () => {
  org = await createOrg(testDb(), "ApiSites");
  other = await createOrg(testDb(), "ApiSitesOther");
  await testDb().insert(sites).values({ organisationId: org.id, name: "Closed works", code: `old-${org.id.slice(0, 6)}`, archivedAt: new Date() });
  await testDb().insert(streams).values([
    { siteId: org.siteId, key: "nh3", name: "Ammonia", kind: "ammonia", unit: "t", sortOrder: 2 },
    { siteId: org.siteId, key: "feed", name: "Feed", kind: "feed-gas", unit: "Sm3", analysisKey: "ng", uncertaintyPct: "1.50", sortOrder: 1 },
  ]);
});
afterAll(closeTestDb);

describe("GET /api/v1/sites", () => {
  it.each(ROLES)("lists only the organisation's active sites for %s", async (role) => {
    actAs(org.session(role));
    const res = await listSites();
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.sites.map((s: { id: string }) => s.id)).toEqual([org.siteId]);
    expect(body.sites[0]).toMatchObject({ closureTolerancePct: "2", meteringReference: "15C" });
  });
  it("401 signed out", async () => {
    actAs(null);
    expect(await errorOf(await listSites())).toEqual({ code: "unauthorized", message: "Sign in first." });
  });

  it("pages through a fleet by name: every active site once, in order, next null on the last page", async () => {
    const fleet = await createOrg(testDb(), "ApiSitesFleet");
    // Two sites share a name, so the order (and the cursor) must fall back to the id.
    const names = ["Alder works", "Birch works", "Birch works", "Cedar works", "Dune works", "Elm works", "Fen works"];
    await testDb().insert(sites).values(names.map((name, i) => ({ organisationId: fleet.id, name, code: `fl${i}-${fleet.id.slice(0, 6)}` })));
    actAs(fleet.session("auditor"));
    const all = await (await listSites("?limit=500")).json();
    expect(all.next).toBeNull();
    const expected = all.sites.map((s: { id: string }) => s.id);
    expect(expected).toHaveLength(names.length + 1); // the fixture's own site too
    const seen: string[] = [];
    let query = "?limit=3";
    for (let page = 0; page < 10; page++) {
      const body = await (await listSites(query)).json();
      expect(body.sites.length).toBeLessThanOrEqual(3);
      seen.push(...body.sites.map((s: { id: string }) => s.id));
      if (!body.next) break;
      query = `?limit=3&after=${encodeURIComponent(body.next)}`;
    }
    expect(seen).toEqual(expected);
    const byName = all.sites.map((s: { name: string }) => s.name);
    expect(byName).toEqual([...byName].sort((a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0)));
  });

  it("answers 100 sites unless asked, and names the parameter of a bad limit or cursor", async () => {
    actAs(org.session("auditor"));
    expect((await (await listSites()).json()).next).toBeNull();
    for (const [query, path, message] of [
      ["?limit=0", "limit", "limit must be at least 1"],
      ["?limit=501", "limit", "limit must be at most 500"],
      ["?limit=2.5", "limit", "limit must be a whole number"],
      ["?limit=ten", "limit", "limit must be a whole number"],
      ["?after=bm90LWEtY3Vyc29y", "after", "after is not a cursor this API gave; pass the `next` of the previous page"],
      [`?after=${Buffer.from(JSON.stringify(["x", "'; drop table sites; --"])).toString("base64url")}`, "after", "after is not a cursor this API gave; pass the `next` of the previous page"],
    ] as const) {
      const res = await listSites(query);
      expect(res.status, query).toBe(400);
      expect((await errorOf(res)).issues, query).toEqual([{ path, message }]);
    }
  });

  it("answers 400 naming the parameter for hostile values: 1 000 characters, pattern metacharacters, a lone surrogate", async () => {
    actAs(org.session("auditor"));
    const hostile = ["x".repeat(1000), "(a+)+$.*[\\d]{9999}|^", "\uD800", "\u0000'\"; select 1; --"];
    for (const value of hostile) {
      for (const param of ["limit", "after"] as const) {
        const res = await listSites(`?${param}=${encodeURIComponent(value.replace(/\uD800/, "\uFFFD"))}`);
        expect(res.status, `${param}=${value.slice(0, 20)}`).toBe(400);
        const issues = (await errorOf(res)).issues as { path: string }[];
        expect(issues.map((i) => i.path)).toEqual([param]);
      }
    }
    // A lone surrogate as raw percent-encoded UTF-16 half (invalid UTF-8) reaches the route as U+FFFD.
    const raw = await listSites("?after=%ED%A0%80");
    expect(raw.status).toBe(400);
    expect(((await errorOf(raw)).issues as { path: string }[]).map((i) => i.path)).toEqual(["after"]);
  });
});

describe("GET /api/v1/sites/{siteId} and /streams", () => {
  it("gives the site and its streams in their order, numbers as text", async () => {
    actAs(org.session("auditor"));
    expect((await (await getSite(org.siteId)).json()).site).toMatchObject({ id: org.siteId, factorSet: "ipcc-2006" });
    const body = await (await getStreams(org.siteId)).json();
    expect(body.streams.map((s: { key: string }) => s.key)).toEqual(["feed", "nh3"]);
    expect(body.streams[0]).toMatchObject({ kind: "feed-gas", analysisKey: "ng", uncertaintyPct: "1.50" });
  });
  it("404 for another organisation's site, the same as for none", async () => {
    actAs(org.session("administrator"));
    for (const res of [await getSite(other.siteId), await getStreams(other.siteId), await getSite("00000000-0000-0000-0000-000000000000")]) {
      expect(res.status).toBe(404);
      expect(await errorOf(res)).toEqual({ code: "not_found", message: "The site was not found." });
    }
  });
  it("401 signed out", async () => {
    actAs(null);
    expect((await getSite(org.siteId)).status).toBe(401);
    expect((await getStreams(org.siteId)).status).toBe(401);
  });
});
