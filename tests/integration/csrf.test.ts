/**
 * Cross-site request forgery: every mutating route handler (found by walking app/api, so a new
 * one is covered without editing this file) is called with a valid session as a member holding
 * every role, once from another site and once from the app's own origin. The cross-site call
 * must be 403 cross_site_request and write nothing; the same-origin call must get past the check.
 */
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditEvents } from "@/db/schema";
import { crossSiteReason } from "@/lib/auth/same-origin";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { createApiToken } from "@/db/queries/api-tokens";
import { newApiToken } from "@/lib/api/tokens";
import { isPublicRoute } from "@/lib/auth/guard";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
const modules = import.meta.glob<Record<string, unknown>>("/app/api/v1/**/route.ts");

const APP = "http://synledger.test";
const EVIL = "https://evil.example";
const MUTATING = ["POST", "PUT", "PATCH", "DELETE"] as const;

let org: FixtureOrg;

/** Plausible values for each dynamic segment, so the handler would otherwise do real work. */
function paramsFor(file: string): Record<string, string> {
  const values: Record<string, string> = { siteId: org.siteId, month: "2026-03", stream: "nh3", key: "grid-gas", attachmentId: "00000000-0000-4000-8000-000000000001", id: "00000000-0000-4000-8000-000000000002" };
  return Object.fromEntries([...file.matchAll(/\[(\w+)\]/g)].map((m) => [m[1], values[m[1]] ?? "x"]));
}

function bodyFor(file: string): { body: BodyInit; type?: string } {
  if (/imports|attachments/.test(file)) {
    const form = new FormData();
    form.set("file", new File(["Date,Tag,Total\n2026-03-01,nh3,1\n"], "x.csv", { type: "text/csv" }));
    form.set("mapping", "{}");
    form.set("category", "other");
    return { body: form };
  }
  if (/verify/.test(file)) return { body: "%PDF-1.7\n", type: "application/pdf" };
  return { body: JSON.stringify({ expectedVersion: 0, readings: [], quantity: "1", unit: "t", components: { CH4: "100" } }), type: "application/json" };
}

function call(file: string, handler: Handler, method: string, headers: Record<string, string>) {
  const { body, type } = method === "DELETE" ? { body: undefined, type: undefined } : bodyFor(file);
  const h = new Headers(headers);
  if (type) h.set("content-type", type);
  const path = file.replace(/^\/app/, "").replace(/\/route\.ts$/, "");
  return handler(new Request(`${APP}${path}`, { method, headers: h, body }), { params: Promise.resolve(paramsFor(file)) });
}

/** Routes that use the session. Public ones (publicRoute: statement verification) read none and change no record, so a cross-site caller gains nothing a direct caller lacks. */
async function mutatingRoutes(which: "session" | "public" = "session"): Promise<{ file: string; method: string; handler: Handler }[]> {
  const out = [];
  for (const [file, load] of Object.entries(modules)) {
    const mod = (await load()) as Record<string, unknown>;
    for (const method of MUTATING) {
      if (typeof mod[method] !== "function" || isPublicRoute(mod[method]) !== (which === "public")) continue;
      out.push({ file, method, handler: mod[method] as Handler });
    }
  }
  return out;
}

const auditCount = async () => (await testDb().select({ n: count() }).from(auditEvents).where(eq(auditEvents.organisationId, org.id)))[0].n;

beforeAll(async () => {
  org = await createOrg(testDb(), "Csrf");
});
afterAll(closeTestDb);

