/**
 * SQL and HTML metacharacters, bidirectional marks and emoji in every free-text field: each is
 * stored and read back byte for byte through the real actions and handlers, the tables are still
 * there afterwards, and the audit trail page's table renders them escaped. U+0000, which
 * PostgreSQL text cannot hold, is refused with a message instead of failing the request.
 */
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { listApiTokens } from "@/db/queries/api-tokens";
import { auditRecordLabels, searchAudit } from "@/db/queries/audit-trail";
import { listBatches, listMappings } from "@/db/queries/imports";
import { listInvitations } from "@/db/queries/invitations";
import { AuditTable } from "@/components/audit/audit-table";
import { SITE_DEFAULTS } from "@/lib/validations/site";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, request } from "./api-support";
import { startSmtpSink, type SmtpSink } from "./hostile-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

const sites = await import("@/app/(app)/settings/sites/actions");
const tokens = await import("@/app/(app)/settings/api-tokens/actions");
const users = await import("@/app/(app)/settings/users/actions");
const siteRoute = await import("@/app/api/v1/sites/[siteId]/route");
const streamsRoute = await import("@/app/api/v1/sites/[siteId]/streams/route");
const monthRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/route");
const readingRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/readings/[stream]/route");
const analysisRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/analyses/[key]/route");
const analysesRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/analyses/route");
const commitRoute = await import("@/app/api/v1/sites/[siteId]/imports/commit/route");
const attachRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/attachments/route");

const SQL = "'; DROP TABLE readings; --";
const HTML = "<script>alert(1)</script>";
/** Each is placed mid-text: the schemas trim ends, which is not what is being tested here. */
const NASTY = [SQL, HTML, `x\u202eevil\u200f RTL`, "🧪 👩‍🔬 Ålborg ß", `Robert"); DELETE FROM months;--`, "%s %n {{x}} ${x} \\u0041"];
const MONTH = "2026-03";
let org: FixtureOrg;
let smtp: SmtpSink;
const form = (fields: Record<string, string>) => Object.entries(fields).reduce((f, [k, v]) => (f.set(k, v), f), new FormData());

beforeAll(async () => {
  smtp = await startSmtpSink();
  process.env.SMTP_URL = `smtp://127.0.0.1:${smtp.port}`;
  org = await createOrg(testDb(), "Meta");
});
afterAll(async () => {
  await smtp.close();
  await closeTestDb();
});

describe.each(NASTY.map((text, i) => ({ text, i })))("text %#", ({ text, i }) => {
  it("site and stream names round-trip through the actions and the API", async () => {
    actAs(org.session("administrator"));
    const made = await sites.createSite({ ...SITE_DEFAULTS, name: `Site ${text} end`, code: `meta-${i}-${org.id.slice(0, 6)}` });
    expect(made).toMatchObject({ ok: true });
    const siteId = made.ok ? made.data!.id : "";
    const stream = await sites.createStream(siteId, { key: "nh3", name: `Ammonia ${text} end`, kind: "ammonia", unit: "t", analysisKey: "", destination: "", fate: "", uncertaintyPct: "", indirectFactor: "", meterTag: `TAG ${text}`.slice(0, 60), calibratedOn: "", calibrationIntervalMonths: "", sortOrder: "1" });
    expect(stream).toMatchObject({ ok: true });
    actAs(org.session("auditor"));
    const site = (await (await siteRoute.GET(request("GET", "/s"), ctx({ siteId }))).json()).site;
    expect(site.name).toBe(`Site ${text} end`);
    const s = (await (await streamsRoute.GET(request("GET", "/s"), ctx({ siteId }))).json()).streams[0];
    expect([s.name, s.meterTag]).toEqual([`Ammonia ${text} end`, `TAG ${text}`.slice(0, 60)]);
  });

  it("reading notes and analysis laboratory and note round-trip through the API", async () => {
    actAs(org.session("process_engineer"));
    const siteId = (await testDb().execute<{ id: string }>(sql`select id from sites where organisation_id = ${org.id} and code = ${`meta-${i}-${org.id.slice(0, 6)}`}`)).rows[0].id;
    expect((await readingRoute.PUT(request("PUT", "/r", { json: { quantity: "1.5", unit: "t", note: `n ${text} n` } }), ctx({ siteId, month: MONTH, stream: "nh3" }))).status).toBe(200);
    const put = await analysisRoute.PUT(request("PUT", "/a", { json: { components: { CH4: "100" }, laboratory: `lab ${text} lab`, note: `note ${text} note` } }), ctx({ siteId, month: MONTH, key: "grid-gas" }));
    expect(put.status).toBe(200);
    const month = await (await monthRoute.GET(request("GET", "/m"), ctx({ siteId, month: MONTH }))).json();
    expect(month.readings[0].note).toBe(`n ${text} n`);
    const { analyses } = await (await analysesRoute.GET(request("GET", "/a"), ctx({ siteId, month: MONTH }))).json();
    expect([analyses[0].laboratory, analyses[0].note]).toEqual([`lab ${text} lab`, `note ${text} note`]);
  });

  it("API token labels, import file and mapping names and attachment names round-trip", async () => {
    actAs(org.session("administrator"));
    expect(await tokens.createSiteApiToken(null, form({ siteId: org.siteId, label: `token ${text} ${i}` }))).toMatchObject({ ok: true });
    expect((await listApiTokens(testDb(), org.id)).map((t) => t.label)).toContain(`token ${text} ${i}`);
    const siteId = (await testDb().execute<{ id: string }>(sql`select id from sites where organisation_id = ${org.id} and code = ${`meta-${i}-${org.id.slice(0, 6)}`}`)).rows[0].id;
    actAs(org.session("process_engineer"));
    const file = `daily ${text.replace(/\//g, "")}.csv`;
    const f = form({ mapping: JSON.stringify({ name: `map ${text} end`, layout: "long", delimiter: ",", dateColumn: "Date", dateFormat: "YYYY-MM-DD", streamColumn: "Tag", quantityColumn: "Total" }) });
    f.set("file", new File([`Date,Tag,Total\n2026-04-01,nh3,${i + 1}\n`], file, { type: "text/csv" }));
    const res = await commitRoute.POST(new Request("http://t/", { method: "POST", body: f }), ctx({ siteId }));
    expect(res.status).toBe(200);
    expect((await listBatches(testDb(), siteId)).map((b) => b.fileName)).toContain(file);
    expect((await listMappings(testDb(), siteId)).map((m) => m.name)).toContain(`map ${text} end`);
    // Slashes and backslashes are the one deliberate change to an attachment's name (never a path).
    const pdfName = `cert ${text.replace(/[/\\]/g, "")}.pdf`;
    const a = form({ category: "other" });
    a.set("file", new File(["%PDF-1.7\n%%EOF\n"], pdfName, { type: "application/pdf" }));
    const up = await attachRoute.POST(new Request("http://t/", { method: "POST", body: a }), ctx({ siteId, month: MONTH }));
    expect(up.status).toBe(201);
    expect((await up.json()).attachment.fileName).toBe(pdfName);
  });
});

