/**
 * The annual statement from the annual view, on a year that has ended (2025, twelve months
 * taken through the real life cycle): refused while a month of the year is not Signed or
 * Submitted, signed from the twelve sealed snapshots once all are, its totals equal to the sums
 * of the snapshots and to the year's CSV export, and a second signature refused until a month is
 * re-signed. The demo's own year, with its running month, cannot be stated: it has not ended.
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, eq, like } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { statementPdf } from "@/db/queries/statements";
import { monthSnapshots, statements } from "@/db/schema";
import { Dec, num } from "@/lib/balance/decimal";
import { thawCalculation } from "@/lib/ledger/freeze";
import { fixed } from "@/reports/format";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, request } from "./api-support";
import { act, lifecycleOrg, seedPastYear, signThrough, type LifecycleOrg } from "./lifecycle-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

const YEAR = "2025";
let org: LifecycleOrg;
let siteId: string;

const sign = async (who: FixtureOrg, role: Parameters<FixtureOrg["session"]>[0], year = YEAR, site = siteId) => {
  actAs(who.session(role));
  const { signAnnualStatementAction } = await import("@/app/(app)/sites/[siteId]/years/[year]/actions");
  const form = new FormData();
  form.set("siteId", site);
  form.set("year", year);
  return signAnnualStatementAction(null, form);
};

const months = Array.from({ length: 12 }, (_, i) => `${YEAR}-${String(i + 1).padStart(2, "0")}`);

beforeAll(async () => {
  org = await lifecycleOrg("Annual");
  siteId = await seedPastYear(org, "estuary", 2025);
  // Eleven months signed; December stays Open for the first test.
  for (const m of months.slice(0, 11)) await signThrough(org, siteId, m);
}, 180_000);

afterAll(closeTestDb);

describe("annual statement", () => {
  it("is refused while a month is not signed, naming it", async () => {
    const r = await sign(org, "signatory");
    expect(r.ok).toBe(false);
    expect(r.message).toMatch(/All twelve months of 2025 must be Signed or Submitted first; still waiting: 2025-12/);
  });

  it("the demo's own year cannot be stated while its running month has not ended", async () => {
    const r = await sign(org, "signatory", String(new Date().getUTCFullYear()));
    expect(r.ok).toBe(false);
    expect(r.message).toMatch(/still waiting: /);
  });

  it("is refused to roles other than the signatory, and to other organisations", async () => {
    await signThrough(org, siteId, `${YEAR}-12`);
    expect((await sign(org, "environmental_officer")).message).toMatch(/^Your role does not allow you to sign annual statements/);
    const other = await createOrg(testDb(), "Other");
    expect((await sign(other, "all")).message).toMatch(/not found/);
  });

  it("is signed from the twelve sealed snapshots: its totals are their sums exactly, as the CSV exports them", async () => {
    const r = await sign(org, "signatory");
    expect(r).toMatchObject({ ok: true });
    const [row] = await testDb().select().from(statements).where(and(eq(statements.siteId, siteId), eq(statements.kind, "annual")));
    expect(row).toMatchObject({ period: YEAR, revision: 1, monthId: null, signerRole: "Signatory" });

    // The sums of the twelve sealed calculations, at the precision they were frozen with (the
    // result documents print 15 significant digits; the sums are taken before any rounding).
    const snaps = await testDb().select().from(monthSnapshots).where(and(eq(monthSnapshots.siteId, siteId), like(monthSnapshots.period, `${YEAR}-%`)));
    expect(new Set(snaps.map((s) => s.period)).size).toBe(12);
    const calcs = snaps.map((s) => thawCalculation(s.calculationText));
    const co2e = calcs.reduce((a, c) => a.plus(c.emissions.detail.emissions.co2e_t), new Dec(0));
    const nh3 = calcs.reduce((a, c) => a.plus(c.feed.ammonia_t), new Dec(0));

    actAs(org.session("environmental_officer"));
    const { GET } = await import("@/app/api/v1/sites/[siteId]/years/[year]/export/route");
    const csv = await (await GET(request("GET", `/x?format=csv`), ctx({ siteId, year: YEAR }))).text();
    const lines = csv.trim().split("\r\n").filter((l) => !l.startsWith('"#'));
    const cols = lines[0].split(",");
    const total = lines[lines.length - 1].split(",");
    expect(total[cols.indexOf("CO2e (t)")]).toBe(num(co2e));
    expect(total[cols.indexOf("ammonia (t NH3)")]).toBe(num(nh3));

    const pdf = (await statementPdf(testDb(), { organisationId: org.id }, row.id))!.pdf;
    const dir = mkdtempSync(join(tmpdir(), "annual-"));
    writeFileSync(join(dir, "a.pdf"), pdf);
    const text = execFileSync("pdftotext", [join(dir, "a.pdf"), "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain(fixed(co2e.toFixed(), 1));
    expect(text).toContain(fixed(nh3.toFixed(), 1));
    expect(text).toContain(fixed(total[cols.indexOf("CO2e intensity (t CO2e/t NH3)")], 3));
    expect(row.summary.co2e).toBe(`${fixed(co2e.toFixed(), 1)} t CO2e`);
    // Each month's statement reference is listed.
    const monthly = await testDb().select({ id: statements.id, period: statements.period }).from(statements).where(and(eq(statements.siteId, siteId), eq(statements.kind, "monthly")));
    // (A reference may wrap in its column, so it is looked for with the text's spaces taken out.)
    const compact = text.replace(/ /g, "");
    const ofYear = monthly.filter((s) => s.period.startsWith(YEAR));
    expect(ofYear).toHaveLength(12);
    for (const m of ofYear) expect(compact, m.period).toContain(m.id);
  });

  it("is not signed twice for the same months", async () => {
    const r = await sign(org, "signatory");
    expect(r.ok).toBe(false);
    expect(r.message).toMatch(/already signed|is signed \(revision 1\)/);
  });

  it("is refused again after a month is reopened", async () => {
    await act(org, "signatory", siteId, `${YEAR}-05`, "reopen", { reason: "Fuel meter corrected after calibration report." });
    expect((await sign(org, "signatory")).message).toMatch(/still waiting: 2025-05/);
  });
});
