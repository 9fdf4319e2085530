/**
 * The annual statement from the annual view: refused while a month of the year is not Signed or
 * Submitted, signed and stored once all are, its figures equal to the year's CSV export, and a
 * second signature refused until a month is re-signed.
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { statementPdf } from "@/db/queries/statements";
import { seedDemoSites } from "@/db/seed-sites";
import { months, sites, statements } from "@/db/schema";
import { ensureDemoCertificate } from "@/lib/signing/demo-seed";
import { fixed } from "@/reports/format";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

let org: FixtureOrg;
let siteId: string;

const sign = async (who: FixtureOrg, role: Parameters<FixtureOrg["session"]>[0], site = siteId) => {
  actAs(who.session(role));
  const { signAnnualStatementAction } = await import("@/app/(app)/sites/[siteId]/years/[year]/actions");
  const form = new FormData();
  form.set("siteId", site);
  form.set("year", "2026");
  return signAnnualStatementAction(null, form);
};

const setStates = (state: "signed" | "submitted" | "open", period?: string) =>
  testDb()
    .update(months)
    .set({ state })
    .where(period ? and(eq(months.siteId, siteId), eq(months.period, period)) : eq(months.siteId, siteId));

beforeAll(async () => {
  process.env.SIGNING_SECRET ??= "integration-test-signing-secret-0123456789";
  const db = testDb();
  org = await createOrg(db, "Annual");
  await db.transaction(async (tx) => {
    await seedDemoSites(tx, org.id);
    await ensureDemoCertificate(tx, org.id);
  });
  siteId = (await db.select().from(sites).where(and(eq(sites.organisationId, org.id), eq(sites.code, "estuary"))))[0].id;
});

afterAll(closeTestDb);

describe("annual statement", () => {
  it("is refused while months are open, naming them", async () => {
    const r = await sign(org, "signatory");
    expect(r.ok).toBe(false);
    expect(r.message).toMatch(/Every month of 2026 must be Signed or Submitted first; still waiting: 2026-01/);
  });

  it("is refused to roles other than the signatory, and to other organisations", async () => {
    await setStates("signed");
    expect((await sign(org, "environmental_officer")).message).toMatch(/^Your role does not allow you to sign annual statements/);
    const other = await createOrg(testDb(), "Other");
    expect((await sign(other, "all")).message).toMatch(/not found/);
  });

  it("is signed once every month is Signed or Submitted, and prints the figures the CSV exports", async () => {
    await setStates("submitted", "2026-01");
    const r = await sign(org, "signatory");
    expect(r).toMatchObject({ ok: true });
    const [row] = await testDb().select().from(statements).where(and(eq(statements.siteId, siteId), eq(statements.kind, "annual")));
    expect(row).toMatchObject({ period: "2026", revision: 1, monthId: null, signerRole: "Signatory" });

    actAs(org.session("environmental_officer"));
    const { GET } = await import("@/app/api/v1/sites/[siteId]/years/[year]/export/route");
    const csv = await (await GET(request("GET", `/x?format=csv`), ctx({ siteId, year: "2026" }))).text();
    const lines = csv.trim().split("\r\n").filter((l) => !l.startsWith('"#'));
    const cols = lines[0].split(",");
    const total = lines[lines.length - 1].split(",");
    const pdf = (await statementPdf(testDb(), { organisationId: org.id }, row.id))!.pdf;
    const dir = mkdtempSync(join(tmpdir(), "annual-"));
    writeFileSync(join(dir, "a.pdf"), pdf);
    const text = execFileSync("pdftotext", [join(dir, "a.pdf"), "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain(fixed(total[cols.indexOf("CO2e (t)")], 1));
    expect(text).toContain(fixed(total[cols.indexOf("ammonia (t NH3)")], 1));
    expect(text).toContain(fixed(total[cols.indexOf("CO2e intensity (t CO2e/t NH3)")], 3));
    expect(row.summary.co2e).toBe(`${fixed(total[cols.indexOf("CO2e (t)")], 1)} t CO2e`);
  });

  it("is not signed twice for the same months", async () => {
    const r = await sign(org, "signatory");
    expect(r.ok).toBe(false);
    expect(r.message).toMatch(/already signed|is signed \(revision 1\)/);
  });

  it("is refused again after a month is reopened", async () => {
    await setStates("open", "2026-05");
    expect((await sign(org, "signatory")).message).toMatch(/still waiting: 2026-05/);
  });
});
