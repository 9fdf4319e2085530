/**
 * The tamper-evident audit trail (issue 19): every event carries the hash of its organisation's
 * previous event and its own; concurrent writers still make one unbroken chain; the CSV export
 * carries what a verifier needs to recompute the chain offline; and a row edited by the database
 * owner with the append-only trigger disabled is named by the check and by `npm run audit:verify`.
 */
import { spawnSync } from "node:child_process";
import Papa from "papaparse";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { recordAudit, verifyAuditChains } from "@/db/queries/audit";
import { checkChain, type ChainRow } from "@/lib/audit/chain";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

let org: FixtureOrg;

beforeAll(async () => {
  org = await createOrg(testDb(), "Chain");
  // Twenty writers at once, as several app instances would: the per-organisation lock keeps one chain.
  await Promise.all(
    Array.from({ length: 20 }, (_, i) =>
      recordAudit(testDb(), {
        organisationId: org.id, actorLabel: `writer ${i}`, channel: "form", action: "update", entity: "test", entityId: String(i),
        before: { value: i, nested: { when: new Date(Date.UTC(2026, 0, 1 + i)), text: "a,b\n\"c\"" } }, after: { value: i + 1 }, reason: i % 2 ? "because" : null,
      }),
    ),
  );
});

afterAll(closeTestDb);

describe("audit hash chain", () => {
  it("is whole after concurrent writes, every event chained", async () => {
    const r = await verifyAuditChains(testDb(), org.id);
    expect(r.breaks).toEqual([]);
    expect(r.beforeChain).toBe(0);
    expect(r.events).toBeGreaterThanOrEqual(20);
  });

  it("can be checked offline from the CSV export alone", async () => {
    actAs(org.session("auditor"));
    const res = await (await import("@/app/api/v1/audit/export/route")).GET(request("GET", "/api/v1/audit/export"), { params: Promise.resolve({}) });
    expect(res.status).toBe(200);
    const parsed = Papa.parse<Record<string, string>>((await res.text()).replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: true });
    const rows: ChainRow[] = parsed.data
      .map((c) => ({
        id: Number(c.id), organisationId: c.organisation_id, siteId: c.site_id || null, actorUserId: c.actor_user_id || null, actorLabel: c.actor,
        channel: c.channel, action: c.action, entity: c.entity, entityId: c.entity_id || null, reason: c.reason || null,
        before: c.before_json ? JSON.parse(c.before_json) : null, after: c.after_json ? JSON.parse(c.after_json) : null,
        at: new Date(c.at_utc), prevHash: c.prev_hash || null, hash: c.hash || null,
      }))
      .sort((a, b) => a.id - b.id);
    expect(rows.length).toBeGreaterThanOrEqual(20);
    expect(checkChain(rows).firstBreak).toBeNull();
  });

  it("names the event the database owner altered with the trigger disabled, in the check and in npm run audit:verify", async () => {
    const rows = await verifyAuditChains(testDb(), org.id);
    expect(rows.breaks).toEqual([]);
    const owner = new pg.Client({ connectionString: process.env.MIGRATION_DATABASE_URL });
    await owner.connect();
    let victim: number;
    try {
      const { rows: r } = await owner.query("select id from audit_events where organisation_id = $1 order by id offset 7 limit 1", [org.id]);
      victim = Number(r[0].id);
      await owner.query("begin");
      await owner.query("alter table audit_events disable trigger audit_events_append_only");
      await owner.query("update audit_events set reason = 'rewritten quietly' where id = $1", [victim]);
      await owner.query("alter table audit_events enable trigger audit_events_append_only");
      await owner.query("commit");
    } finally {
      await owner.end();
    }
    const after = await verifyAuditChains(testDb(), org.id);
    expect(after.breaks).toHaveLength(1);
    expect(after.breaks[0].id).toBe(victim);
    expect(after.breaks[0].reason).toMatch(/altered/);

    const cli = spawnSync("node", ["--import", "./scripts/allow-server-modules.mjs", "--import", "tsx", "scripts/audit-verify.ts", "--org", org.id], { encoding: "utf8", env: process.env });
    expect(cli.status).toBe(1);
    expect(cli.stdout).toContain(`BROKEN organisation ${org.id}: event ${victim}`);
  });
});
