/**
 * Every route handler and server action, called anonymously, as every role of the owning
 * organisation and as a member (holding every role) of another organisation. A route or
 * action without a row here fails the discovery test.
 */
import { randomUUID } from "node:crypto";
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { afterAll, describe, expect, it, vi } from "vitest";
import { apiTokens } from "@/db/schema";
import { hashApiToken } from "@/lib/api/tokens";
import { ROLES } from "@/lib/auth/roles";
import { closeTestDb, testDb } from "../support/db";
import { createOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { outcomeOf, setMatrixBearer, type MatrixRow, type Outcome } from "./matrix/types";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

const modules = import.meta.glob<Record<string, MatrixRow[]>>("./matrix/rows-*.ts", { eager: true });
const rows: MatrixRow[] = Object.values(modules).flatMap((m) => Object.values(m).flat());

/** Auth.js's own endpoint is the sign-in itself; the browser tests exercise it. */
const EXEMPT = new Set(["GET /api/auth/[...nextauth]", "POST /api/auth/[...nextauth]"]);

const ROOT = join(__dirname, "..", "..");
function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? walk(p) : [p];
  });
}

/** Every "METHOD /path" of app/**\/route.ts and every exported function of a "use server" file. */
function discover(): string[] {
  const found: string[] = [];
  for (const file of walk(join(ROOT, "app"))) {
    const rel = relative(ROOT, file);
    const text = readFileSync(file, "utf8");
    if (/\/route\.ts$/.test(rel)) {
      const path = "/" + rel.replace(/^app\//, "").replace(/\/route\.ts$/, "").split("/").filter((s) => !/^\(.*\)$/.test(s)).join("/");
      for (const m of text.matchAll(/export\s+(?:const|async function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g)) found.push(`${m[1]} ${path}`);
      for (const m of text.matchAll(/export\s+const\s+\{([^}]*)\}/g))
        for (const name of m[1].split(",").map((s) => s.trim()).filter((s) => /^(GET|POST|PUT|PATCH|DELETE)$/.test(s))) found.push(`${name} ${path}`);
    } else if (/^\s*["']use server["']/.test(text)) {
      for (const m of text.matchAll(/export\s+async\s+function\s+(\w+)/g)) found.push(`${rel}#${m[1]}`);
    }
  }
  return [...new Set(found)].sort();
}

/** Runs a call; a redirect thrown by Next counts as the call going through. */
async function attempt(row: MatrixRow, target: Awaited<ReturnType<typeof createOrg>>): Promise<{ outcome: Outcome; result: unknown }> {
  try {
    const result = await row.call({ db: testDb(), target });
    return { outcome: await outcomeOf(result), result };
  } catch (err) {
    const digest = (err as { digest?: string }).digest;
    if (typeof digest === "string" && digest.startsWith("NEXT_REDIRECT")) return { outcome: "allowed", result: null };
    throw err;
  }
}

afterAll(closeTestDb);

describe("authorization matrix", () => {
  it("has a row for every route handler and server action that exists (and none for ones that do not)", () => {
    const existing = discover().filter((id) => !EXEMPT.has(id));
    const covered = rows.map((r) => r.id).sort();
    expect(existing.filter((id) => !covered.includes(id))).toEqual([]);
    expect(covered.filter((id) => !existing.includes(id))).toEqual([]);
  });

  for (const row of rows) {
    describe(row.id, () => {
      it(row.allowed === "public" ? "works without a session" : "answers 401 / 'Sign in first' without a session", async () => {
        const target = await createOrg(testDb(), "Matrix");
        actAs(null);
        expect((await attempt(row, target)).outcome).toBe(row.allowed === "public" ? "allowed" : "unauthorized");
      });
      if (row.allowed === "public") return;
      const allowed = row.allowed;
      for (const role of ROLES) {
        const expected: Outcome = allowed.includes(role) ? "allowed" : "forbidden";
        it(`${expected} for the ${role} of the organisation`, async () => {
          const target = await createOrg(testDb(), "Matrix");
          actAs(target.session(role));
          expect((await attempt(row, target)).outcome).toBe(expected);
        });
      }
      if (/^(GET|POST|PUT|PATCH|DELETE) \/api\/v1\//.test(row.id)) {
        const tokenAllowed = row.token === "allowed";
        it(tokenAllowed ? "accepts a machine token of the site" : "refuses a machine token of the site", async () => {
          const target = await createOrg(testDb(), "Matrix");
          const token = `syl_matrix_${randomUUID().replace(/-/g, "")}`;
          await testDb()
            .insert(apiTokens)
            .values({ organisationId: target.id, siteId: target.siteId, label: "matrix", prefix: token.slice(0, 12), tokenHash: hashApiToken(token) });
          actAs(null);
          setMatrixBearer(token);
          try {
            const { outcome } = await attempt(row, target);
            if (tokenAllowed) expect(outcome).toBe("allowed");
            else expect(["unauthorized", "forbidden"]).toContain(outcome);
          } finally {
            setMatrixBearer(null);
          }
        });
      }
      it("gives a member of another organisation (holding every role) nothing of this one", async () => {
        const target = await createOrg(testDb(), "Matrix");
        const other = await createOrg(testDb(), "Intruder");
        actAs(other.session("all"));
        const { outcome, result } = await attempt(row, target);
        if (row.crossOrgSeesNothing) expect(await row.crossOrgSeesNothing(result, { db: testDb(), target })).toBe(true);
        else expect(["not-found", "forbidden"]).toContain(outcome);
      });
    });
  }
});
