/**
 * The production app for the load figures: built into .next-bench (again only when a source file
 * is newer than that build), served by server.ts (Next behind its Node HTTP server) on a free loopback port against the bench
 * database, and signed in to through Auth.js's credentials endpoint like a browser would.
 */
import { spawn, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, openSync, readFileSync, readdirSync, statSync, writeFileSync } from "node:fs";
import { createServer, type AddressInfo } from "node:net";
import { join } from "node:path";
import { ROOT } from "./cluster";

const DIST = ".next-bench";
const SOURCES = ["app", "components", "db", "lib", "reports", "public", "auth.ts", "auth.config.ts", "proxy.ts", "next.config.ts", "package-lock.json"];

function newest(path: string): number {
  if (!existsSync(path)) return 0;
  const s = statSync(path);
  if (!s.isDirectory()) return s.mtimeMs;
  return readdirSync(path).reduce((m, f) => Math.max(m, newest(join(path, f))), 0);
}

/** Builds unless .next-bench is newer than every source; returns whether it built. */
export function buildIfStale(): boolean {
  const stamp = join(ROOT, DIST, "BUILD_ID");
  if (existsSync(stamp) && statSync(stamp).mtimeMs > Math.max(...SOURCES.map((s) => newest(join(ROOT, s))))) return false;
  // next build appends include lines to tsconfig.json; the bench leaves the file as it found it.
  const tsconfig = readFileSync(join(ROOT, "tsconfig.json"), "utf8");
  mkdirSync(join(ROOT, ".run"), { recursive: true });
  const log = openSync(join(ROOT, ".run", "bench-build.log"), "w");
  const r = spawnSync(process.execPath, ["node_modules/next/dist/bin/next", "build"], {
    cwd: ROOT,
    stdio: ["ignore", log, log],
    env: { ...process.env, NEXT_DIST_DIR: DIST, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1" },
  });
  writeFileSync(join(ROOT, "tsconfig.json"), tsconfig);
  if (r.status !== 0) throw new Error("next build failed; see .run/bench-build.log");
  return true;
}

export async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  const { port } = server.address() as AddressInfo;
  await new Promise<void>((r) => server.close(() => r()));
  return port;
}

export interface RunningApp {
  base: string;
  stop(): void;
  /** Resident memory of the server process and its children (Next's workers), MiB, from /proc. */
  rssMiB(): number;
}

/** VmRSS of a process and its descendants, from /proc (Linux). */
function treeRssKiB(pid: number): number {
  let kib = 0;
  try {
    const status = readFileSync(`/proc/${pid}/status`, "utf8");
    kib += Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
    const children = readFileSync(`/proc/${pid}/task/${pid}/children`, "utf8").trim().split(/\s+/).filter(Boolean).map(Number);
    for (const c of children) kib += treeRssKiB(c);
  } catch {
    /* the process ended */
  }
  return kib;
}

export async function startApp(databaseUrl: string): Promise<RunningApp> {
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const log = openSync(join(ROOT, ".run", "bench-app.log"), "w");
  const child = spawn(process.execPath, ["--import", "tsx", "server.ts"], {
    cwd: ROOT,
    detached: true, // its own process group, so stop() ends next and its workers together
    stdio: ["ignore", log, log],
    env: {
      ...process.env,
      NEXT_DIST_DIR: DIST,
      PORT: String(port),
      HOST: "127.0.0.1",
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      DATABASE_URL: databaseUrl,
      AUTH_SECRET: `bench-${Math.random().toString(36).slice(2)}-${Date.now()}-secret-long-enough`,
      AUTH_TRUST_HOST: "true",
      APP_URL: base,
      MAIL_WORKER: "0",
      SMTP_URL: "smtp://127.0.0.1:9",
    },
  });
  const stop = () => {
    try {
      process.kill(-child.pid!, "SIGTERM");
    } catch {
      /* already gone */
    }
  };
  for (let i = 0; i < 300; i++) {
    const up = await fetch(`${base}/api/v1/health`).then((r) => r.ok, () => false);
    if (up) return { base, stop, rssMiB: () => treeRssKiB(child.pid!) / 1024 };
    if (child.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 200));
  }
  stop();
  throw new Error("the app did not answer; see .run/bench-app.log");
}

/** A session cookie from Auth.js: csrf token first, then the credentials callback. */
export async function signIn(base: string, email: string, password: string): Promise<string> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  // The proxy and the route handler may each set a csrf cookie; the last one matches the token.
  const jar = [...new Map(csrf.headers.getSetCookie().map((c) => c.split(";")[0].split(/=(.*)/s) as [string, string])).entries()].map(([k, v]) => `${k}=${v}`).join("; ");
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: jar, origin: base },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${base}/` }),
  });
  const session = res.headers.getSetCookie().find((c) => c.startsWith("authjs.session-token="));
  if (!session) throw new Error(`signing in failed (${res.status} ${res.headers.get("location")})`);
  return session.split(";")[0];
}
