/**
 * A managed PostgreSQL over TLS (issue 19): a cluster of the project's own started with ssl=on
 * and a certificate from a throw-away CA. With DATABASE_CA_FILE naming that CA the app's pool
 * connects with sslmode=verify-full (the session is encrypted, pg_stat_ssl says so); with another
 * CA's certificate it is refused. The pool also sets its statement and idle-in-transaction limits.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { chmodSync, copyFileSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, withTls } from "@/db/client";

const ROOT = path.join(__dirname, "..", "..");
const PORT = 55453;
const DATA = path.join(ROOT, ".data", `pg-tls-${process.pid}`);
const certs = mkdtempSync(path.join(tmpdir(), "synledger-tls-"));
const sh = (script: string) => spawnSync("bash", ["-c", script], { cwd: ROOT, encoding: "utf8" });
const openssl = (...args: string[]) => execFileSync("openssl", args, { cwd: certs, stdio: "pipe" });

function makeCa(name: string) {
  openssl("req", "-x509", "-newkey", "rsa:2048", "-nodes", "-days", "2", "-subj", `/CN=${name}`, "-keyout", `${name}.key`, "-out", `${name}.pem`);
}

let url = "";

beforeAll(() => {
  makeCa("test-ca");
  makeCa("other-ca");
  writeFileSync(path.join(certs, "san.cnf"), "subjectAltName=IP:127.0.0.1,DNS:localhost\n");
  openssl("req", "-newkey", "rsa:2048", "-nodes", "-subj", "/CN=127.0.0.1", "-keyout", "server.key", "-out", "server.csr");
  openssl("x509", "-req", "-in", "server.csr", "-CA", "test-ca.pem", "-CAkey", "test-ca.key", "-CAcreateserial", "-days", "2", "-extfile", "san.cnf", "-out", "server.crt");
  const start = sh(`source scripts/common.sh; pg_start ${DATA} ${PORT} && pg_stop ${DATA}`);
  expect(start.status, start.stderr).toBe(0);
  copyFileSync(path.join(certs, "server.crt"), path.join(DATA, "server.crt"));
  copyFileSync(path.join(certs, "server.key"), path.join(DATA, "server.key"));
  chmodSync(path.join(DATA, "server.key"), 0o600);
  execFileSync("bash", ["-c", `echo "ssl = on" >> ${DATA}/postgresql.conf; if [ "$(id -u)" = 0 ]; then chown postgres:postgres ${DATA}/server.crt ${DATA}/server.key; fi`]);
  const again = sh(`source scripts/common.sh; pg_start ${DATA} ${PORT}`);
  expect(again.status, again.stderr).toBe(0);
  url = execFileSync("bash", ["-c", `source scripts/common.sh; owner_url ${PORT} postgres`], { cwd: ROOT, encoding: "utf8" }).trim();
}, 120_000);

afterAll(() => {
  sh(`source scripts/common.sh; pg_stop ${DATA}`);
  rmSync(DATA, { recursive: true, force: true });
  rmSync(`${DATA}.log`, { force: true });
  rmSync(certs, { recursive: true, force: true });
});

describe("PostgreSQL over TLS", () => {
  it("DATABASE_CA_FILE turns the URL into sslmode=verify-full with that CA", () => {
    expect(withTls("postgres://u:p@db.example:5432/app", "/etc/ca.pem")).toBe("postgres://u:p@db.example:5432/app?sslmode=verify-full&sslrootcert=%2Fetc%2Fca.pem");
    expect(withTls("postgres://u:p@db.example/app?sslmode=require", "/etc/ca.pem")).toContain("sslmode=require");
    expect(withTls("postgres://u:p@db.example/app", undefined)).toBe("postgres://u:p@db.example/app");
  });

  it("connects with verify-full and the right CA: the session is encrypted and the timeouts are set", async () => {
    const db = createDb(withTls(url, path.join(certs, "test-ca.pem")), 1);
    try {
      const ssl = await db.execute(sql`select ssl from pg_stat_ssl where pid = pg_backend_pid()`);
      expect(ssl.rows[0]?.ssl).toBe(true);
      const t = await db.execute(sql`select current_setting('statement_timeout') as st, current_setting('idle_in_transaction_session_timeout') as it`);
      expect(t.rows[0]).toEqual({ st: "2min", it: "5min" });
    } finally {
      await db.$client.end();
    }
  });

  it("is refused with a certificate of another CA", async () => {
    const db = createDb(withTls(url, path.join(certs, "other-ca.pem")), 1);
    try {
      const err = await db.execute(sql`select 1`).then(() => null, (e: Error & { cause?: Error }) => e);
      expect(err, "connected although the CA is wrong").not.toBeNull();
      // Drizzle wraps the driver's error; the TLS refusal is its cause.
      expect(String(err!.cause?.message ?? err!.message)).toMatch(/certificate|self.signed|verify/i);
    } finally {
      await db.$client.end();
    }
  });
});
