/**
 * Backups (issue 19): npm run backup writes a pg_dump custom-format file with its SHA-256; npm run
 * restore puts it into an empty database of a new cluster; there every signed statement still
 * verifies (issued or superseded, byte for byte) and the demo organisation's audit chain is whole.
 * A file whose hash does not match, or a database that is not empty, is refused.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { appendFileSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { verifyAuditChains } from "@/db/queries/audit";
import { organisations, statements } from "@/db/schema";
import { verifyStatementPdf } from "@/lib/signing/verify";
import { closeTestDb, testDb } from "../support/db";

const ROOT = path.join(__dirname, "..", "..");
const PORT = 55452;
const DATA = path.join(ROOT, ".data", `pg-restore-${process.pid}`);
const out = mkdtempSync(path.join(tmpdir(), "synledger-backup-"));
const sh = (script: string, env: Record<string, string> = {}) =>
  spawnSync("bash", ["-c", script], { cwd: ROOT, encoding: "utf8", env: { ...process.env, ...env } });
const ownerUrl = (db: string) => execFileSync("bash", ["-c", `source scripts/common.sh; owner_url ${PORT} ${db}`], { cwd: ROOT, encoding: "utf8" }).trim();

let file = "";
let restored: Db | null = null;

beforeAll(() => {
  const b = sh(`bash scripts/backup.sh ${out}`);
  expect(b.status, b.stderr).toBe(0);
  file = b.stdout.trim().split("\n")[0];
  const c = sh(`source scripts/common.sh; pg_start ${DATA} ${PORT} && pg_provision ${PORT} restored && pg_provision ${PORT} occupied`);
  expect(c.status, c.stderr).toBe(0);
}, 120_000);

afterAll(async () => {
  await restored?.$client.end();
  sh(`source scripts/common.sh; pg_stop ${DATA}`);
  rmSync(DATA, { recursive: true, force: true });
  rmSync(`${DATA}.log`, { force: true });
  rmSync(out, { recursive: true, force: true });
  await closeTestDb();
});

describe("backup → restore into a new cluster", () => {
  it("writes the dump with a SHA-256 line that sha256sum accepts", () => {
    expect(file).toMatch(/synledger-\d{8}T\d{6}Z\.dump$/);
    expect(sh(`cd ${out} && sha256sum --check ${path.basename(file)}.sha256`).status).toBe(0);
  });

  it("restores: every signed statement verifies byte for byte and the demo organisation's audit chain is whole", async () => {
    const r = sh(`bash scripts/restore.sh ${file}`, { MIGRATION_DATABASE_URL: ownerUrl("restored"), DATABASE_URL: "" });
    expect(r.status, r.stderr).toBe(0);
    restored = createDb(ownerUrl("restored"), 2);
    const source = await testDb().select({ id: statements.id }).from(statements);
    const rows = await restored.select().from(statements);
    expect(rows.length).toBe(source.length);
    expect(rows.length).toBeGreaterThan(0);
    const [demo] = await restored.select({ id: organisations.id }).from(organisations).where(eq(organisations.slug, "vellmar"));
    expect(demo, "the demo organisation is in the backup").toBeTruthy();
    // The demo's statements were really signed: each verifies. Other test organisations' rows (some
    // deliberately fake) must answer exactly as they did before the backup.
    let demoSigned = 0;
    for (const s of rows) {
      const v = await verifyStatementPdf(restored, { organisationId: s.organisationId }, s.pdf);
      if (s.organisationId === demo.id) {
        expect(["issued", "superseded"], `statement ${s.id}`).toContain(v.verdict);
        demoSigned++;
      } else {
        expect(v.verdict, `statement ${s.id}`).toBe((await verifyStatementPdf(testDb(), { organisationId: s.organisationId }, s.pdf)).verdict);
      }
    }
    expect(demoSigned).toBeGreaterThan(0);
    const chain = await verifyAuditChains(restored, demo.id);
    expect(chain.events).toBeGreaterThan(0);
    expect(chain.breaks).toEqual([]);
  });

  it("refuses a file whose SHA-256 does not match, and a database that is not empty", () => {
    const copy = path.join(out, "changed.dump");
    execFileSync("cp", [file, copy]);
    execFileSync("cp", [`${file}.sha256`, `${copy}.sha256`]);
    execFileSync("sed", ["-i", `s/${path.basename(file)}/changed.dump/`, `${copy}.sha256`]);
    appendFileSync(copy, "x");
    const bad = sh(`bash scripts/restore.sh ${copy}`, { MIGRATION_DATABASE_URL: ownerUrl("occupied"), DATABASE_URL: "" });
    expect(bad.status).not.toBe(0);
    expect(bad.stderr).toContain("does not match its SHA-256");
    const busy = sh(`bash scripts/restore.sh ${file}`, { MIGRATION_DATABASE_URL: ownerUrl("restored"), DATABASE_URL: "" });
    expect(busy.status).not.toBe(0);
    expect(busy.stderr).toContain("already holds");
  });
});
