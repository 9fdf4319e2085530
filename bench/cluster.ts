/**
 * The bench's database. With DATABASE_URL set (and MIGRATION_DATABASE_URL for the owner) that
 * server is used and left running; otherwise a throw-away cluster is started on loopback with
 * the shell functions npm test uses, and removed afterwards. Either way the bench data lives in
 * an organisation of its own, so it never mixes with anyone's records.
 */
import { execFileSync } from "node:child_process";
import { rmSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { runMigrations } from "../db/migrate";

export const ROOT = fileURLToPath(new URL("..", import.meta.url));

export interface BenchDatabase {
  appUrl: string;
  ownerUrl: string;
  description: string;
  stop(): void;
}

function sh(script: string): string {
  return execFileSync("bash", ["-c", `source scripts/common.sh; ${script}`], { cwd: ROOT, encoding: "utf8", stdio: ["ignore", "pipe", "inherit"], timeout: 300_000 }).trim();
}

export async function benchDatabase(): Promise<BenchDatabase> {
  if (process.env.DATABASE_URL) {
    const appUrl = process.env.DATABASE_URL;
    const ownerUrl = process.env.MIGRATION_DATABASE_URL ?? appUrl;
    await runMigrations(ownerUrl);
    return { appUrl, ownerUrl, description: "the server in DATABASE_URL", stop: () => undefined };
  }
  const port = Number(process.env.BENCH_PGPORT ?? 55441);
  const dir = join(ROOT, ".data", `pg-bench-${process.pid}`);
  sh(`ensure_postgres_installed && pg_start "${dir}" ${port} && pg_provision ${port} synledger_bench`);
  const ownerUrl = sh(`owner_url ${port} synledger_bench`);
  const appUrl = sh(`app_url ${port} synledger_bench`);
  await runMigrations(ownerUrl);
  return {
    appUrl,
    ownerUrl,
    description: `a throw-away PostgreSQL ${sh(`"$(pg_bin)/postgres" --version | awk '{print $3}'`)} cluster on 127.0.0.1:${port}`,
    stop: () => {
      try {
        sh(`pg_stop "${dir}"`);
      } finally {
        rmSync(dir, { recursive: true, force: true });
        rmSync(`${dir}.log`, { force: true });
      }
    },
  };
}
