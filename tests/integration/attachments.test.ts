import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { attachments, auditEvents, months, streams } from "@/db/schema";
import { closeTestDb, asLifecycle, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";

vi.mock("@/auth", () => import("../support/mock-auth"));

const monthRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/attachments/route");
const fileRoute = await import("@/app/api/v1/attachments/[attachmentId]/route");

let org: FixtureOrg;
let other: FixtureOrg;
const PERIOD = "2026-03";
const PDF = Buffer.from("%PDF-1.7\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n\u00e9", "utf8");
const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);

function upload(siteId: string, name: string, bytes: Buffer, type: string, fields: Record<string, string> = { category: "lab-certificate" }) {
  const form = new FormData();
  form.set("file", new File([new Uint8Array(bytes)], name, { type }));
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return monthRoute.POST(new Request("http://test/", { method: "POST", body: form }), { params: Promise.resolve({ siteId, month: PERIOD }) });
}
const list = (siteId: string) => monthRoute.GET(new Request("http://test/"), { params: Promise.resolve({ siteId, month: PERIOD }) });
const download = (id: string) => fileRoute.GET(new Request("http://test/"), { params: Promise.resolve({ attachmentId: id }) });
const remove = (id: string) => fileRoute.DELETE(new Request("http://test/", { method: "DELETE" }), { params: Promise.resolve({ attachmentId: id }) });

beforeAll(async () => {
  org = await createOrg(testDb(), "Attach");
  other = await createOrg(testDb(), "AttachOther");
  await testDb().insert(streams).values({ siteId: org.siteId, key: "feed", name: "Feed gas", kind: "feed-gas", unit: "Sm3", analysisKey: "ng" });
});
afterAll(closeTestDb);

describe("attachments", () => {
  let pdfId = "";

  it("refuses a PNG named .pdf, saying what it really is, and stores nothing", async () => {
    actAs(org.session("process_engineer"));
    const res = await upload(org.siteId, "gas-certificate.pdf", PNG, "application/pdf");
    expect(res.status).toBe(415);
    expect((await res.json()).error.message).toBe('"gas-certificate.pdf" is really a PNG image, not a PDF document; rename it to .png if that is what you meant to attach.');
    expect(await testDb().select({ id: attachments.id }).from(attachments).where(eq(attachments.organisationId, org.id))).toEqual([]);
  });

  it("accepts a real PDF with its SHA-256, linked to a stream, and audits the upload", async () => {
    actAs(org.session("process_engineer"));
    const res = await upload(org.siteId, "Zertifikat März.pdf", PDF, "application/pdf", { category: "calibration-certificate", stream: "feed" });
    expect(res.status).toBe(201);
    const { attachment } = await res.json();
    expect(attachment).toMatchObject({ month: PERIOD, stream: "feed", mediaType: "application/pdf", sizeBytes: PDF.length, canDelete: true, fileName: "Zertifikat März.pdf" });
    expect(attachment.sha256).toBe((await import("node:crypto")).createHash("sha256").update(PDF).digest("hex"));
    pdfId = attachment.id;
    const events = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.entity, "attachment")));
    expect(events.map((e) => [e.action, e.entityId])).toEqual([["attachment.uploaded", pdfId]]);
  });

  it("downloads the identical bytes as an attachment with the detected type and nosniff", async () => {
    actAs(org.session("auditor"));
    const res = await download(pdfId);
    expect(res.status).toBe(200);
    expect(Buffer.from(await res.arrayBuffer()).equals(PDF)).toBe(true);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("content-disposition")).toBe(`attachment; filename="Zertifikat M_rz.pdf"; filename*=UTF-8''Zertifikat%20M%C3%A4rz.pdf`);
  });

  it("lets the auditor read and download but not upload or delete", async () => {
    actAs(org.session("auditor"));
    const body = await (await list(org.siteId)).json();
    expect(body.attachments).toHaveLength(1);
    expect(body.attachments[0].canDelete).toBe(false);
    expect((await upload(org.siteId, "x.pdf", PDF, "application/pdf")).status).toBe(403);
    expect((await remove(pdfId)).status).toBe(403);
  });

  it("hides everything from another organisation (404) and from the signed-out (401)", async () => {
    actAs(other.session("administrator"));
    expect((await download(pdfId)).status).toBe(404);
    expect((await remove(pdfId)).status).toBe(404);
    expect((await list(org.siteId)).status).toBe(404);
    expect((await upload(org.siteId, "x.pdf", PDF, "application/pdf")).status).toBe(404);
    actAs(null);
    expect((await download(pdfId)).status).toBe(401);
  });

  it("deletion: not by another member, not once the month is signed, yes by an administrator, audited", async () => {
    actAs(org.session("environmental_officer"));
    expect((await remove(pdfId)).status).toBe(403);
    await asLifecycle((tx) => tx.update(months).set({ state: "signed" }).where(and(eq(months.siteId, org.siteId), eq(months.period, PERIOD))));
    actAs(org.session("process_engineer"));
    const frozen = await remove(pdfId);
    expect(frozen.status).toBe(409);
    expect((await frozen.json()).error.message).toBe("2026-03 is signed: its evidence can no longer change.");
    await asLifecycle((tx) => tx.update(months).set({ state: "balanced" }).where(and(eq(months.siteId, org.siteId), eq(months.period, PERIOD))));
    actAs(org.session("administrator"));
    expect((await remove(pdfId)).status).toBe(204);
    expect((await download(pdfId)).status).toBe(404);
    const events = await testDb().select().from(auditEvents).where(and(eq(auditEvents.organisationId, org.id), eq(auditEvents.entity, "attachment")));
    expect(events.map((e) => e.action).sort()).toEqual(["attachment.deleted", "attachment.uploaded"]);
  });

  it("refuses files over 10 MiB", async () => {
    actAs(org.session("process_engineer"));
    const res = await upload(org.siteId, "big.pdf", Buffer.concat([Buffer.from("%PDF-"), Buffer.alloc(10 * 1024 * 1024)]), "application/pdf");
    expect(res.status).toBe(413);
    expect((await res.json()).error.message).toMatch(/the limit is 10\.0 MiB/);
  });
});
