/**
 * A PostgreSQL cluster of the test's own, started and restarted with the same shell functions
 * npm start uses (scripts/common.sh), so a restart here is what an operator's restart would be.
 * As root the server runs as the postgres user (common.sh's as_pg); otherwise as the current user.
 */
import { execFile, execFileSync } from "node:child_process";
import { promisify } from "node:util";
import { rmSync } from "node:fs";
import { join } from "node:path";

const ROOT = join(__dirname, "..", "..");

function sh(script: string): string {
  // -l in every pg_ctl call: without a log file the server would hold this child's stdout open.
  return execFileSync("bash", ["-c", `source scripts/common.sh; ${script}`], { cwd: ROOT, encoding: "utf8", stdio: ["ignore", "pipe", "pipe"], timeout: 120_000 }).trim();
}

export interface OwnCluster {
  ownerUrl: string;
  appUrl: string;
  /**
   * `pg_ctl restart -m fast`: open sessions are ended, the server is back when this resolves.
   * Asynchronous, so the pool sees its connections close while it happens, as a running app would.
   */
  restart(): Promise<void>;
  remove(): void;
}

export function startOwnCluster(port: number, db: string): OwnCluster {
  const dir = join(ROOT, ".data", `pg-resilience-${process.pid}`);
  sh(`pg_start "${dir}" ${port} && pg_provision ${port} ${db}`);
  const ownerUrl = sh(`owner_url ${port} ${db}`);
  const appUrl = sh(`app_url ${port} ${db}`);
  return {
    ownerUrl,
    appUrl,
    restart: async () => {
      const script = `source scripts/common.sh; as_pg "$(pg_bin)/pg_ctl" -D "${dir}" -l "${dir}.log" -m fast -w -t 60 restart >/dev/null`;
      await promisify(execFile)("bash", ["-c", script], { cwd: ROOT, timeout: 120_000 });
    },
    remove: () => {
      try {
        sh(`pg_stop "${dir}"`);
      } finally {
        rmSync(dir, { recursive: true, force: true });
        rmSync(`${dir}.log`, { force: true });
      }
    },
  };
}
