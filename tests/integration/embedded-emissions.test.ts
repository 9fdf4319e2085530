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
import { createDemoCertificate } from "@/lib/signing/demo-certificate";
import { registerCertificate } from "@/lib/signing/issue";
import { verifyStatementPdf } from "@/lib/signing/verify";
import { statements } from "@/db/schema";
import { and } from "drizzle-orm";
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
  process.env.SIGNING_SECRET ??= "integration-test-signing-secret-0123456789";
  const admin = org.members.administrator;
  const demo = createDemoCertificate({ commonName: "Cbam test communications", organisation: org.name, bits: 2048 });
  await registerCertificate(db, { organisationId: org.id, label: "Demo", ...demo, activate: true, actor: { userId: admin.id, name: admin.name } });
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

  it("the annual emissions report content exports as CSV and JSON with the engine's per-stream emissions", async () => {
    actAs(org.session("auditor"));
    const exportOf = async (q: string) =>
      (await import("@/app/api/v1/sites/[siteId]/years/[year]/export/route")).GET(request("GET", `/api/v1/sites/${estuaryId}/years/2026/export?${q}`), ctx({ siteId: estuaryId, year: "2026" }));
    const json = await (await exportOf("format=json&table=annual-report")).json();
    expect(json.format).toBe("synledger.annual-report-content/1");
    const months = demoSeedMonths("estuary").filter((m) => m.doc.month.startsWith("2026") && hasEnded(m.doc.month));
    const feedCo2 = months.map((m) => calculate(m.doc, { closureTolerancePct: new Dec("2") })).reduce((a, r) => a.plus(r.emissions.detail.by_stream.find((b) => b.id === "feed")!.co2_t), new Dec(0));
    expect(json.streams.find((x: { id: string }) => x.id === "feed").co2_t).toBe(num(feedCo2));
    const csv = await (await exportOf("format=csv&table=annual-report")).text();
    expect(csv).toContain(`source stream,feed,feed-gas,`);
    expect(csv).toContain("transfer,co2-urea,urea,");
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

describe("signing the communication (signatory only)", () => {
  const sign = async (fields: Record<string, string>) => {
    const { signCommunicationAction } = await import("@/app/(app)/sites/[siteId]/embedded-emissions/actions");
    const form = new FormData();
    for (const [k, v] of Object.entries({ siteId: estuaryId, ...fields })) form.set(k, v);
    return signCommunicationAction(null, form);
  };

  it("the officer may not sign; the signatory's signature verifies and the JSON inside equals the draft", async () => {
    actAs(org.session("environmental_officer"));
    const refused = await sign({ from: "2026-01", to: "2026-03" });
    expect(refused.ok).toBe(false);
    expect(refused.message).toMatch(/^Your role does not allow/);

    actAs(org.session("signatory"));
    const signed = await sign({ from: "2026-01", to: "2026-03", shipped_t: "12000" });
    expect(signed.ok, signed.message).toBe(true);
    const id = signed.ok ? signed.data!.id : "";
    const [row] = await testDb().select().from(statements).where(and(eq(statements.id, id), eq(statements.organisationId, org.id)));
    expect(row.kind).toBe("cbam");
    expect(row.period).toBe("2026-01..2026-03");
    const v = await verifyStatementPdf(testDb(), { organisationId: org.id }, row.pdf);
    expect(v.verdict).toBe("issued");

    const res = await (await import("@/app/api/v1/statements/[id]/document/route")).GET(request("GET", `/api/v1/statements/${id}/document`), ctx({ id }));
    expect(res.status).toBe(200);
    const inside = await res.json();
    const draft = await (await get(estuaryId, "?from=2026-01&to=2026-03&shipped_t=12000")).json();
    expect(inside.figures).toEqual(draft.figures);
    expect(inside.shipment).toEqual(draft.shipment);
    const schema = await (await (await import("@/app/api/v1/schemas/cbam-communication.json/route")).GET()).json();
    expect(new Ajv2020({ strict: false }).validate(schema, inside)).toBe(true);

    // The same period again is revision 2; the first is kept as signed.
    const again = await sign({ from: "2026-01", to: "2026-03" });
    expect(again.ok).toBe(true);
    const rows = await testDb().select().from(statements).where(and(eq(statements.siteId, estuaryId), eq(statements.kind, "cbam")));
    expect(rows.map((r) => r.revision).sort()).toEqual([1, 2]);
  });

});
