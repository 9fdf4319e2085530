/**
 * Overview, series, exports and what-if against the demo organisation seeded into a fixture
 * organisation: every figure must equal what the engine computes for the same months directly
 * (calculate on lib/demo's documents, rollUpYear over them), through the real handlers.
 */
import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { siteSummary } from "@/components/overview/site-summary";
import { attentionItems } from "@/components/overview/attention";
import { loadSiteYear, seriesOf } from "@/lib/ledger/site-year";
import { seedDemoSites } from "@/db/seed-sites";
import { apiTokens, auditEvents, months, readings, sites, streams } from "@/db/schema";
import { hashApiToken } from "@/lib/api/tokens";
import { calculate } from "@/lib/balance/calculate";
import { Dec, num } from "@/lib/balance/decimal";
import { rollUpYear } from "@/lib/emissions/year";
import { demoSeedMonths } from "@/lib/demo/scenario";
import { hasEnded } from "@/lib/period";
import { endedRuns, rollUpRuns } from "@/lib/ledger/year";
import { buildSeries } from "@/lib/ledger/series";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

const YEAR = "2026";
let org: FixtureOrg;
let other: FixtureOrg;
let estuaryId: string;
let dunmoorId: string;

/**
 * The engine on lib/demo's documents as the seed stores them today (complete months, and the
 * running month with the days passed), without the database in between. The year to date adds
 * up only the months that have ended.
 */
function engine(site: "estuary" | "dunmoor") {
  const results = demoSeedMonths(site)
    .filter((m) => m.doc.month.startsWith(YEAR))
    .map((m) => calculate(m.doc, { closureTolerancePct: new Dec("2") }));
  const ended = results.filter((r) => hasEnded(r.month));
  const year = rollUpYear(ended.map((r) => ({ month: r.month, input: r.emissions.input, result: r.emissions.detail })));
  return { results, ended, year };
}

const series = async (siteId: string, year = YEAR) =>
  (await import("@/app/api/v1/sites/[siteId]/years/[year]/series/route")).GET(request("GET", `/api/v1/sites/${siteId}/years/${year}/series`), ctx({ siteId, year }));
const exportOf = async (siteId: string, query: string) =>
  (await import("@/app/api/v1/sites/[siteId]/years/[year]/export/route")).GET(request("GET", `/api/v1/sites/${siteId}/years/${YEAR}/export?${query}`), ctx({ siteId, year: YEAR }));

beforeAll(async () => {
  const db = testDb();
  org = await createOrg(db, "Overview");
  other = await createOrg(db, "Elsewhere");
  await db.transaction((tx) => seedDemoSites(tx, org.id));
  const rows = await db.select().from(sites).where(eq(sites.organisationId, org.id));
  estuaryId = rows.find((s) => s.code === "estuary")!.id;
  dunmoorId = rows.find((s) => s.code === "dunmoor")!.id;
});

afterAll(closeTestDb);

