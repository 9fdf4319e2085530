/**
 * Load on loopback with autocannon: a fixed number of connections for a fixed time per route,
 * the figures being latency percentiles and throughput. The trivial health route measured in
 * the same run is the yardstick: what the framework and the machine cost before any of our work.
 */
import { createRequire } from "node:module";

interface AutocannonResult {
  latency: { p50: number; p99: number; average: number };
  requests: { average: number; total: number };
  non2xx: number;
  errors: number;
  timeouts: number;
}
type Autocannon = (opts: {
  url: string;
  connections: number;
  duration: number;
  method?: string;
  headers?: Record<string, string>;
  body?: string;
}) => Promise<AutocannonResult>;

// autocannon ships no type declarations; the few fields used are declared above.
const autocannon = createRequire(import.meta.url)("autocannon") as Autocannon;

export interface LoadFigure {
  label: string;
  p50: number;
  p99: number;
  mean: number;
  rps: number;
  total: number;
  failed: number;
}

export interface LoadTarget {
  label: string;
  path: string;
  method?: "GET" | "POST";
  headers?: Record<string, string>;
  body?: string;
}

export async function measure(base: string, t: LoadTarget, seconds: number, connections: number): Promise<LoadFigure> {
  const r = await autocannon({ url: `${base}${t.path}`, connections, duration: seconds, method: t.method ?? "GET", headers: t.headers, body: t.body });
  return {
    label: t.label,
    p50: r.latency.p50,
    p99: r.latency.p99,
    mean: r.latency.average,
    rps: r.requests.average,
    total: r.requests.total,
    failed: r.non2xx + r.errors + r.timeouts,
  };
}
