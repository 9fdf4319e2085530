// Engine benchmark: 600 plant-months (50 sites × 12, distinct seeded variants of the demo
// designs) and a year of daily documents for one site. Reports ms per document with its
// spread. Generation is done before timing; only calculate() (with reconciliation) is timed.
import { performance } from "node:perf_hooks";
import { calculate } from "../lib/balance/calculate";
import { embeddedEmissions } from "../lib/emissions/cbam";
import { monitoringCheck } from "../lib/emissions/eu-ets";
import type { YearMonthEntry } from "../lib/emissions/year";
import type { PlantMonth } from "../lib/balance/schema";
import { demoPlantDays, demoPlantMonths } from "../lib/demo/scenario";

export interface Timing {
  label: string;
  count: number;
  totalMs: number;
  median: number;
  p90: number;
  min: number;
  max: number;
}

function quantile(sorted: number[], q: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i];
}

export function timeDocuments(label: string, docs: PlantMonth[]): Timing {
  return timeEach(label, docs, (doc) => calculate(doc));
}

function timeEach<T>(label: string, items: T[], work: (item: T) => unknown): Timing {
  const times: number[] = [];
  for (const item of items) {
    const t0 = performance.now();
    work(item);
    times.push(performance.now() - t0);
  }
  const sorted = [...times].sort((a, b) => a - b);
  return {
    label,
    count: items.length,
    totalMs: times.reduce((a, b) => a + b, 0),
    median: quantile(sorted, 0.5),
    p90: quantile(sorted, 0.9),
    min: sorted[0],
    max: sorted[sorted.length - 1],
  };
}

export function fleetMonths(sites = 50): PlantMonth[] {
  return Array.from({ length: sites }, (_, i) => demoPlantMonths(i % 2 === 0 ? "estuary" : "dunmoor", `bench-${i}`)).flat();
}

export function runEngineBench(): Timing[] {
  const fleet = fleetMonths();
  const days = demoPlantDays("estuary");
  calculate(fleet[0]); // warm-up: JIT and the χ² critical-value cache
  const months = timeDocuments("600 plant-months (50 sites × 12)", fleet);
  const daily = timeDocuments("365 daily documents (one site, 2026)", days);
  // The EU monitoring check and the CBAM figures of each site's year, from months already computed.
  const years: YearMonthEntry[][] = Array.from({ length: fleet.length / 12 }, (_, i) =>
    fleet.slice(i * 12, i * 12 + 12).map((doc) => {
      const r = calculate(doc);
      return { month: doc.month, input: r.emissions.input, result: r.emissions.detail };
    }),
  );
  const euCbam = timeEach("EU ETS check + CBAM, 50 site-years", years, (y) => {
    monitoringCheck(y);
    embeddedEmissions(y);
  });
  return [months, daily, euCbam];
}

export function formatTimings(ts: Timing[]): string {
  const f = (x: number) => x.toFixed(2).padStart(8);
  const head = `${"run".padEnd(40)} ${"n".padStart(5)} ${"total s".padStart(8)} ${"median".padStart(8)} ${"p90".padStart(8)} ${"min".padStart(8)} ${"max".padStart(8)}  (ms per document)`;
  const rows = ts.map((t) => `${t.label.padEnd(40)} ${String(t.count).padStart(5)} ${(t.totalMs / 1000).toFixed(2).padStart(8)} ${f(t.median)} ${f(t.p90)} ${f(t.min)} ${f(t.max)}`);
  return [head, ...rows].join("\n");
}
