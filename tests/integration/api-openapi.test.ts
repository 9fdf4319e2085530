import { readdirSync, readFileSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { describe, expect, it } from "vitest";
import { GET } from "@/app/api/v1/openapi.json/route";

const ROOT = "app/api/v1";
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = join(dir, e.name);
    if (e.isDirectory()) return routeFiles(p);
    return e.name === "route.ts" ? [p] : [];
  });
}

/** app/api/v1/sites/[siteId]/route.ts → /api/v1/sites/{siteId} */
function apiPath(file: string): string {
  const segments = relative(ROOT, file).split(sep).slice(0, -1).map((s) => s.replace(/^\[(.+)\]$/, "{$1}"));
  return ["/api/v1", ...segments].join("/");
}

/** Methods a route file exports, read from its text so no route module has to be loaded. */
function exportedMethods(file: string): string[] {
  const text = readFileSync(file, "utf8");
  return METHODS.filter((m) => new RegExp(`export\\s+(const|(async\\s+)?function)\\s+${m}\\b`).test(text));
}

describe("GET /api/v1/openapi.json", () => {
  it("is an OpenAPI 3.1 document with the error body and both kinds of security", async () => {
    const doc = await (await GET()).json();
    expect(doc.openapi).toBe("3.1.0");
    expect(Object.keys(doc.components.securitySchemes).sort()).toEqual(["session", "siteToken"]);
    expect(doc.components.schemas.Error.properties.error.required).toEqual(["code", "message"]);
  });

  it("describes every route file under app/api/v1, with each method it exports", async () => {
    const doc = await (await GET()).json();
    const files = routeFiles(ROOT);
    expect(files.length).toBeGreaterThan(10);
    const missing: string[] = [];
    for (const file of files) {
      const path = apiPath(file);
      for (const method of exportedMethods(file)) {
        if (!doc.paths[path]?.[method.toLowerCase()]) missing.push(`${method} ${path} (${file})`);
      }
    }
    expect(missing).toEqual([]);
  });

  it("names only paths that exist, and declares every path parameter", async () => {
    const doc = await (await GET()).json();
    const known = new Set(routeFiles(ROOT).map(apiPath));
    for (const [path, ops] of Object.entries<Record<string, { parameters?: { name: string; in: string }[] }>>(doc.paths)) {
      expect(known.has(path), path).toBe(true);
      const wanted = [...path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]).sort();
      for (const op of Object.values(ops)) {
        expect((op.parameters ?? []).filter((p) => p.in === "path").map((p) => p.name).sort(), path).toEqual(wanted);
      }
    }
  });
});
