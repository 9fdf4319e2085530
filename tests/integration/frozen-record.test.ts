/**
 * Signed means frozen (issue 12). A month of the demo is signed through the real life cycle;
 * then an administrator changes the site's factor set, method and GWP set and a stream's
 * analysis key, uncertainty and meter tag. Every answer about the signed month stays what it was
 * to the last digit; an open month of the same site changes. The database refuses, for the app's
 * own role, any change to the frozen month's figures or state; reopening through the service
 * keeps revision 1's snapshot and PDF. The statement carries its documents, and
 * `--check-statement` recomputes them (and catches a statement whose document was swapped).
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { statementPdf } from "@/db/queries/statements";
import { gasAnalyses, monthSnapshots, months, readings, statements, streams } from "@/db/schema";
import { runCheckStatement } from "@/lib/balance/cli";
import { readEmbeddedFiles, embedFiles } from "@/lib/signing/embed";
import { createDemoCertificate } from "@/lib/signing/demo-certificate";
import { sealPdf } from "@/lib/signing/seal";
import { loadSiteYear, seriesOf } from "@/lib/ledger/site-year";
import { renderMonthlyStatement } from "@/reports/render";
import { STREAM_DEFAULTS } from "@/lib/validations/stream";
import { sampleMonthly } from "../unit/signing/sample-models";
import { closeTestDb, testDb } from "../support/db";
import { actAs } from "../support/mock-auth";
import { ctx, errorOf, request } from "./api-support";
import { act, lifecycleOrg, monthRow, refusal, signThrough, type LifecycleOrg } from "./lifecycle-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

const SIGNED = "2026-03";
const OPEN = "2026-05";
let org: LifecycleOrg;
let siteId: string;

const resultRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/result/route");
const exportRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/export/route");
const seriesRoute = await import("@/app/api/v1/sites/[siteId]/years/[year]/series/route");
const methodRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/method/route");

const resultOf = async (period: string) => (await resultRoute.GET(request("GET", "/r"), ctx({ siteId, month: period }))).json();
const exportOf = async (period: string) => (await exportRoute.GET(request("GET", "/e"), ctx({ siteId, month: period }))).text();
const seriesMonth = async (period: string) => {
  const s = await (await seriesRoute.GET(request("GET", "/s"), ctx({ siteId, year: "2026" }))).json();
  return s.months.find((m: { month: string }) => m.month === period);
};
const yearView = async (period: string) => {
  const y = (await loadSiteYear(testDb(), org.id, siteId, "2026"))!;
  const run = y.runs.find((r) => r.period === period)!;
  return { co2e: run.result?.emissions.detail.emissions.co2e_t.toFixed(), doc: run.document, totals: seriesOf(y).totals };
};

let pdf: Buffer;
let before: { result: unknown; exported: string; series: unknown; year: unknown; openCo2e: string };

beforeAll(async () => {
  org = await lifecycleOrg("Frozen");
  siteId = org.estuaryId;
  const out = await signThrough(org, siteId, SIGNED);
  pdf = (await statementPdf(testDb(), { organisationId: org.id }, out.statementId!))!.pdf;
  actAs(org.session("auditor"));
  const y = await yearView(SIGNED);
  before = { result: await resultOf(SIGNED), exported: await exportOf(SIGNED), series: await seriesMonth(SIGNED), year: { co2e: y.co2e, doc: y.doc }, openCo2e: (await resultOf(OPEN)).result.emissions.co2e_t };
}, 120_000);
afterAll(closeTestDb);

describe("a signed month does not move when the site's set-up changes", () => {
  beforeAll(async () => {
    const { editSite, editStream } = await import("@/app/(app)/settings/sites/actions");
    actAs(org.session("administrator"));
    const [site] = await testDb().select().from(streams).where(and(eq(streams.siteId, siteId), eq(streams.key, "fuel")));
    const siteRow = (await testDb().query.sites.findFirst({ where: (s, { eq: e }) => e(s.id, siteId) }))!;
    const edited = await editSite(siteId, {
      name: siteRow.name,
      code: siteRow.code,
      meteringReference: siteRow.meteringReference,
      closureTolerancePct: siteRow.closureTolerancePct,
      factorSet: "eu-mrr",
      emissionsMethod: "fuel-calculation",
      gwp: "AR6",
    });
    expect(edited).toMatchObject({ ok: true, message: expect.stringContaining(OPEN) });
    const stream = await editStream(siteId, site.id, {
      ...STREAM_DEFAULTS,
      key: site.key,
      name: site.name,
      kind: site.kind,
      unit: site.unit,
      analysisKey: "estuary-purge",
      uncertaintyPct: "4.0",
      meterTag: "EW-FQ-999",
      calibratedOn: site.calibratedOn ?? "",
      sortOrder: String(site.sortOrder),
    });
    expect(stream).toMatchObject({ ok: true });
    actAs(org.session("auditor"));
  });

  it("/result answers the frozen result, digests included, to the last digit", async () => {
    const now = await resultOf(SIGNED);
    expect(now).toEqual(before.result);
    expect(now.frozen).toMatchObject({ document_sha256: expect.stringMatching(/^[0-9a-f]{64}$/), result_sha256: expect.stringMatching(/^[0-9a-f]{64}$/) });
  });

  it("/export gives the frozen document byte for byte, and its SHA-256 is the one printed", async () => {
    const now = await exportOf(SIGNED);
    expect(now).toBe(before.exported);
    const { createHash } = await import("node:crypto");
    expect(createHash("sha256").update(now).digest("hex")).toBe((before.result as { frozen: { document_sha256: string } }).frozen.document_sha256);
    expect(JSON.parse(now).method).toEqual({ emissions: "carbon-mass-balance", factor_set: "ipcc-2006", gwp: "AR5" });
  });

  it("the series and the year view are unchanged for it", async () => {
    expect(await seriesMonth(SIGNED)).toEqual(before.series);
    const y = await yearView(SIGNED);
    expect({ co2e: y.co2e, doc: y.doc }).toEqual(before.year);
  });

  it("an open month of the same site follows the new set-up", async () => {
    const open = await resultOf(OPEN);
    expect(open.frozen).toBeNull();
    expect(open.result.method).toMatchObject({ emissions: "fuel-calculation", factor_set: { id: "eu-mrr" }, gwp: { id: "AR6" } });
    expect(open.result.emissions.co2e_t).not.toBe(before.openCo2e);
  });
});

/** The database's own message (drizzle wraps it as the cause of "Failed query: …"). */
async function dbRefusal(run: PromiseLike<unknown>): Promise<string> {
  try {
    await run;
  } catch (err) {
    return String((err as { cause?: { message?: string } }).cause?.message ?? (err as Error).message);
  }
  throw new Error("expected the database to refuse");
}

