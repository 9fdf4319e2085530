/**
 * A statement a regulator accepts (issue 13): the installation identity is required before a
 * month goes for sign-off and is printed on page 1; signing needs the declaration and an
 * acknowledgement of every unconfirmed value; the signed PDF states the total CO2e, the
 * declaration and every factor used (the electricity factor included), never "from memory",
 * embeds every font, identifies itself as PDF/A-3b (ISO 19005-3: XMP pdfaid part 3, conformance B,
 * an output intent) and keeps a valid signature (pdfsig). A US site's statement uses the gross
 * (HHV) basis and its own set's benchmarks, which are none.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { PDFArray, PDFDict, PDFDocument, PDFName, PDFNumber, PDFRawStream, PDFStream } from "pdf-lib";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as previewRoute } from "@/app/api/v1/sites/[siteId]/months/[month]/statement-preview/route";
import { statementPdf } from "@/db/queries/statements";
import { sites } from "@/db/schema";
import { runStoredMonth } from "@/lib/ledger/month-runs";
import { fixed } from "@/reports/format";
import { closeTestDb, testDb } from "../support/db";
import { actAs } from "../support/mock-auth";
import { act, lifecycleOrg, monthRow, refusal, unconfirmedOf, type LifecycleOrg } from "./lifecycle-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

const dir = mkdtempSync(join(tmpdir(), "synledger-record-"));
const save = (pdf: Buffer, name: string) => {
  const file = join(dir, name);
  writeFileSync(file, pdf);
  return file;
};
const text = (pdf: Buffer, name: string) => execFileSync("pdftotext", [save(pdf, name), "-"], { encoding: "utf8" }).replace(/\s+/g, " ");

let org: LifecycleOrg;
beforeAll(async () => {
  org = await lifecycleOrg("Record");
}, 90_000);
afterAll(closeTestDb);

describe("the installation identity before sign-off", () => {
  it("refuses to send a month for sign-off without it, naming every missing field, and accepts it once complete", async () => {
    const [site] = await testDb().select().from(sites).where(eq(sites.id, org.estuaryId));
    await testDb().update(sites).set({ installation: { ...site.installation!, operatorName: "", identifiers: [], contactEmail: "" } }).where(eq(sites.id, org.estuaryId));
    await act(org, "process_engineer", org.estuaryId, "2026-02", "balance", { reason: "Closed for the statement-record test." });
    const err = await refusal(() => act(org, "environmental_officer", org.estuaryId, "2026-02", "send-for-review"));
    expect(err.status).toBe(422);
    expect(err.message).toMatch(/installation identity/);
    expect(err.issues.map((i) => i.path)).toEqual(["installation.operatorName", "installation.identifiers", "installation.contactEmail"]);
    expect((await monthRow(org.estuaryId, "2026-02")).state).toBe("balanced");
    await testDb().update(sites).set({ installation: site.installation }).where(eq(sites.id, org.estuaryId));
    await act(org, "environmental_officer", org.estuaryId, "2026-02", "send-for-review");
    expect((await monthRow(org.estuaryId, "2026-02")).state).toBe("in_review");
  }, 60_000);
});

describe("signing needs the declaration and every acknowledgement", () => {
  it("refuses without the declaration, then without one acknowledgement, naming it", async () => {
    const m = await monthRow(org.estuaryId, "2026-02");
    const keys = await unconfirmedOf(m.id, m.revision);
    // The IPCC set's 2006 tables are unconfirmed (lib/emissions/factor-sets/ipcc-2006.ts), so there are some.
    expect(keys.length).toBeGreaterThan(0);
    const noDeclaration = await refusal(() => act(org, "signatory", org.estuaryId, "2026-02", "sign", { declaration: false }));
    expect(noDeclaration).toMatchObject({ status: 422, code: "declaration_required" });
    expect(noDeclaration.issues[0]).toMatchObject({ path: "declaration" });
    const oneShort = await refusal(() => act(org, "signatory", org.estuaryId, "2026-02", "sign", { acknowledged: keys.slice(1) }));
    expect(oneShort.issues).toEqual([{ path: `acknowledged.${keys[0]}`, message: expect.stringContaining("acknowledge the unconfirmed value") }]);
    expect((await monthRow(org.estuaryId, "2026-02")).state).toBe("in_review");
  }, 60_000);
});

describe("the preview the signatory reads", () => {
  const preview = (period: string) =>
    previewRoute(new Request(`http://test/api/v1/sites/${org.estuaryId}/months/${period}/statement-preview`), { params: Promise.resolve({ siteId: org.estuaryId, month: period }) });

  it("is the unsigned statement of the revision In review, with the same figures and the declaration; a month not In review has none", async () => {
    actAs(org.session("signatory"));
    const res = await preview("2026-02");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    const run = await runStoredMonth(testDb(), org.id, org.estuaryId, "2026-02");
    if (!run?.ok) throw new Error("the month should compute");
    const t = text(Buffer.from(await res.arrayBuffer()), "preview.pdf");
    expect(t).toContain(`${fixed(run.doc.emissions.co2e_t, 1)} t CO2e`);
    expect(t).toContain("Declaration of the signatory");
    expect(t).toContain("given at signing");
    expect(t).toContain(org.members.signatory.name);
    expect((await preview("2026-04")).status).toBe(409);
    actAs(null);
    expect((await preview("2026-02")).status).toBe(401);
  }, 60_000);
});

describe("the signed monthly statement", () => {
  let pdf: Buffer;
  let doc: Awaited<ReturnType<typeof runStoredMonth>>;
  beforeAll(async () => {
    const out = await act(org, "signatory", org.estuaryId, "2026-02", "sign");
    pdf = (await statementPdf(testDb(), { organisationId: org.id }, out.statementId!))!.pdf;
    doc = await runStoredMonth(testDb(), org.id, org.estuaryId, "2026-02");
  }, 60_000);

  it("prints the total CO2e at its rounding, the identifier, the declaration and every factor used, and never 'from memory'", () => {
    if (!doc?.ok) throw new Error("the month should compute");
    const d = doc.doc;
    const t = text(pdf, "estuary-2026-02.pdf");
    expect(t).toContain(`${fixed(d.emissions.co2e_t, 1)} t CO2e`);
    expect(t).toContain(`${fixed(d.emissions.net_co2e_t, 1)} t CO2e`);
    expect(t).toContain("NM-GHG-0417");
    expect(t).toContain("Vellmar Nitrogen Company Limited");
    expect(t).toContain("Northmere Environment Agency");
    expect(t).toContain("Declaration of the signatory");
    expect(t).toContain("I have read this statement in full");
    for (const s of d.method.sources) {
      if (s.value) expect(t, s.key).toContain(`${s.value} ${s.unit ?? ""}`.trim());
      expect(t, s.key).toContain(s.source);
    }
    // The imported electricity's factor (the site's own figure, 0.210 t CO2/MWh in the demo).
    expect(d.method.sources.some((s) => s.key === "electricity.power" && s.status === "site")).toBe(true);
    expect(t).toContain("0.21 t CO2/MWh");
    expect(t).toContain("OVERDUE since"); // the demo's power meter, calibrated 2025-01-30 on a 12-month interval
    expect(t).not.toMatch(/from memory/i);
    expect(t).not.toContain("purge-carbon-counted-in-feed (");
  });

  it("embeds every font, says PDF/A-3b in its XMP, carries an sRGB output intent, and pdfsig says the signature is valid", async () => {
    const file = save(pdf, "pdfa.pdf");
    const fonts = execFileSync("pdffonts", [file], { encoding: "utf8" }).trim().split("\n").slice(2);
    expect(fonts.length).toBeGreaterThan(0);
    for (const line of fonts) expect(line.split(/\s+/).slice(-5, -4)[0], line).toBe("yes"); // the "emb" column
    const meta = execFileSync("pdfinfo", ["-meta", file], { encoding: "utf8" });
    expect(meta).toContain("<pdfaid:part>3</pdfaid:part>");
    expect(meta).toContain("<pdfaid:conformance>B</pdfaid:conformance>");
    expect(execFileSync("pdfinfo", [file], { encoding: "utf8" })).toMatch(/PDF version:\s+1\.7/);
    const sig = spawnSync("pdfsig", [file], { encoding: "utf8" });
    expect(sig.stdout).toContain("Signature is Valid.");
    expect(sig.stdout).toContain("Total document signed");

    const loaded = await PDFDocument.load(pdf, { updateMetadata: false });
    const intents = loaded.catalog.lookup(PDFName.of("OutputIntents"), PDFArray);
    const intent = intents.lookup(0, PDFDict);
    expect(intent.lookup(PDFName.of("S"))).toEqual(PDFName.of("GTS_PDFA1"));
    const profile = intent.lookup(PDFName.of("DestOutputProfile")) as PDFStream;
    expect(profile.dict.lookup(PDFName.of("N"), PDFNumber).asNumber()).toBe(3);
    expect(loaded.catalog.lookup(PDFName.of("Metadata"))).toBeInstanceOf(PDFRawStream);
    expect(loaded.catalog.lookup(PDFName.of("AF"), PDFArray).size()).toBe(2); // the two frozen documents, as associated files
    expect(loaded.catalog.lookup(PDFName.of("Lang"))?.toString()).toContain("en-GB");
    expect(loaded.context.trailerInfo.ID).toBeDefined();
  });
});

describe("a US site's statement", () => {
  it("uses the gross (HHV) basis and US energy units, and shows only its own set's benchmarks (none)", async () => {
    await act(org, "process_engineer", org.dunmoorId, "2026-03", "balance", { reason: "Closed for the statement-record test." });
    await act(org, "environmental_officer", org.dunmoorId, "2026-03", "send-for-review");
    const out = await act(org, "signatory", org.dunmoorId, "2026-03", "sign");
    const t = text((await statementPdf(testDb(), { organisationId: org.id }, out.statementId!))!.pdf, "dunmoor.pdf");
    expect(t).toContain("gross calorific value (GCV, higher heating value)");
    expect(t).toContain("MMBtu HHV/t NH3");
    expect(t).toContain("Btu/lb");
    expect(t).toContain("US EPA GHGRP facility ID");
    expect(t).toContain("DM-552187");
    expect(t).toContain("the factor set has no benchmark for this period");
    expect(t).not.toContain("IPCC Table 3.1");
    expect(t).not.toContain("net calorific value (NCV");
  }, 90_000);
});