describe("overview figures equal the engine's", () => {
  for (const site of ["estuary", "dunmoor"] as const) {
    it(`${site}: every month and the year to date`, async () => {
      const y = await loadSiteYear(testDb(), org.id, site === "estuary" ? estuaryId : dunmoorId, YEAR);
      const s = seriesOf(y!);
      const direct = engine(site);
      const stored = s.months.filter((m) => m.state !== null);
      expect(stored.map((m) => m.month)).toEqual(direct.results.map((r) => r.month));
      stored.forEach((m, i) => {
        const r = direct.results[i];
        expect(m.ammonia_t).toBe(num(r.feed.ammonia_t));
        expect(m.co2e_t_per_t_nh3).toBe(num(r.emissions.detail.intensity.co2e_t_per_t_nh3));
        expect(m.gj_lhv_per_t_nh3).toBe(num(r.feed.gj_lhv_per_t_nh3));
        expect(m.closure_pct.carbon).toBe(num(r.balances.carbon.closure_pct));
        expect(m.closure_pct.nitrogen).toBe(num(r.balances.nitrogen.closure_pct));
        expect(m.closure_pct.hydrogen).toBe(num(r.balances.hydrogen.closure_pct));
        expect(m.h2_n2_ratio).toBe(num(r.balances.h2n2Ratio));
      });
      expect(s.totals.co2e_t).toBe(num(direct.year.emissions.co2e_t));
      expect(s.totals.co2e_t_per_t_nh3).toBe(num(direct.year.intensity.co2e_t_per_t_nh3));
      expect(s.totals.gj_lhv_per_t_nh3).toBe(num(direct.year.intensity.gj_lhv_per_t_nh3));
      expect(s.totals.u95_co2_t).toBe(num(direct.year.uncertainty.co2.u95_t));

      // The running month is shown but left out of the year to date, and said to be.
      expect(s.totals.months_included).toEqual(direct.ended.map((r) => r.month));
      expect(s.totals.months_left_out_in_progress).toEqual(direct.results.filter((r) => !hasEnded(r.month)).map((r) => r.month));

      const summary = siteSummary(s);
      const n = direct.results.length;
      expect(summary.byState.open).toHaveLength(n);
      expect(summary.completeness).toEqual({ present: 9 * n, expected: 9 * n, months: n });
      expect(summary.latest?.closures.carbon).toBe(num(direct.ended[direct.ended.length - 1].balances.carbon.closure_pct));
      // Benchmarks come from the site's own set only: IPCC's Table 3.1 figures under the IPCC set, none under 40 CFR 98.
      const ipcc = summary.benchmarks.find((b) => b.id === "ipcc-modern-conventional");
      if (site === "dunmoor") expect(summary.benchmarks).toEqual([]);
      else expect(ipcc!.site_value).toBe(num(direct.year.emissions.co2_t.div(direct.year.ammonia_t)));
    });
  }

  it("names the drift months and who must act on them", async () => {
    const s = seriesOf((await loadSiteYear(testDb(), org.id, estuaryId, YEAR))!);
    const items = attentionItems(s, estuaryId);
    const carbon = items.find((i) => i.key === "2026-08-carbon")!;
    expect(carbon.what).toMatch(/^carbon closure −2\.6 %/);
    expect(carbon.who).toBe("process_engineer");
    expect(items.find((i) => i.key === "2026-08-suspect")!.what).toContain("EW-FQ-101");
    expect(s.suspect_meters).toEqual([expect.objectContaining({ stream: "feed", months: ["2026-08"] })]);
    const open = items.find((i) => i.key === "state-open")!;
    expect(open.months).toHaveLength(engine("estuary").results.length - 1);
  });
});

describe("GET /api/v1/sites/{siteId}/years/{year}/series", () => {
  it("answers 401 without a session", async () => {
    actAs(null);
    expect((await series(estuaryId)).status).toBe(401);
  });

  it("answers 403 to a site's API token (series need a person)", async () => {
    const token = `syl_overview_${org.id}`;
    await testDb().insert(apiTokens).values({ organisationId: org.id, siteId: estuaryId, label: "DCS", prefix: token.slice(0, 12), tokenHash: hashApiToken(token) });
    actAs(null);
    const res = (await import("@/app/api/v1/sites/[siteId]/years/[year]/series/route")).GET(
      request("GET", `/api/v1/sites/${estuaryId}/years/${YEAR}/series`, { token }),
      ctx({ siteId: estuaryId, year: YEAR }),
    );
    expect((await res).status).toBe(403);
  });

  it("answers 404 to a member of another organisation, and 400 to a malformed year", async () => {
    actAs(other.session("all"));
    expect((await series(estuaryId)).status).toBe(404);
    actAs(org.session("auditor"));
    expect((await series(estuaryId, "26")).status).toBe(400);
  });

  it("gives every role of the organisation the twelve months", async () => {
    actAs(org.session("auditor"));
    const res = await series(dunmoorId);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.format).toBe("synledger.year-series/1");
    expect(body.months).toHaveLength(12);
    expect(body.suspect_meters[0].months).toEqual(["2026-10"]);
  });
});