describe("the same-origin rule (lib/auth/same-origin.ts)", () => {
  const req = (method: string, headers: Record<string, string>) => new Request(`${APP}/api/v1/x`, { method, headers });
  it("lets reads through whatever their origin", () => {
    expect(crossSiteReason(req("GET", { origin: EVIL, "sec-fetch-site": "cross-site" }))).toBeNull();
  });
  it("accepts the app's own origin, by the request's host or by X-Forwarded-Host behind a proxy", () => {
    expect(crossSiteReason(req("POST", { origin: APP }))).toBeNull();
    expect(crossSiteReason(new Request("http://127.0.0.1:3000/api/v1/x", { method: "POST", headers: { origin: "https://ledger.plant.example", "x-forwarded-host": "ledger.plant.example" } }))).toBeNull();
  });
  it("refuses another origin, Origin: null and a same-site sibling host", () => {
    expect(crossSiteReason(req("POST", { origin: EVIL }))).toMatch(/evil/);
    expect(crossSiteReason(req("DELETE", { origin: "null" }))).not.toBeNull();
    expect(crossSiteReason(req("PUT", { origin: "http://other.synledger.test" }))).not.toBeNull();
  });
  it("without Origin, judges by Sec-Fetch-Site; with neither header the caller is not a browser", () => {
    expect(crossSiteReason(req("POST", { "sec-fetch-site": "cross-site" }))).not.toBeNull();
    expect(crossSiteReason(req("POST", { "sec-fetch-site": "same-site" }))).not.toBeNull();
    expect(crossSiteReason(req("POST", { "sec-fetch-site": "same-origin" }))).toBeNull();
    expect(crossSiteReason(req("POST", {}))).toBeNull();
  });
});

describe("every mutating route handler under app/api/v1", () => {
  it("finds the mutating routes (the walk is not empty)", async () => {
    const routes = await mutatingRoutes();
    expect(routes.map((r) => `${r.method} ${r.file}`)).toEqual(expect.arrayContaining([expect.stringMatching(/^PUT .*months\/\[month\]\/route\.ts$/), expect.stringMatching(/^POST .*imports\/commit/)]));
  });

  it("answers 403 cross_site_request to a cross-site call with a valid session, and writes nothing", async () => {
    actAs(org.session("all"));
    const before = await auditCount();
    const wrong: string[] = [];
    for (const r of await mutatingRoutes()) {
      const crossSite: Record<string, string>[] = [{ origin: EVIL }, { "sec-fetch-site": "cross-site" }];
      for (const headers of crossSite) {
        const res = await call(r.file, r.handler, r.method, headers);
        const body = res.status === 403 ? await res.json() : null;
        if (body?.error?.code !== "cross_site_request") wrong.push(`${r.method} ${r.file} ${JSON.stringify(headers)} → ${res.status}`);
        else expect(body.error.message).toMatch(/came from another site/);
      }
    }
    expect(wrong).toEqual([]);
    expect(await auditCount()).toBe(before);
  });

  it("public routes (verification) answer a cross-site caller exactly as a same-origin one and write no audit event", async () => {
    const routes = await mutatingRoutes("public");
    expect(routes.map((r) => `${r.method} ${r.file}`)).toEqual(["POST /app/api/v1/verify/route.ts"]);
    const before = await auditCount();
    for (const r of routes) {
      const own = await call(r.file, r.handler, r.method, { origin: APP });
      const evil = await call(r.file, r.handler, r.method, { origin: EVIL });
      expect(evil.status).toBe(own.status);
      expect(await evil.json()).toEqual(await own.json());
    }
    expect(await auditCount()).toBe(before);
  });

  it("lets the same calls from the app's own origin past the check (whatever the handler then says)", async () => {
    actAs(org.session("all"));
    const refused: string[] = [];
    for (const r of await mutatingRoutes()) {
      const res = await call(r.file, r.handler, r.method, { origin: APP, "sec-fetch-site": "same-origin" });
      const body = res.status === 403 ? await res.json() : null;
      if (body?.error?.code === "cross_site_request") refused.push(`${r.method} ${r.file}`);
    }
    expect(refused).toEqual([]);
  });

  it("exempts bearer-token calls: a plant system has no cookie to be tricked into sending", async () => {
    actAs(null);
    const { token: secret, tokenHash, prefix } = newApiToken();
    await createApiToken(testDb(), { organisationId: org.id, siteId: org.siteId, label: "csrf test", prefix, tokenHash, createdBy: org.members.administrator.id });
    const put = (await import("@/app/api/v1/sites/[siteId]/months/[month]/readings/[stream]/route")).PUT as unknown as Handler;
    const res = await call("/app/api/v1/sites/[siteId]/months/[month]/readings/[stream]/route.ts", put, "PUT", { origin: EVIL, authorization: `Bearer ${secret}` });
    // The fixture site has no stream "nh3": the call got past every gate to the validation.
    expect(res.status).not.toBe(403);
    expect((await res.json()).error.code).not.toBe("cross_site_request");
  });
});
