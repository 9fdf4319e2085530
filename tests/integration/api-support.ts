/**
 * Helpers for the API integration tests: requests as the handlers receive them, the route
 * context, a site with the demo's stream layout, and tokens made through the real action.
 */
import { readFileSync } from "node:fs";
import type { Db } from "@/db/client";
import { streams } from "@/db/schema";

export const BASE = "http://synledger.test";

export function ctx<P>(params: P) {
  return { params: Promise.resolve(params) };
}

export function request(method: string, path: string, opts: { json?: unknown; text?: string; token?: string; headers?: Record<string, string> } = {}): Request {
  const headers = new Headers(opts.headers);
  if (opts.token) headers.set("authorization", `Bearer ${opts.token}`);
  let body: string | undefined;
  if (opts.json !== undefined) {
    body = JSON.stringify(opts.json);
    headers.set("content-type", "application/json");
  } else if (opts.text !== undefined) body = opts.text;
  return new Request(`${BASE}${path}`, { method, headers, body });
}

export interface ErrorBody {
  error: { code: string; message: string; issues?: { path: string; message: string }[] };
}

export async function errorOf(res: Response): Promise<ErrorBody["error"]> {
  return ((await res.json()) as ErrorBody).error;
}

export const EXAMPLE_TEXT = readFileSync("examples/estuary-2026-03.json", "utf8");

/** The example file as written for another site: its `site` must name the site it is imported into. */
export function exampleFor(site: { siteName: string }, text = EXAMPLE_TEXT): string {
  const doc = JSON.parse(text) as { site: string };
  return text.replace(`"site": ${JSON.stringify(doc.site)}`, `"site": ${JSON.stringify(site.siteName)}`);
}

/** Streams of the example plant-month file, so its months import into the fixture site. */
export async function addExampleStreams(db: Db, siteId: string): Promise<string[]> {
  const doc = JSON.parse(EXAMPLE_TEXT) as { streams: { id: string; kind: string; analysis?: string; fate?: string; destination?: string; unit: string; uncertainty_pct?: string; meter?: string }[] };
  await db.insert(streams).values(
    doc.streams.map((s, i) => ({
      siteId,
      key: s.id,
      name: s.id,
      kind: s.kind as typeof streams.$inferInsert.kind,
      unit: s.unit,
      analysisKey: s.analysis ?? null,
      fate: s.fate ?? null,
      destination: s.destination ?? null,
      uncertaintyPct: s.uncertainty_pct ?? null,
      meterTag: s.meter ?? null,
      sortOrder: i,
    })),
  );
  return doc.streams.map((s) => s.id);
}
