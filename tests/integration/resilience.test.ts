/**
 * Resilience, on a PostgreSQL cluster of this test's own (port 55440, under .data/, removed at
 * the end; as root the server runs as the postgres user, which is how CI runs it):
 *  - the server restarted in the middle of a CSV import: the import is rolled back whole, and the
 *    same pool (no app restart) commits it on the second try;
 *  - the pool answers again after a restart without being rebuilt;
 *  - a mail server that is down leaves the message waiting in the outbox, counted; once a server
 *    listens again the message goes out.
 */
import { createServer, type AddressInfo } from "node:net";
import { and, count, eq, sql } from "drizzle-orm";
import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { runMigrations } from "@/db/migrate";
import { auditEvents, importBatches, mailOutbox, months, readings, streams } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import type { ImportRequest } from "@/lib/import/analyse";
import { commitImport } from "@/lib/import/commit";
import { importMappingSchema } from "@/lib/import/mapping";
import { deliverPending, enqueueMail } from "@/lib/mail/outbox";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { startSmtpSink } from "./hostile-support";
import { startOwnCluster, type OwnCluster } from "./resilience-support";

const PORT = Number(process.env.RESILIENCE_PGPORT ?? 55440);
let cluster: OwnCluster;
let db: Db;
let org: FixtureOrg;
let actor: Actor;

/** Two years of daily totals for two streams: 1 460 rows summed into 24 months. */
function twoYearsCsv(): Buffer {
  const lines = ["Date,Tag,Total"];
  for (let d = Date.UTC(2024, 0, 1); d < Date.UTC(2026, 0, 1); d += 86_400_000) {
    const day = new Date(d).toISOString().slice(0, 10);
    lines.push(`${day},feed,850000.5`, `${day},nh3,1450.25`);
  }
  return Buffer.from(lines.join("\n"));
}
const request = (): ImportRequest => ({
  fileName: "historian-2024-2025.csv",
  bytes: twoYearsCsv(),
  mapping: importMappingSchema.parse({ name: "historian", layout: "long", delimiter: ",", dateColumn: "Date", dateFormat: "YYYY-MM-DD", streamColumn: "Tag", quantityColumn: "Total" }),
  confirmReplace: false,
});

async function footprint() {
  const n = async (q: Promise<{ n: number }[]>) => (await q)[0].n;
  return {
    months: await n(db.select({ n: count() }).from(months).where(eq(months.siteId, org.siteId))),
    readings: await n(db.select({ n: count() }).from(readings).innerJoin(months, eq(months.id, readings.monthId)).where(eq(months.siteId, org.siteId))),
    batches: await n(db.select({ n: count() }).from(importBatches).where(eq(importBatches.siteId, org.siteId))),
    importAudit: await n(db.select({ n: count() }).from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.channel, "import")))),
  };
}

beforeAll(async () => {
  cluster = startOwnCluster(PORT, "synledger_resilience");
  await runMigrations(cluster.ownerUrl);
  db = createDb(cluster.appUrl, 4);
  org = await createOrg(db, "Resilience");
  await db.insert(streams).values([
    { siteId: org.siteId, key: "feed", name: "Feed gas", kind: "feed-gas", unit: "Sm3", analysisKey: "ng" },
    { siteId: org.siteId, key: "nh3", name: "Ammonia", kind: "ammonia", unit: "t" },
  ]);
  const m = org.members.process_engineer;
  actor = { userId: m.id, sessionId: m.sessionId, name: m.name, email: m.email, organisationId: org.id, organisationName: org.name, roles: m.roles };
}, 180_000);

afterAll(async () => {
  await db?.$client.end().catch(() => undefined);
  cluster?.remove();
}, 120_000);

describe("PostgreSQL restarted during an import", () => {
  it("rolls the whole import back, then the same pool commits it on retry", async () => {
    const empty = await footprint();
    expect(empty).toEqual({ months: 0, readings: 0, batches: 0, importAudit: 0 });
    let restartedAt = 0;
    const failed = commitImport(db, actor, org.siteId, request(), async (e) => {
      // Five of 24 months are saved (inside the one transaction) when the server goes down.
      if (e.phase === "commit" && e.done === 5 && !restartedAt) {
        restartedAt = e.done;
        await cluster.restart();
      }
    });
    await expect(failed).rejects.toThrow();
    expect(restartedAt).toBe(5);
    expect(await footprint()).toEqual(empty);

    const done = await commitImport(db, actor, org.siteId, request(), async () => undefined);
    expect(done.months).toHaveLength(24);
    expect(await footprint()).toEqual({ months: 24, readings: 48, batches: 1, importAudit: 1 + 48 });
  }, 120_000);

  it("the pool answers after a restart without being rebuilt", async () => {
    expect((await db.execute(sql`select 1 as one`)).rows).toEqual([{ one: 1 }]);
    await cluster.restart();
    expect((await db.execute(sql`select 2 as two`)).rows).toEqual([{ two: 2 }]);
  }, 120_000);
});

/** A loopback port nobody listens on: bound, then released. */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  const { port } = server.address() as AddressInfo;
  await new Promise<void>((r) => server.close(() => r()));
  return port;
}

describe("mail server down", () => {
  it("keeps the message pending with the attempt counted, and sends it once a server listens", async () => {
    const to = `verifier.${org.id.slice(0, 6)}@resilience.example`;
    const id = await enqueueMail(db, { to, subject: "Statement signed", text: "plain", html: "<p>html</p>" });
    const down = nodemailer.createTransport({ host: "127.0.0.1", port: await closedPort(), connectionTimeout: 2_000 });
    expect(await deliverPending(db, down)).toMatchObject({ sent: 0, retried: 1 });
    const [waiting] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, id));
    expect(waiting).toMatchObject({ status: "pending", attempts: 1, lastError: expect.stringMatching(/ECONNREFUSED|connect/i) });

    const sink = await startSmtpSink();
    try {
      // The back-off has not run out in a test; make the message due as time would.
      await db.update(mailOutbox).set({ nextAttemptAt: sql`now()` }).where(eq(mailOutbox.id, id));
      const up = nodemailer.createTransport({ host: "127.0.0.1", port: sink.port, ignoreTLS: true });
      expect(await deliverPending(db, up)).toMatchObject({ sent: 1 });
      const [sent] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, id));
      expect(sent).toMatchObject({ status: "sent", attempts: 2, lastError: null });
      expect(sink.recipients).toContain(to);
    } finally {
      await sink.close();
    }
  }, 60_000);
});