describe("series kept in memory never outlive their figures", () => {
  // The series of an unchanged year is served from memory (lib/ledger/site-year.ts); any change
  // to what it was made from, even one written to the database by hand, must give a new one.
  const fresh = (y: NonNullable<Awaited<ReturnType<typeof loadSiteYear>>>, now: Date) =>
    buildSeries({ site: y.site, year: y.year, runs: y.runs, streams: y.streams.map((s) => ({ key: s.key, name: s.name, meterTag: s.meterTag })), rollUp: rollUpRuns(y.runs, now), now });

  it("a reading changed in the database gives a new series, equal to one built afresh", async () => {
    const db = testDb();
    const mine = await createOrg(db, "Series memory");
    await db.transaction((tx) => seedDemoSites(tx, mine.id));
    const [site] = await db.select().from(sites).where(and(eq(sites.organisationId, mine.id), eq(sites.code, "estuary")));
    const now = new Date(`${YEAR}-12-15T00:00:00Z`);
    const before = (await loadSiteYear(db, mine.id, site.id, YEAR))!;
    const first = seriesOf(before, now);
    expect(seriesOf((await loadSiteYear(db, mine.id, site.id, YEAR))!, now)).toBe(first);

    // An ended month that is still editable (not frozen), and its ammonia reading.
    const open = before.runs.find((r) => !r.frozen && r.result && hasEnded(r.period, now))!;
    const [nh3] = await db.select({ id: streams.id }).from(streams).where(and(eq(streams.siteId, site.id), eq(streams.kind, "ammonia")));
    const [reading] = await db.select().from(readings).where(and(eq(readings.monthId, open.id), eq(readings.streamId, nh3.id)));
    await db.update(readings).set({ quantity: new Dec(reading.quantity).times("1.01").toFixed() }).where(eq(readings.id, reading.id));

    const after = (await loadSiteYear(db, mine.id, site.id, YEAR))!;
    expect(after.fingerprint).not.toBe(before.fingerprint);
    const second = seriesOf(after, now);
    expect(second).not.toBe(first);
    expect(second).toEqual(fresh(after, now));
    const month = (s: typeof first) => s.months.find((m) => m.month === open.period)!;
    expect(month(second).ammonia_t).not.toBe(month(first).ammonia_t);
  });

  it("a new month on the clock gives a new series: the running month leaves the totals once it ends", async () => {
    const db = testDb();
    const y = (await loadSiteYear(db, org.id, estuaryId, YEAR))!;
    const nov = new Date(`${YEAR}-11-20T00:00:00Z`);
    const dec = new Date(`${YEAR}-12-02T00:00:00Z`);
    expect(seriesOf(y, nov)).toEqual(fresh(y, nov));
    expect(seriesOf(y, dec)).toEqual(fresh(y, dec));
    expect(seriesOf(y, dec).months.find((m) => m.month === `${YEAR}-11`)!.timing).toBe("ended");
    expect(seriesOf(y, nov).months.find((m) => m.month === `${YEAR}-11`)!.timing).toBe("in-progress");
  });
});

