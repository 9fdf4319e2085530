/**
 * Hostile values in every parameter of this change's routes and action (issues 14 and 19): 1 000
 * characters, regular-expression metacharacters, a lone surrogate. Each is refused with 400/404 or a
 * message naming the problem, never a 5xx or a thrown error; nothing is signed or written.
 */
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { statements } from "@/db/schema";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

const HOSTILE = ["x".repeat(1000), ".*+?^${}()|[]\\", "\uD800", "2026-01' OR '1'='1", "../../etc/passwd"];
let org: FixtureOrg;
/** A lone surrogate cannot be URI-encoded; it travels as the bytes a browser would send for it. */
const enc = (v: string) => {
  try {
    return encodeURIComponent(v);
  } catch {
    return "%ED%A0%80";
  }
};

beforeAll(async () => {
  org = await createOrg(testDb(), "Hostile14");
});
afterAll(closeTestDb);

describe("hostile parameters", () => {
  it("embedded-emissions: every query parameter and the site id", async () => {
    actAs(org.session("signatory"));
    const { GET } = await import("@/app/api/v1/sites/[siteId]/embedded-emissions/route");
    for (const v of HOSTILE) {
      const q = enc(v);
      for (const [siteId, query] of [[org.siteId, `?from=${q}`], [org.siteId, `?to=${q}`], [org.siteId, `?shipped_t=${q}`], [v, ""]] as const) {
        const res = await GET(request("GET", `/api/v1/sites/${enc(siteId)}/embedded-emissions${query}`), ctx({ siteId }));
        expect([400, 404], `${siteId.slice(0, 20)} ${query.slice(0, 30)}`).toContain(res.status);
      }
    }
  });

  it("statement document and month transitions: ids, months and bodies", async () => {
    actAs(org.session("process_engineer"));
    const doc = (await import("@/app/api/v1/statements/[id]/document/route")).GET;
    const tr = (await import("@/app/api/v1/sites/[siteId]/months/[month]/transitions/route")).POST;
    for (const v of HOSTILE) {
      expect((await doc(request("GET", "/api/v1/statements/x/document"), ctx({ id: v }))).status).toBe(404);
      const month = await tr(request("POST", "/x", { json: { transition: "balance", expectedVersion: 1 } }), ctx({ siteId: org.siteId, month: v }));
      expect(month.status).toBe(400);
      const site = await tr(request("POST", "/x", { json: { transition: "balance", expectedVersion: 1 } }), ctx({ siteId: v, month: "2026-03" }));
      expect([400, 404]).toContain(site.status);
      const body = await tr(request("POST", "/x", { json: { transition: v, expectedVersion: 1, reason: v } }), ctx({ siteId: org.siteId, month: "2026-03" }));
      expect(body.status).toBe(400);
    }
  });

  it("the signing action refuses with a message and signs nothing", async () => {
    actAs(org.session("signatory"));
    const { signCommunicationAction } = await import("@/app/(app)/sites/[siteId]/embedded-emissions/actions");
    for (const v of HOSTILE) {
      for (const fields of [{ siteId: v, from: "2026-01", to: "2026-02" }, { siteId: org.siteId, from: v, to: "2026-02" }, { siteId: org.siteId, from: "2026-01", to: v }, { siteId: org.siteId, from: "2026-01", to: "2026-02", shipped_t: v }]) {
        const form = new FormData();
        for (const [k, x] of Object.entries(fields)) form.set(k, x);
        const r = await signCommunicationAction(null, form);
        expect(r.ok, JSON.stringify(fields).slice(0, 80)).toBe(false);
        expect(r.message ?? "").not.toBe("");
      }
    }
    const [n] = await testDb().select({ n: count() }).from(statements).where(eq(statements.organisationId, org.id));
    expect(n.n).toBe(0);
  });
});
