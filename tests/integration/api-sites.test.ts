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

const listSites = () => sitesRoute.GET(request("GET", "/api/v1/sites"), ctx({}));
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
