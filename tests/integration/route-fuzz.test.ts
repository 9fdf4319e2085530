/**
 * Every route handler under app/api (found from the file tree, as the authorization matrix
 * finds them) called with hostile path parameters and query values: regex metacharacters,
 * 1 000-character strings, "..", NUL, lone surrogates, numbers like 1e999. Signed in as an
 * administrator who holds every role, so each route gets past its role check and its own
 * validation is what answers. Each answer must be a 4xx with the usual error body (path
 * parameters) or at least no 5xx (query values a route may ignore), and within 250 ms: a
 * generous bound, on purpose, that only catastrophic backtracking or an unbounded loop breaks.
 * Auth.js's own route ([...nextauth]) is replaced by a stub here; tests/e2e/security.ts sends
 * it the same values on the real server.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { addExampleStreams, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

const ROOT = join(__dirname, "..", "..");
const LIMIT_MS = 250;

export const HOSTILE = [
  "(a+)+",
  "((a*)*)*b",
  "(",
  "[",
  "\\",
  ".*",
  "a".repeat(1000),
  `${"a".repeat(29)}!`,
  "..",
  "../../etc/passwd",
  "\u0000",
  "a\u0000b",
  "\ud800",
  "x\udc00y",
  "1e999",
  "-1e999",
  "NaN",
  "Infinity",
  "-1",
  "0x1F",
  " ",
  "%",
  "2026-13",
  "9999",
  "'; DROP TABLE months; --",
];

const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
type Method = (typeof METHODS)[number];
type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? walk(p) : [p];
  });
}

interface RouteFile {
  file: string;
  path: string;
  params: string[];
  methods: Method[];
  /** The names the route reads itself, with the filter names many routes share. */
  queryNames: string[];
  /** Only the names the route file reads itself. */
  ownQueryNames: string[];
}

/** Query names a route reads: its own `.get("…")` calls and those of the filter parsers it uses. */
const COMMON_QUERY = ["format", "month", "table", "year", "expectedVersion", "site", "entity", "channel", "actor", "from", "to", "page", "limit", "cursor"];

function routeFiles(): RouteFile[] {
  return walk(join(ROOT, "app", "api"))
    .filter((f) => f.endsWith("/route.ts"))
    .map((file) => {
      const rel = relative(join(ROOT, "app"), file).replace(/\/route\.ts$/, "");
      const text = readFileSync(file, "utf8");
      const methods = METHODS.filter((m) => new RegExp(`export\\s+(const|(async\\s+)?function)\\s+${m}\\b|export\\s+const\\s+\\{[^}]*\\b${m}\\b`).test(text));
      const params = [...rel.matchAll(/\[([^\]]+)\]/g)].map((m) => m[1]);
      const own = [...text.matchAll(/\.get\("([A-Za-z]+)"\)/g)].map((m) => m[1]);
      return { file: relative(ROOT, file), path: `/${rel}`, params, methods, queryNames: [...new Set([...own, ...COMMON_QUERY])], ownQueryNames: [...new Set(own)] };
    })
    .filter((r) => !r.params.some((p) => p.startsWith("...")));
}

let org: FixtureOrg;
const valid: Record<string, () => string> = {
  siteId: () => org.siteId,
  month: () => "2026-03",
  year: () => "2026",
  stream: () => "nh3",
  key: () => "estuary-grid-gas",
  attachmentId: () => "00000000-0000-4000-8000-000000000000",
  id: () => "00000000-0000-4000-8000-000000000000",
};

beforeAll(async () => {
  org = await createOrg(testDb(), "Fuzz");
  await addExampleStreams(testDb(), org.siteId);
});
afterAll(closeTestDb);

interface Answer {
  status: number;
  ms: number;
  body: unknown;
}

async function call(route: RouteFile, method: Method, params: Record<string, string>, query = ""): Promise<Answer> {
  const mod = (await import(/* @vite-ignore */ join(ROOT, route.file))) as Record<Method, Handler | undefined>;
  const handler = mod[method]!;
  const path = route.params.reduce((p, name) => p.replace(`[${name}]`, encodeURIComponent(params[name].toWellFormed())), route.path);
  const body = method === "GET" || method === "DELETE" ? {} : { json: {} };
  actAs(org.session("all"));
  const t0 = performance.now();
  const res = await handler(request(method, `${path}${query}`, body), { params: Promise.resolve(params) });
  const text = await res.text();
  const ms = performance.now() - t0;
  let parsed: unknown = text;
  try {
    parsed = JSON.parse(text);
  } catch {
    // a download (CSV, PDF): kept as text
  }
  return { status: res.status, ms, body: parsed };
}

const hasErrorBody = (b: unknown) => {
  const e = (b as { error?: { code?: unknown; message?: unknown } } | null)?.error;
  return typeof e?.code === "string" && typeof e?.message === "string" && e.message.length > 0;
};

const routes = routeFiles();
let slowest = { ms: 0, what: "" };

describe("route fuzz: hostile path parameters and query values", () => {
  it("finds every route file but Auth.js's own", () => {
    const all = walk(join(ROOT, "app", "api")).filter((f) => f.endsWith("/route.ts")).map((f) => relative(ROOT, f));
    expect(all.filter((f) => !routes.some((r) => r.file === f))).toEqual(["app/api/auth/[...nextauth]/route.ts"]);
    expect(routes.filter((r) => r.methods.length === 0).map((r) => r.file)).toEqual([]);
  });

  for (const route of routes) {
    for (const method of route.methods) {
      it(`${method} ${route.path}`, async () => {
        const problems: string[] = [];
        const note = (what: string, a: Answer) => {
          if (a.ms > slowest.ms) slowest = { ms: a.ms, what };
          if (a.ms > LIMIT_MS) problems.push(`${what}: ${a.ms.toFixed(0)} ms`);
        };
        const base = Object.fromEntries(route.params.map((p) => [p, valid[p]?.() ?? "x"]));
        // A hostile path value alone, and with each query value the route reads set to hostile text
        // too (a path value could reach code that only runs once a query value is present).
        const ownQueries = ["", ...route.ownQueryNames.flatMap((q) => [`?${q}=${"a".repeat(29)}!`, `?${q}=csv`, `?${q}=2026-03`])];
        for (const name of route.params) {
          for (const value of HOSTILE) {
            for (const query of ownQueries) {
              const a = await call(route, method, { ...base, [name]: value }, query);
              const what = `${method} ${route.path}${query} with ${name}=${JSON.stringify(value.slice(0, 30))}`;
              note(what, a);
              if (a.status < 400 || a.status >= 500) problems.push(`${what} → ${a.status}`);
              else if (!hasErrorBody(a.body)) problems.push(`${what} → ${a.status} without the error body`);
            }
          }
        }
        for (const q of route.queryNames) {
          for (const value of HOSTILE) {
            const a = await call(route, method, base, `?${q}=${encodeURIComponent(value.toWellFormed())}`);
            const what = `${method} ${route.path}?${q}=${JSON.stringify(value.slice(0, 30))}`;
            note(what, a);
            if (a.status >= 500) problems.push(`${what} → ${a.status}`);
            else if (a.status >= 400 && !hasErrorBody(a.body)) problems.push(`${what} → ${a.status} without the error body`);
          }
        }
        expect(problems).toEqual([]);
      });
    }
  }

  it("reports the slowest answer", () => {
    console.log(`route fuzz: slowest answer ${slowest.ms.toFixed(1)} ms (${slowest.what})`);
    expect(slowest.ms).toBeLessThan(LIMIT_MS);
  });
});