describe("exports", () => {
  it("the CSV of a year carries the series' numbers, decimal for decimal", async () => {
    actAs(org.session("environmental_officer"));
    const s = await (await series(estuaryId)).json();
    const res = await exportOf(estuaryId, "format=csv");
    expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
    const lines = (await res.text()).trim().split("\r\n");
    expect(lines.filter((l) => l.startsWith('"#')).join("\n")).toMatch(/method \/ factor set \/ GWP: carbon-mass-balance \/ ipcc-2006 \/ AR5/);
    const [header, ...rows] = lines.filter((l) => !l.startsWith('"#'));
    const cols = header.split(",");
    expect(cols).toContain("CO2e intensity (t CO2e/t NH3)");
    const col = (row: string[], name: string) => row[cols.indexOf(name)];
    const cells = rows.map((r) => r.split(","));
    expect(cells).toHaveLength(13);
    s.months.forEach((m: { month: string; ammonia_t: string; co2e_t: string; co2e_t_per_t_nh3: string; closure_pct: { carbon: string } }, i: number) => {
      expect(col(cells[i], "month")).toBe(m.month);
      expect(col(cells[i], "ammonia (t NH3)")).toBe(m.ammonia_t);
      expect(col(cells[i], "CO2e (t)")).toBe(m.co2e_t);
      expect(col(cells[i], "CO2e intensity (t CO2e/t NH3)")).toBe(m.co2e_t_per_t_nh3);
      expect(col(cells[i], "carbon closure (%)")).toBe(m.closure_pct.carbon);
    });
    expect(col(cells[12], "CO2e (t)")).toBe(s.totals.co2e_t);
    expect(col(cells[12], "CO2e intensity (t CO2e/t NH3)")).toBe(s.totals.co2e_t_per_t_nh3);
  });

  it("a month's CSV has one row per stream; JSON holds the twelve plant-month files", async () => {
    actAs(org.session("signatory"));
    const csv = await (await exportOf(estuaryId, "format=csv&month=2026-03")).text();
    const rows = csv.trim().split("\r\n").filter((l) => !l.startsWith('"#'));
    expect(rows[0]).toMatch(/^stream,kind,quantity,unit/);
    expect(rows.slice(1).map((r) => r.split(",")[0])).toEqual(expect.arrayContaining(["feed", "fuel", "nh3", "co2-urea"]));
    const json = await (await exportOf(estuaryId, "format=json")).json();
    expect(json.format).toBe("synledger.plant-month-year/1");
    expect(json.months).toHaveLength(engine("estuary").results.length);
    expect(json.months[0].format).toBe("synledger.plant-month/1");
    expect((await exportOf(estuaryId, "format=xml")).status).toBe(400);
    expect((await exportOf(estuaryId, "format=csv&month=2025-01")).status).toBe(400);
  });

  it("the rule-set table recomputes the year under each built-in factor set", async () => {
    actAs(org.session("auditor"));
    const text = await (await exportOf(estuaryId, "format=csv&table=rule-sets")).text();
    const rows = text.trim().split("\r\n").filter((l) => !l.startsWith('"#')).slice(1);
    expect(rows.map((r) => r.split(",")[0])).toEqual(["ipcc-2006", "us-40cfr98", "eu-mrr"]);
    // The set's name holds commas, so it is quoted.
    expect(rows[0]).toMatch(/^ipcc-2006,"IPCC 2006 Guidelines \(Vol 2 energy, Vol 3 Ch 3 ammonia\)",yes,\d/);
    expect(rows[1]).toMatch(/,no,/);
    // The recorded set's row counts the ended months only, like the totals: the month in progress is left out.
    const { default: Papa } = await import("papaparse");
    const recorded = Papa.parse<string[]>(rows[0]).data[0];
    expect(recorded[6]).toBe(seriesOf((await loadSiteYear(testDb(), org.id, estuaryId, YEAR))!).totals.co2e_t);
  });
});

describe("what-if never writes", () => {
  it("leaves the audit trail and the months' versions as they were", async () => {
    const db = testDb();
    const auditBefore = (await db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.organisationId, org.id)))[0].n;
    const versionsBefore = await db.select({ period: months.period, version: months.version }).from(months).where(eq(months.siteId, estuaryId));
    const { runWhatIf } = await import("@/components/what-if/what-if-model");
    const y = (await loadSiteYear(db, org.id, estuaryId, YEAR))!;
    const outcome = runWhatIf(endedRuns(y.runs).map((r) => r.document), { scope: "year", storageT: "1000", fuelPct: "-5", feedPct: "0", factorSet: "eu-mrr", method: "", gwp: "AR6" }, "2");
    expect(outcome.recorded.co2e_t).toBe(seriesOf(y).totals.co2e_t);
    expect(new Dec(outcome.whatIf.co2_t!).lt(outcome.recorded.co2_t!)).toBe(true);
    expect((await db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.organisationId, org.id)))[0].n).toBe(auditBefore);
    expect(await db.select({ period: months.period, version: months.version }).from(months).where(eq(months.siteId, estuaryId))).toEqual(versionsBefore);
  });

  it("has no route handler or server action to write with", async () => {
    const { readdirSync } = await import("node:fs");
    const files = readdirSync("app/(app)/sites/[siteId]/what-if", { recursive: true }).map(String);
    expect(files).toEqual(["page.tsx"]);
    const { existsSync } = await import("node:fs");
    expect(existsSync("app/api/v1/sites/[siteId]/what-if")).toBe(false);
  });
});