describe("the database refuses to change a frozen month, for the app's own role", () => {
  it("UPDATE of a reading, an analysis and the state are refused with a message", async () => {
    const m = await monthRow(siteId, SIGNED);
    const db = testDb();
    expect(await dbRefusal(db.update(readings).set({ quantity: "1" }).where(eq(readings.monthId, m.id)))).toMatch(/month 2026-03 is signed, and its figures are frozen/);
    expect(await dbRefusal(db.update(gasAnalyses).set({ note: "x" }).where(eq(gasAnalyses.monthId, m.id)))).toMatch(/month 2026-03 is signed, and its figures are frozen/);
    expect(await dbRefusal(db.delete(readings).where(eq(readings.monthId, m.id)))).toMatch(/frozen/);
    expect(await dbRefusal(db.update(months).set({ state: "open" }).where(eq(months.id, m.id)))).toMatch(/it is frozen/);
    expect(await dbRefusal(db.update(months).set({ factorSet: "eu-mrr" }).where(eq(months.id, m.id)))).toMatch(/it is frozen/);
  });

  it("an open month's state cannot be moved outside the life cycle either", async () => {
    const m = await monthRow(siteId, OPEN);
    expect(await dbRefusal(testDb().update(months).set({ state: "signed" }).where(eq(months.id, m.id)))).toMatch(/change only through the life cycle/);
  });

  it("snapshots are append-only", async () => {
    const m = await monthRow(siteId, SIGNED);
    expect(await dbRefusal(testDb().update(monthSnapshots).set({ resultText: "{}" }).where(eq(monthSnapshots.monthId, m.id)))).toMatch(/append-only/);
    expect(await dbRefusal(testDb().delete(monthSnapshots).where(eq(monthSnapshots.monthId, m.id)))).toMatch(/append-only/);
  });
});