describe("invitation e-mail addresses that are valid but unusual", () => {
  it("are stored exactly (lower-cased) and mailed", async () => {
    actAs(org.session("administrator"));
    const email = `o'brien+drop-table.${org.id.slice(0, 6)}@fixture.example`;
    const r = await users.inviteMember(null, (() => { const f = form({ email }); f.append("roles", "auditor"); return f; })());
    expect(r).toMatchObject({ ok: true });
    expect((await listInvitations(testDb(), org.id)).map((x) => x.email)).toContain(email);
    expect(smtp.recipients).toContain(email);
  });
  it("an address with markup is refused as an address, not stored", async () => {
    actAs(org.session("administrator"));
    const f = form({ email: `${HTML}@fixture.example` });
    f.append("roles", "auditor");
    expect(await users.inviteMember(null, f)).toMatchObject({ ok: false, errors: { email: expect.stringMatching(/e-mail address/) } });
  });
});

describe("afterwards", () => {
  it("U+0000 is refused with a message, from the API (with its path) and from a form action", async () => {
    actAs(org.session("process_engineer"));
    const res = await readingRoute.PUT(request("PUT", "/r", { json: { quantity: "1", unit: "t", note: "a\u0000b" } }), ctx({ siteId: org.siteId, month: MONTH, stream: "nh3" }));
    expect(res.status).toBe(400);
    expect((await res.json()).error.issues).toEqual([{ path: "note", message: expect.stringMatching(/NUL/) }]);
    actAs(org.session("administrator"));
    const r = await sites.createSite({ ...SITE_DEFAULTS, name: "Nul\u0000site", code: `nul-${org.id.slice(0, 6)}` });
    expect(r).toMatchObject({ ok: false, message: expect.stringMatching(/NUL character/) });
  });

  it("every table is still there and the organisation's rows are readable", async () => {
    const tables = await testDb().execute<{ t: string | null }>(sql`select to_regclass('public.readings')::text as t union all select to_regclass('public.months')::text union all select to_regclass('public.sites')::text`);
    expect(tables.rows.map((r) => r.t)).toEqual(["readings", "months", "sites"]);
    expect((await testDb().execute(sql`select count(*) from readings`)).rows).toHaveLength(1);
  });

  it("the audit trail table renders every text escaped: no live markup reaches the page", async () => {
    const events = await searchAudit(testDb(), org.id, {}, { limit: 500, offset: 0 });
    const html = renderToStaticMarkup(createElement(AuditTable, { events, records: await auditRecordLabels(testDb(), org.id, events) }));
    expect(html).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    expect(html).not.toContain(HTML);
    expect(html).toContain("DROP TABLE readings");
  });
});
