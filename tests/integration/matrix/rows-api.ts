import { randomUUID } from "node:crypto";
import { recordAudit } from "@/db/queries/audit";
import { apiTokens, months } from "@/db/schema";
import { ROLES } from "@/lib/auth/roles";
import { newMonth } from "../../support/fixtures";
import { type MatrixContext, type MatrixRow, matrixRequest } from "./types";

/** Rows of the REST API v1 read/write routes, the audit export and the API-token actions. */
const MONTH = "2026-03";
const req = (method: string, body?: string) =>
  matrixRequest("http://matrix/", { method, body, headers: body ? { "content-type": "application/json" } : undefined });
const params = <P>(p: P) => ({ params: Promise.resolve(p) });
const site = ({ target }: MatrixContext) => ({ siteId: target.siteId });
const month = (ctx: MatrixContext) => ({ ...site(ctx), month: MONTH });
const form = (fields: Record<string, string>) => {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.set(k, v);
  return fd;
};
const PLANT_MONTH = JSON.stringify({
  format: "synledger.plant-month/1",
  site: "Matrix",
  month: MONTH,
  analyses: {},
  streams: [{ id: "nh3", kind: "ammonia", quantity: "100", unit: "t" }],
  method: { emissions: "carbon-mass-balance", factor_set: "ipcc-2006", gwp: "AR5" },
});

/** Result and export need the month to exist (an unknown month is a 404 of its own). */
async function withMonth(ctx: MatrixContext) {
  await ctx.db.insert(months).values(newMonth(ctx.target.siteId, MONTH)).onConflictDoNothing();
  return month(ctx);
}

/** A list answer shows nothing of the target organisation when its ids and name are absent. */
async function mentionsNothingOf(result: unknown, { target }: MatrixContext): Promise<boolean> {
  const text = await (result as Response).clone().text();
  return !text.includes(target.siteId) && !text.includes(target.id) && !text.includes(target.name);
}

