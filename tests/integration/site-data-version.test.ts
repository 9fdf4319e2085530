/**
 * sites.data_version (migration 0015): every write to what a site's figures are made of gives
 * the site a new version, whoever writes it, and only that site; series kept in memory by it
 * (lib/ledger/site-year.ts, loadSiteSeries) are therefore never served after their data changed.
 */
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { seedDemoSites } from "@/db/seed-sites";
import { gasAnalyses, months, readings, sites, streams } from "@/db/schema";
import { Dec } from "@/lib/balance/decimal";
import { loadSiteSeries, loadSiteYear, seriesOf } from "@/lib/ledger/site-year";
import { asLifecycle, closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";

let org: FixtureOrg;
let other: FixtureOrg;
let owner: Db;
let estuary: string;

const versionOf = async (siteId: string) => (await testDb().select({ v: sites.dataVersion }).from(sites).where(eq(sites.id, siteId)))[0].v;

/** Runs the write and says whether the site's version moved (and that the other organisation's site did not). */
async function bumps(siteId: string, write: () => Promise<unknown>): Promise<boolean> {
  const before = await versionOf(siteId);
  const elsewhere = await versionOf(other.siteId);
  await write();
  expect(await versionOf(other.siteId)).toBe(elsewhere);
  return (await versionOf(siteId)) !== before;
}

beforeAll(async () => {
  org = await createOrg(testDb(), "DataVersion");
  other = await createOrg(testDb(), "DataVersionOther");
  await testDb().transaction((tx) => seedDemoSites(tx, org.id));
  estuary = (await testDb().select({ id: sites.id }).from(sites).where(and(eq(sites.organisationId, org.id), eq(sites.code, "estuary"))))[0].id;
  owner = createDb(process.env.MIGRATION_DATABASE_URL!, 1);
});
afterAll(async () => {
  await owner.$client.end();
  await closeTestDb();
});

describe("sites.data_version moves with every write to a site's figures", () => {
  it("a site setting, and not a no-op update of the same value", async () => {
    expect(await bumps(org.siteId, () => testDb().update(sites).set({ closureTolerancePct: "2.5" }).where(eq(sites.id, org.siteId)))).toBe(true);
    expect(await bumps(org.siteId, () => testDb().update(sites).set({ closureTolerancePct: "2.5" }).where(eq(sites.id, org.siteId)))).toBe(false);
  });

  it("a stream added, renamed, removed", async () => {
    expect(await bumps(org.siteId, () => testDb().insert(streams).values({ siteId: org.siteId, key: "dv-feed", name: "Feed", kind: "feed-gas", unit: "Sm3" }))).toBe(true);
    expect(await bumps(org.siteId, () => testDb().update(streams).set({ name: "Feed gas" }).where(and(eq(streams.siteId, org.siteId), eq(streams.key, "dv-feed"))))).toBe(true);
    expect(await bumps(org.siteId, () => testDb().delete(streams).where(and(eq(streams.siteId, org.siteId), eq(streams.key, "dv-feed"))))).toBe(true);
  });

  it("a reading and an analysis changed, in one statement for many rows too", async () => {
    const [month] = await testDb()
      .select({ id: months.id })
      .from(months)
      .where(and(eq(months.siteId, estuary), eq(months.state, "open")))
      .limit(1);
    expect(await bumps(estuary, () => testDb().update(readings).set({ note: "checked" }).where(eq(readings.monthId, month.id)))).toBe(true);
    expect(await bumps(estuary, () => testDb().update(gasAnalyses).set({ note: "checked" }).where(eq(gasAnalyses.monthId, month.id)))).toBe(true);
    const [one] = await testDb().select().from(readings).where(eq(readings.monthId, month.id)).limit(1);
    expect(await bumps(estuary, () => testDb().delete(readings).where(eq(readings.id, one.id)))).toBe(true);
    expect(await bumps(estuary, () => testDb().insert(readings).values(one))).toBe(true);
  });

  it("a month started, and a month moved on by the life cycle", async () => {
    expect(await bumps(org.siteId, () => testDb().insert(months).values({ siteId: org.siteId, period: "2031-01", emissionsMethod: "carbon-mass-balance", factorSet: "ipcc-2006", gwp: "AR5" }))).toBe(true);
    expect(await bumps(org.siteId, () => asLifecycle((tx) => tx.update(months).set({ state: "balanced" }).where(and(eq(months.siteId, org.siteId), eq(months.period, "2031-01")))))).toBe(true);
  });

  it("a change written by hand as the database owner", async () => {
    const [month] = await testDb().select({ id: months.id }).from(months).where(and(eq(months.siteId, estuary), eq(months.state, "open"))).limit(1);
    expect(await bumps(estuary, () => owner.execute(sql`update readings set quantity = quantity * 1.001 where month_id = ${month.id}`))).toBe(true);
  });
});

describe("series kept by the data version", () => {
  it("are served again while nothing changed, and built afresh after a reading changed by hand", async () => {
    const now = new Date("2026-12-15T00:00:00Z");
    const first = await loadSiteSeries(testDb(), org.id, estuary, "2026", now);
    expect(first).not.toBeNull();
    expect(await loadSiteSeries(testDb(), org.id, estuary, "2026", now)).toBe(first);

    const ended = first!.months.find((m) => m.timing === "ended" && !m.frozen && m.ammonia_t !== null)!;
    const [nh3] = await testDb().select({ id: streams.id }).from(streams).where(and(eq(streams.siteId, estuary), eq(streams.kind, "ammonia")));
    const [month] = await testDb().select({ id: months.id }).from(months).where(and(eq(months.siteId, estuary), eq(months.period, ended.month)));
    const [reading] = await testDb().select().from(readings).where(and(eq(readings.monthId, month.id), eq(readings.streamId, nh3.id)));
    await owner.update(readings).set({ quantity: new Dec(reading.quantity).times("1.02").toFixed() }).where(eq(readings.id, reading.id));

    const second = await loadSiteSeries(testDb(), org.id, estuary, "2026", now);
    expect(second).not.toBe(first);
    expect(second!.months.find((m) => m.month === ended.month)!.ammonia_t).not.toBe(ended.ammonia_t);
    expect(second).toEqual(seriesOf((await loadSiteYear(testDb(), org.id, estuary, "2026"))!, now));
  });

  it("answer null for another organisation's site, as for none", async () => {
    expect(await loadSiteSeries(testDb(), other.id, estuary, "2026")).toBeNull();
    expect(await loadSiteSeries(testDb(), org.id, "not-a-uuid", "2026")).toBeNull();
  });
});
