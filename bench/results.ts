/** The figures as a Markdown page (bench/results.md) and the machine they were measured on. */
import { availableParallelism, cpus, totalmem } from "node:os";
import type { PageFigure } from "./pages";
import type { Timing } from "./engine";
import type { LoadFigure } from "./load";
import type { PdfFigure } from "./pdf";

export interface BenchFigures {
  /** 1, 5 and 15-minute load averages when the bench began: other work on the machine skews every figure. */
  loadAtStart: number[];
  engine: Timing[];
  database: string;
  seed: { sites: number; months: number; readings: number; seconds: number };
  load: { seconds: number; runs: { connections: number; figures: LoadFigure[] }[] };
  /** EXPLAIN (ANALYZE) of the hot queries: the plan nodes that read tables, and the execution time. */
  plans: { label: string; nodes: string[]; ms: number }[];
  /** Resident memory of one app instance after the load, MiB. */
  memoryMiB: number;
  pdf: PdfFigure[];
  csv: { rows: number; bytes: number; months: number; previewMs: number; commitMs: number };
  pages: PageFigure[];
}

export function machine(): string[] {
  return [
    `- date: ${new Date().toISOString().slice(0, 16).replace("T", " ")} UTC`,
    `- CPU: ${availableParallelism()} cores (nproc), ${cpus()[0]?.model ?? "unknown model"}`,
    `- memory: ${(totalmem() / 1024 ** 3).toFixed(1)} GiB`,
    `- Node.js ${process.version} on ${process.platform}`,
  ];
}

const ms = (x: number) => x.toFixed(x < 10 ? 2 : 1);

export function formatResults(f: BenchFigures): string {
  const loadRows = f.load.runs.flatMap((run) => {
    const base = run.figures.find((x) => x.label.startsWith("health"));
    return run.figures.map((x) => {
      if (x.total === 0) return `| ${run.connections} | ${x.label} | — | — | 0 | 0 | ${x.failed} | no request completed within the ${f.load.seconds} s run |`;
      const ratio = base && x !== base ? `${(x.p50 / Math.max(base.p50, 0.01)).toFixed(1)}× / ${(x.p99 / Math.max(base.p99, 0.01)).toFixed(1)}× / ${(base.rps / Math.max(x.rps, 0.01)).toFixed(1)}×` : "1× (yardstick)";
      return `| ${run.connections} | ${x.label} | ${ms(x.p50)} | ${ms(x.p99)} | ${x.rps.toFixed(0)} | ${x.total} | ${x.failed} | ${ratio} |`;
    });
  });
  return [
    "# Synledger bench figures",
    "",
    "Written by `npm run bench`; numbers depend on the machine and on what else runs on it. The load",
    "generator (autocannon) runs on the same cores as the app and PostgreSQL, over loopback.",
    "",
    "## Machine",
    ...machine(),
    `- load average when the bench began: ${f.loadAtStart.map((x) => x.toFixed(2)).join(", ")} (1, 5, 15 min; above the core count means other work shared the machine)`,
    `- database: ${f.database}`,
    "",
    "## Engine (calculate with reconciliation, ms per document)",
    "",
    "| run | n | median | p90 | max |",
    "| --- | ---: | ---: | ---: | ---: |",
    ...f.engine.map((t) => `| ${t.label} | ${t.count} | ${ms(t.median)} | ${ms(t.p90)} | ${ms(t.max)} |`),
    "",
    `## HTTP load (${f.load.runs.map((r) => r.connections).join(" and ")} connections, ${f.load.seconds} s per route, one production server (server.ts), signed-in session cookie)`,
    "",
    `Data: ${f.seed.sites} sites × 10 years = ${f.seed.months} months, ${f.seed.readings} monthly readings (each the sum of generated daily totals), seeded in ${f.seed.seconds.toFixed(1)} s.`,
    "",
    "| connections | route | p50 ms | p99 ms | req/s | requests | non-2xx/errors | vs health (p50 / p99 / throughput) |",
    "| ---: | --- | ---: | ---: | ---: | ---: | ---: | --- |",
    ...loadRows,
    "",
    `Memory of the app server after the load: ${f.memoryMiB.toFixed(0)} MiB resident (the server process and its workers).`,
    "",
    "## Query plans (EXPLAIN ANALYZE on the seeded database)",
    "",
    "| query | plan nodes reading tables | execution ms |",
    "| --- | --- | ---: |",
    ...f.plans.map((p) => `| ${p.label} | ${p.nodes.join(", ")} | ${p.ms.toFixed(2)} |`),
    "",
    "## Statement PDFs (median of runs after a warm-up)",
    "",
    "| statement | render ms | seal ms (RSA 3072, SHA-256) | signed size | runs |",
    "| --- | ---: | ---: | ---: | ---: |",
    ...f.pdf.map((p) => `| ${p.label} | ${ms(p.renderMs)} | ${ms(p.sealMs)} | ${(p.bytes / 1024).toFixed(0)} KiB | ${p.runs} |`),
    "",
    "## CSV import (lib/import service against the bench database)",
    "",
    `${f.csv.rows} rows (${(f.csv.bytes / 1024).toFixed(0)} KiB, long layout, ${f.csv.months} months): check (parse + validate + compare) ${ms(f.csv.previewMs)} ms; commit (everything again + one transaction) ${ms(f.csv.commitMs)} ms.`,
    "",
    `## Pages in a browser (headless Chromium, 1440 px, the production build, ${f.seed.sites} sites)`,
    "",
    "From navigation start to the page's main content visible and the page hydrated; median of 5 loads after one warm-up. Target: under 1 000 ms.",
    "",
    "| page | median ms | min–max ms |",
    "| --- | ---: | ---: |",
    ...f.pages.map((p) => (p.failed ? `| ${p.label} | ${p.failed} | — |` : `| ${p.label} | ${p.medianMs} | ${p.minMs}–${p.maxMs} |`)),
    "",
  ].join("\n");
}