export const apiRows: MatrixRow[] = [
  {
    id: "GET /api/v1/sites",
    allowed: ROLES,
    call: async () => (await import("@/app/api/v1/sites/route")).GET(req("GET"), params({})),
    crossOrgSeesNothing: mentionsNothingOf,
  },
  { id: "GET /api/v1/sites/[siteId]", allowed: ROLES, call: async (c) => (await import("@/app/api/v1/sites/[siteId]/route")).GET(req("GET"), params(site(c))) },
  { id: "GET /api/v1/sites/[siteId]/streams", allowed: ROLES, token: "allowed", call: async (c) => (await import("@/app/api/v1/sites/[siteId]/streams/route")).GET(req("GET"), params(site(c))) },
  { id: "GET /api/v1/sites/[siteId]/months", allowed: ROLES, call: async (c) => (await import("@/app/api/v1/sites/[siteId]/months/route")).GET(req("GET"), params(site(c))) },
  { id: "GET /api/v1/sites/[siteId]/months/[month]", allowed: ROLES, call: async (c) => (await import("@/app/api/v1/sites/[siteId]/months/[month]/route")).GET(req("GET"), params(month(c))) },
  {
    id: "PUT /api/v1/sites/[siteId]/months/[month]",
    allowed: ["process_engineer"],
    token: "allowed",
    call: async (c) => (await import("@/app/api/v1/sites/[siteId]/months/[month]/route")).PUT(req("PUT", JSON.stringify({ expectedVersion: 0, readings: [] })), params(month(c))),
  },
  {
    // The fixture site has no streams, so an allowed call ends in 400 (unknown stream): past the gate.
    id: "PUT /api/v1/sites/[siteId]/months/[month]/readings/[stream]",
    allowed: ["process_engineer"],
    token: "allowed",
    call: async (c) =>
      (await import("@/app/api/v1/sites/[siteId]/months/[month]/readings/[stream]/route")).PUT(
        req("PUT", JSON.stringify({ quantity: "1", unit: "t" })),
        params({ ...month(c), stream: "nh3" }),
      ),
  },
  { id: "GET /api/v1/sites/[siteId]/months/[month]/analyses", allowed: ROLES, call: async (c) => (await import("@/app/api/v1/sites/[siteId]/months/[month]/analyses/route")).GET(req("GET"), params(month(c))) },
  {
    id: "PUT /api/v1/sites/[siteId]/months/[month]/analyses/[key]",
    allowed: ["process_engineer"],
    call: async (c) =>
      (await import("@/app/api/v1/sites/[siteId]/months/[month]/analyses/[key]/route")).PUT(
        req("PUT", JSON.stringify({ components: { CH4: "95", C2H6: "3", N2: "1", CO2: "1" } })),
        params({ ...month(c), key: "grid-gas" }),
      ),
  },
  // A month not In review answers 409 (after the gate): access is what the row checks.
  { id: "GET /api/v1/sites/[siteId]/months/[month]/statement-preview", allowed: ROLES, call: async (c) => (await import("@/app/api/v1/sites/[siteId]/months/[month]/statement-preview/route")).GET(req("GET"), params(await withMonth(c))) },
  { id: "GET /api/v1/sites/[siteId]/months/[month]/result", allowed: ROLES, call: async (c) => (await import("@/app/api/v1/sites/[siteId]/months/[month]/result/route")).GET(req("GET"), params(await withMonth(c))) },
  {
    id: "PUT /api/v1/sites/[siteId]/months/[month]/method",
    allowed: ["environmental_officer", "administrator"],
    call: async (c) =>
      (await import("@/app/api/v1/sites/[siteId]/months/[month]/method/route")).PUT(
        req("PUT", JSON.stringify({ emissions: "fuel-calculation", factor_set: "eu-mrr", gwp: "AR5", expectedVersion: 0 })),
        params(month(c)),
      ),
  },
  {
    // The fixture month does not compute, so the engineer's step is refused for that reason (422): past the gate.
    id: "POST /api/v1/sites/[siteId]/months/[month]/transitions",
    allowed: ["process_engineer"],
    call: async (c) =>
      (await import("@/app/api/v1/sites/[siteId]/months/[month]/transitions/route")).POST(req("POST", JSON.stringify({ transition: "balance", expectedVersion: 1 })), params(await withMonth(c))),
  },
  { id: "GET /api/v1/sites/[siteId]/months/[month]/export", allowed: ROLES, call: async (c) => (await import("@/app/api/v1/sites/[siteId]/months/[month]/export/route")).GET(req("GET"), params(await withMonth(c))) },
  {
    id: "POST /api/v1/sites/[siteId]/months/[month]/import",
    allowed: ["process_engineer"],
    call: async (c) => (await import("@/app/api/v1/sites/[siteId]/months/[month]/import/route")).POST(req("POST", PLANT_MONTH), params(month(c))),
  },
  {
    id: "POST /api/v1/calculate",
    allowed: ROLES,
    call: async () => (await import("@/app/api/v1/calculate/route")).POST(req("POST", PLANT_MONTH), params({})),
    // Stateless: it reads nothing stored, so the answer can only hold what the caller sent.
    crossOrgSeesNothing: mentionsNothingOf,
  },
  {
    id: "GET /api/v1/audit/export",
    allowed: ROLES,
    async call({ db, target }) {
      await recordAudit(db, { organisationId: target.id, actorLabel: `marker ${target.id}`, channel: "system", action: "matrix.marker", entity: "matrix" });
      return (await import("@/app/api/v1/audit/export/route")).GET(matrixRequest("http://matrix/api/v1/audit/export"), params({}));
    },
    crossOrgSeesNothing: mentionsNothingOf,
  },
  { id: "GET /api/v1/openapi.json", allowed: "public", call: async () => (await import("@/app/api/v1/openapi.json/route")).GET() },
  {
    id: "app/(app)/settings/api-tokens/actions.ts#createSiteApiToken",
    allowed: ["administrator"],
    call: async ({ target }) =>
      (await import("@/app/(app)/settings/api-tokens/actions")).createSiteApiToken(null, form({ siteId: target.siteId, label: `matrix ${randomUUID().slice(0, 6)}` })),
  },
  {
    id: "app/(app)/settings/api-tokens/actions.ts#revokeSiteApiToken",
    allowed: ["administrator"],
    async call({ db, target }) {
      const [t] = await db
        .insert(apiTokens)
        .values({ organisationId: target.id, siteId: target.siteId, label: "matrix", prefix: "syl_matrix", tokenHash: randomUUID() })
        .returning();
      return (await import("@/app/(app)/settings/api-tokens/actions")).revokeSiteApiToken(null, form({ tokenId: t.id }));
    },
  },
];
