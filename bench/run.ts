// npm run bench — figures, not tests: nothing here passes or fails on a number. Prints the engine
// timings, then (unless BENCH_ENGINE_ONLY=1) seeds a 50-site decade into a database of its own,
// times statement PDFs and a 10 000-row CSV import, serves the production build and loads the
// API with autocannon beside a trivial health route. Writes bench/results.md; stops what it started.
import { spawnSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import { loadavg } from "node:os";
import { join } from "node:path";
import { performance } from "node:perf_hooks";
import { createDb } from "../db/client";
import { formatTimings, runEngineBench } from "./engine";
import { buildIfStale, signIn, startApp, type RunningApp } from "./app";
import { benchDatabase, ROOT, type BenchDatabase } from "./cluster";
import { measure, type LoadFigure } from "./load";
import { timePages } from "./pages";
import { timeStatements } from "./pdf";
import { formatResults, type BenchFigures } from "./results";
import { explainHotQueries } from "./plans";
import { BENCH_PASSWORD, EXAMPLE_TEXT, seedFleet, SITE_COUNT } from "./seed";

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
/** Connection counts the API is loaded with, each in turn (BENCH_CONNECTIONS="10,50"). */
const CONNECTIONS = (process.env.BENCH_CONNECTIONS ?? "10,50").split(",").map(Number).filter((n) => n > 0);
const say = (line: string) => console.log(`[bench] ${line}`);

const loadAtStart = loadavg();
const engine = runEngineBench();
console.log(formatTimings(engine));
if (process.env.BENCH_ENGINE_ONLY === "1") process.exit(0);

let database: BenchDatabase | null = null;
let app: RunningApp | null = null;
const cleanUp = () => {
  app?.stop();
  app = null;
  database?.stop();
  database = null;
};
process.once("SIGINT", () => {
  cleanUp();
  process.exit(130);
});

try {
  const started = performance.now();
  database = await benchDatabase();
  say(`database: ${database.description}`);
  const db = createDb(database.appUrl, 4);
  const t0 = performance.now();
  const fleet = await seedFleet(db);
  const seedSeconds = (performance.now() - t0) / 1000;
  say(`seeded ${SITE_COUNT} sites, ${fleet.months} months, ${fleet.readings} readings in ${seedSeconds.toFixed(1)} s`);
  const plans = await explainHotQueries(db, fleet);
  for (const p of plans) say(`plan ${p.label}: ${p.nodes.join(", ")} (${p.ms.toFixed(2)} ms)`);
  await db.$client.end();

  const pdf = await timeStatements();
  say(`statements: ${pdf.map((p) => `${p.label} render ${p.renderMs.toFixed(0)} ms + seal ${p.sealMs.toFixed(0)} ms`).join("; ")}`);

  // lib/import is server-only: its timing runs in a child with the react-server condition.
  const child = spawnSync(process.execPath, ["--conditions=react-server", "--import", "tsx", "bench/import-timing.ts"], {
    cwd: ROOT,
    encoding: "utf8",
    env: { ...process.env, BENCH_DATABASE_URL: database.appUrl, BENCH_SITE_ID: fleet.siteIds[0], BENCH_USER_ID: fleet.userId, BENCH_ORG_ID: fleet.organisationId },
  });
  if (child.status !== 0) throw new Error(`CSV import timing failed: ${child.stderr.slice(-2000)}`);
  const csv = JSON.parse(child.stdout.trim().split("\n").pop()!) as BenchFigures["csv"];
  say(`CSV import: ${csv.rows} rows, check ${csv.previewMs.toFixed(0)} ms, commit ${csv.commitMs.toFixed(0)} ms`);

  say(buildIfStale() ? "built the app into .next-bench" : "the build in .next-bench is current");
  app = await startApp(database.appUrl);
  const cookie = await signIn(app.base, fleet.email, BENCH_PASSWORD);
  const signedIn = { cookie };
  const site = fleet.siteIds[Math.floor(SITE_COUNT / 2)];
  const targets = [
    { label: "health (no session, no database)", path: "/api/v1/health" },
    { label: `GET /api/v1/sites (first page: 100 of ${SITE_COUNT} sites)`, path: "/api/v1/sites", headers: signedIn },
    { label: `GET /api/v1/sites?limit=500 (all ${SITE_COUNT} sites in one answer)`, path: "/api/v1/sites?limit=500", headers: signedIn },
    { label: "GET a year's series (twelve months by the engine)", path: `/api/v1/sites/${site}/years/2021/series`, headers: signedIn },

    { label: `GET one month (${Math.round(fleet.readings / fleet.months)} readings, 2 analyses)`, path: `/api/v1/sites/${site}/months/2021-06`, headers: signedIn },
    {
      label: "POST /api/v1/calculate (example file)",
      path: "/api/v1/calculate",
      method: "POST" as const,
      headers: { ...signedIn, "content-type": "application/json", origin: app.base },
      body: EXAMPLE_TEXT,
    },
  ];
  // One short warm-up request each, so the first measured second is not the JIT's.
  for (const t of targets) await fetch(`${app.base}${t.path}`, { method: t.method ?? "GET", headers: t.headers, body: t.body }).then((r) => r.arrayBuffer());
  const load: { connections: number; figures: LoadFigure[] }[] = [];
  for (const connections of CONNECTIONS) {
    const figures: LoadFigure[] = [];
    for (const t of targets) {
      const f = await measure(app.base, t, SECONDS, connections);
      say(`${connections} connections, ${f.label}: p50 ${f.p50} ms, p99 ${f.p99} ms, ${f.rps.toFixed(0)} req/s${f.failed ? `, ${f.failed} failed` : ""}`);
      figures.push(f);
    }
    load.push({ connections, figures });
  }
  // Whole server-rendered pages last, at the lowest connection count only: at this scale they take
  // seconds each, and a backlog of them would slow every route measured after it.
  const pageTargets = [
    { label: `overview page, HTML (${SITE_COUNT} sites)`, path: "/", headers: signedIn },
    { label: `monthly ledger page, HTML (${SITE_COUNT} sites × 13 months)`, path: "/months", headers: signedIn },
  ];
  for (const t of pageTargets) {
    // The first render computes every site's months (nothing kept in memory yet); timed apart,
    // then the load runs against the warmed server, as the browser figures below do.
    const cold = performance.now();
    await fetch(`${app.base}${t.path}`, { headers: t.headers }).then((r) => r.arrayBuffer());
    t.label += ` (first, cold render alone: ${((performance.now() - cold) / 1000).toFixed(1)} s)`;
    const f = await measure(app.base, t, SECONDS, CONNECTIONS[0]);
    say(`${CONNECTIONS[0]} connections, ${f.label}: p50 ${f.p50} ms, p99 ${f.p99} ms, ${f.rps.toFixed(1)} req/s${f.failed ? `, ${f.failed} failed or timed out` : ""}`);
    load[0].figures.push(f);
  }
  const memoryMiB = app.rssMiB();
  say(`app server memory after the load: ${memoryMiB.toFixed(0)} MiB resident`);

  // Pages in a browser: the month, its review, the overview and the ledger of the 50-site fleet.
  const hydrated = (page: import("playwright-core").Page) => page.waitForFunction(() => document.documentElement.dataset.hydrated === "1");
  const pages = await timePages(app.base, fleet.email, BENCH_PASSWORD, [
    { label: "month entry (form interactive)", path: `/sites/${site}/months/2025-06`, ready: async (p) => { await p.locator("form[data-interactive]").waitFor(); } },
    { label: "review of the month", path: `/sites/${site}/months/2025-06/review`, ready: async (p) => { await p.getByRole("heading", { name: "Method of this month" }).waitFor(); await hydrated(p); } },
    { label: `overview (${SITE_COUNT} site cards, waiting list)`, path: "/", ready: async (p) => { await p.getByRole("heading", { name: "Overview" }).waitFor(); await p.waitForFunction(() => !document.querySelector('[aria-busy="true"]')); await hydrated(p); } },
    { label: `monthly ledger (${SITE_COUNT} sites × 13 months)`, path: "/months", ready: async (p) => { await p.getByRole("button", { name: /Needs my action/ }).waitFor(); await hydrated(p); } },
  ]);
  for (const p of pages) say(`page ${p.label}: median ${p.medianMs} ms (${p.minMs}–${p.maxMs} ms)`);

  const figures: BenchFigures = {
    loadAtStart,
    engine,
    database: database.description,
    seed: { sites: SITE_COUNT, months: fleet.months, readings: fleet.readings, seconds: seedSeconds },
    load: { seconds: SECONDS, runs: load },
    plans,
    memoryMiB,
    pdf,
    csv,
    pages,
  };
  const page = formatResults(figures);
  writeFileSync(join(ROOT, "bench", "results.md"), page);
  console.log(`\n${page}`);
  say(`wrote bench/results.md in ${((performance.now() - started) / 1000).toFixed(0)} s`);
} finally {
  cleanUp();
}