describe("the statement carries its evidence", () => {
  const file = (name: string, bytes: Buffer) => {
    const dir = mkdtempSync(join(tmpdir(), "check-statement-"));
    writeFileSync(join(dir, name), bytes);
    return join(dir, name);
  };

  it("embeds the plant-month and result documents, whose digests are the snapshot's", async () => {
    const files = await readEmbeddedFiles(pdf);
    expect(files.map((f) => [f.name, f.mediaType])).toEqual([
      ["synledger-estuary-2026-03-r1.plant-month.json", "application/json"],
      ["synledger-estuary-2026-03-r1.result.json", "application/json"],
    ]);
    const m = await monthRow(siteId, SIGNED);
    const [snap] = await testDb().select().from(monthSnapshots).where(eq(monthSnapshots.monthId, m.id));
    expect(Buffer.from(files[0].bytes).toString("utf8")).toBe(snap.documentText);
    expect(Buffer.from(files[1].bytes).toString("utf8")).toBe(snap.resultText);
    const [row] = await testDb().select({ snapshotId: statements.snapshotId }).from(statements).where(eq(statements.monthId, m.id));
    expect(row.snapshotId).toBe(snap.id);
  });

  it("--check-statement recomputes it: every figure matches, the signature covers the whole file (exit 0)", async () => {
    const out = await runCheckStatement(["--check-statement", file("statement.pdf", pdf)]);
    expect(out.stderr).toBe("");
    expect(out.code).toBe(0);
    expect(out.stdout).toMatch(/every figure of the result \(\d+ values\) matches the recomputation/);
    expect(out.stdout).toContain("covers the whole file");
  });

  it("a statement whose document was swapped for another month's and re-signed with another key exits 1, naming the figures", async () => {
    const files = await readEmbeddedFiles(pdf);
    const april = await exportOf("2026-04");
    const swapped = [
      { name: files[0].name, mediaType: "application/json", description: "swapped", bytes: Buffer.from(april.replace('"month": "2026-04"', '"month": "2026-03"'), "utf8") },
      { name: files[1].name, mediaType: "application/json", description: "original result", bytes: Buffer.from(files[1].bytes) },
    ];
    const other = createDemoCertificate({ commonName: "Someone else", organisation: "Elsewhere Ltd", bits: 2048, passphrase: "another-pass-phrase" });
    const forged = await sealPdf(await embedFiles(await renderMonthlyStatement(sampleMonthly), swapped, new Date()), other.p12, "another-pass-phrase", {
      reason: "forged",
      location: "nowhere",
      name: "forger",
      contactInfo: "x",
    });
    const out = await runCheckStatement(["--check-statement", file("forged.pdf", forged)]);
    expect(out.code).toBe(1);
    expect(out.stdout).toMatch(/figures differ from the recomputation/);
    expect(out.stdout).toMatch(/emissions\.co2e_t: the statement says "[\d.]+", recomputed "[\d.]+"/);
  });

  it("every statement of the organisation passes, the US-units site's included", async () => {
    await signThrough(org, org.dunmoorId, "2026-02");
    const all = await testDb().select({ id: statements.id, period: statements.period }).from(statements).where(eq(statements.organisationId, org.id));
    expect(all.length).toBeGreaterThanOrEqual(2);
    for (const st of all) {
      const bytes = (await statementPdf(testDb(), { organisationId: org.id }, st.id))!.pdf;
      const out = await runCheckStatement(["--check-statement", file(`${st.id}.pdf`, bytes)]);
      expect(out.code, `${st.period}: ${out.stdout}${out.stderr}`).toBe(0);
    }
  });

  it("a file that is no statement exits 2 with a message", async () => {
    const out = await runCheckStatement(["--check-statement", file("not.pdf", Buffer.from("hello"))]);
    expect(out).toMatchObject({ code: 2, stdout: "", stderr: expect.stringContaining("not a PDF file") });
    const plain = await renderMonthlyStatement(sampleMonthly);
    const none = await runCheckStatement(["--check-statement", file("plain.pdf", plain)]);
    expect(none).toMatchObject({ code: 2, stderr: expect.stringContaining("carries no plant-month and result documents") });
  });
});

