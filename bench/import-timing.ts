/**
 * Child process of bench/run.ts, run with the react-server condition because lib/import is
 * server-only: commits a 10 000-row CSV (10 streams × 1 000 days, long layout) into one bench
 * site through the import service, and prints the timings as one JSON line.
 *   node --conditions=react-server --import tsx bench/import-timing.ts   (BENCH_* variables set by run.ts)
 */
import { performance } from "node:perf_hooks";
import { eq } from "drizzle-orm";
import { createDb } from "../db/client";
import { streams } from "../db/schema";
import { ROLES } from "../lib/auth/roles";
import { analyseImport } from "../lib/import/analyse";
import { commitImport } from "../lib/import/commit";
import { importMappingSchema } from "../lib/import/mapping";

const env = (name: string) => process.env[name] ?? (() => { throw new Error(`${name} is not set`); })();
const ROWS = 10_000;

const db = createDb(env("BENCH_DATABASE_URL"), 4);
try {
  const siteId = env("BENCH_SITE_ID");
  const keys = (await db.select({ key: streams.key, unit: streams.unit }).from(streams).where(eq(streams.siteId, siteId))).slice(0, 10);
  const lines = ["Date,Tag,Total,Unit"];
  for (let day = 0; lines.length <= ROWS; day++) {
    // About 1 000 days from 2023: all in the past, as imported figures must be.
    const date = new Date(Date.UTC(2023, 0, 1) + day * 86_400_000).toISOString().slice(0, 10);
    for (const s of keys) if (lines.length <= ROWS) lines.push(`${date},${s.key},${(1000 + ((day * 37 + s.key.length * 11) % 500) + 0.125).toFixed(3)},${s.unit}`);
  }
  const request = {
    fileName: "bench-10000.csv",
    bytes: Buffer.from(lines.join("\n")),
    mapping: importMappingSchema.parse({ name: "bench", layout: "long", delimiter: ",", dateColumn: "Date", dateFormat: "YYYY-MM-DD", streamColumn: "Tag", quantityColumn: "Total", unitColumn: "Unit" }),
    confirmReplace: true,
  };
  const actor = { userId: env("BENCH_USER_ID"), sessionId: "bench (no session)", name: "Bench engineer", email: "bench@bench.example", organisationId: env("BENCH_ORG_ID"), organisationName: "Bench", roles: [...ROLES] };
  const noop = async () => undefined;
  const t0 = performance.now();
  const checked = await analyseImport(db, actor.organisationId, siteId, request, noop);
  const t1 = performance.now();
  const done = await commitImport(db, actor, siteId, request, noop);
  const t2 = performance.now();
  if (checked.result.issues.length) throw new Error(`the bench file has problems: ${JSON.stringify(checked.result.issues.slice(0, 3))}`);
  console.log(JSON.stringify({ rows: ROWS, bytes: request.bytes.length, months: done.months.length, previewMs: t1 - t0, commitMs: t2 - t1 }));
} finally {
  await db.$client.end();
}
