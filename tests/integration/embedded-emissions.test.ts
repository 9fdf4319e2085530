/**
 * GET /api/v1/sites/{siteId}/embedded-emissions (issue 14) against the demo sites seeded into a
 * fixture organisation: the answer validates against the JSON Schema the app serves (Ajv, draft
 * 2020-12), its figures equal the engine's on the same months, and bad parameters are named.
 */
import { eq } from "drizzle-orm";
import { Ajv2020 } from "ajv/dist/2020.js";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { seedDemoSites } from "@/db/seed-sites";
import { sites } from "@/db/schema";
import { calculate } from "@/lib/balance/calculate";
import { Dec, num } from "@/lib/balance/decimal";
import { embeddedEmissions } from "@/lib/emissions/cbam";
import { demoSeedMonths } from "@/lib/demo/scenario";
import { hasEnded } from "@/lib/period";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, errorOf, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

let org: FixtureOrg;
let other: FixtureOrg;
let estuaryId: string;

const get = async (siteId: string, query = "") =>
  (await import("@/app/api/v1/sites/[siteId]/embedded-emissions/route")).GET(request("GET", `/api/v1/sites/${siteId}/embedded-emissions${query}`), ctx({ siteId }));

beforeAll(async () => {
  const db = testDb();
  org = await createOrg(db, "Cbam");
  other = await createOrg(db, "Importer");
  await db.transaction((tx) => seedDemoSites(tx, org.id));
  estuaryId = (await db.select().from(sites).where(eq(sites.organisationId, org.id))).find((s) => s.code === "estuary")!.id;
});

afterAll(closeTestDb);

describe("embedded emissions of the demo's Estuary Works, 2026-01..2026-06", () => {
  it("validates against the served JSON Schema and equals the engine on the same months", async () => {
    actAs(org.session("environmental_officer"));
    const res = await get(estuaryId, "?from=2026-01&to=2026-06&shipped_t=25000");
    expect(res.status).toBe(200);
    const doc = await res.json();
    const schema = await (await (await import("@/app/api/v1/schemas/cbam-communication.json/route")).GET()).json();
    const validate = new Ajv2020({ strict: false }).compile(schema);
    expect(validate(doc), JSON.stringify(validate.errors)).toBe(true);

    const months = demoSeedMonths("estuary").filter((m) => m.doc.month >= "2026-01" && m.doc.month <= "2026-06" && hasEnded(m.doc.month));
    const results = months.map((m) => calculate(m.doc, { closureTolerancePct: new Dec("2") }));
    const c = embeddedEmissions(results.map((r) => ({ month: r.month, input: r.emissions.input, result: r.emissions.detail })));
    expect(doc.period.months).toEqual(months.map((m) => m.doc.month));
    expect(doc.figures.production.value).toBe(num(c.production_t));
    expect(doc.figures.see_direct.value).toBe(num(c.see_direct_t_per_t));
    expect(doc.figures.see_indirect.value).toBe(num(c.see_indirect_t_per_t));
    expect(doc.figures.see_total.value).toBe(num(c.see_total_t_per_t));
    // A shipment of 25 000 t carries 25 000 × the specific figure.
    expect(doc.shipment.total_t).toBe(num(new Dec(25000).times(c.see_total_t_per_t!)));
    expect(doc.good.cn_status).toBe("unconfirmed");
  });

  it("names the parameter it refuses", async () => {
    actAs(org.session("auditor"));
    for (const [query, path] of [["?from=2026-13", "from"], ["?from=2026-05&to=2026-02", "to"], ["?from=2026-01&to=2099-01", "to"], ["?shipped_t=1e5", "shipped_t"]] as const) {
      const res = await get(estuaryId, query);
      expect(res.status, query).toBe(400);
      expect((await errorOf(res)).issues?.[0]?.path, query).toBe(path);
    }
  });

  it("another organisation's site is not found; signed out is 401", async () => {
    actAs(other.session("all"));
    expect((await get(estuaryId, "?from=2026-01&to=2026-02")).status).toBe(404);
    actAs(null);
    expect((await get(estuaryId)).status).toBe(401);
  });
});