describe("reopening", () => {
  it("goes through the service, starts revision 2 from the live data, and keeps revision 1's snapshot and PDF", async () => {
    const m = await monthRow(siteId, SIGNED);
    const sha = (await testDb().select({ sha256: statements.sha256 }).from(statements).where(eq(statements.monthId, m.id)))[0].sha256;
    await act(org, "signatory", siteId, SIGNED, "reopen", { reason: "The fuel meter was recalibrated; figures to be corrected." });
    const after = await monthRow(siteId, SIGNED);
    expect(after).toMatchObject({ state: "open", revision: 2 });
    const snaps = await testDb().select().from(monthSnapshots).where(eq(monthSnapshots.monthId, m.id));
    expect(snaps.map((s) => s.revision)).toEqual([1]);
    const [s1] = await testDb().select().from(statements).where(eq(statements.monthId, m.id));
    expect(s1.sha256).toBe(sha);
    // Open again: computed from the live set-up, which has changed since revision 1 was frozen.
    actAs(org.session("auditor"));
    const live = await resultOf(SIGNED);
    expect(live.frozen).toBeNull();
    expect(live.result.method.factor_set.id).toBe("ipcc-2006"); // the month keeps its own choice
  });
});

describe("the officer chooses the month's method", () => {
  const put = (period: string, body: unknown) => methodRoute.PUT(request("PUT", "/m", { json: body }), ctx({ siteId, month: period }));

  it("the officer sets it through the API; a stale version is 409", async () => {
    const m = await monthRow(siteId, "2026-06");
    actAs(org.session("environmental_officer"));
    const res = await put("2026-06", { emissions: "fuel-calculation", factor_set: "us-40cfr98", gwp: "AR4", expectedVersion: m.version });
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ version: m.version + 1, changed: true, method: { factor_set: "us-40cfr98" } });
    const stale = await put("2026-06", { emissions: "fuel-calculation", factor_set: "eu-mrr", gwp: "AR4", expectedVersion: m.version });
    expect(stale.status).toBe(409);
    expect((await resultOf("2026-06")).result.method.factor_set.id).toBe("us-40cfr98");
  });

  it("engineer, signatory and auditor get 403; a frozen month 409", async () => {
    for (const role of ["process_engineer", "signatory", "auditor"] as const) {
      actAs(org.session(role));
      expect((await put("2026-06", { emissions: "fuel-calculation", factor_set: "eu-mrr", gwp: "AR4", expectedVersion: 0 })).status).toBe(403);
    }
    const m = await monthRow(siteId, "2026-01");
    await signThrough(org, siteId, "2026-01", "The fuel analysis key was changed by this test; the closure is off on purpose.");
    actAs(org.session("environmental_officer"));
    const frozen = await put("2026-01", { emissions: "fuel-calculation", factor_set: "eu-mrr", gwp: "AR4", expectedVersion: m.version + 3 });
    expect(frozen.status).toBe(409);
    expect((await errorOf(frozen)).code).toBe("month_read_only");
  });

  it("names the field of a bad choice", async () => {
    actAs(org.session("environmental_officer"));
    const res = await put("2026-06", { emissions: "guess", factor_set: "ipcc-2006", gwp: "AR5", expectedVersion: 0 });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).issues?.map((i) => i.path)).toEqual(["emissions"]);
  });
});

describe("months in progress and months to come", () => {
  const today = new Date();
  const current = `${today.getUTCFullYear()}-${String(today.getUTCMonth() + 1).padStart(2, "0")}`;

  it("the running month cannot be balanced before its last day has passed, and the refusal names that day", async () => {
    // The seed stores the running month when at least one of its days has passed.
    const m = await monthRow(siteId, current);
    if (!m) return expect(today.getUTCDate()).toBe(1);
    const err = await refusal(() => act(org, "process_engineer", siteId, current, "balance"));
    expect(err).toMatchObject({ status: 409, code: "month_not_ended" });
    const last = new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth() + 1, 0));
    expect(err.message).toContain(`once its last day (${last.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" })}) has passed`);
  });

  it("the month API says in progress, with the days", async () => {
    const monthRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/route");
    actAs(org.session("auditor"));
    const body = await (await monthRoute.GET(request("GET", "/m"), ctx({ siteId, month: current }))).json();
    expect(body.timing).toMatchObject({ kind: "in-progress", day: today.getUTCDate(), closes_on: expect.stringMatching(/^\d{4}-\d{2}-01$/) });
  });

  it("the series marks it in progress and leaves it out of the year to date, saying so", async () => {
    actAs(org.session("auditor"));
    const year = String(today.getUTCFullYear());
    const s = await (await seriesRoute.GET(request("GET", "/s"), ctx({ siteId, year }))).json();
    const running = s.months.find((m: { month: string }) => m.month === current);
    expect(running.timing).toBe("in-progress");
    if (running.state) expect(s.totals.months_left_out_in_progress).toEqual([current]);
    expect(s.totals.months_included).not.toContain(current);
  });
});
