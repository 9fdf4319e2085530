/**
 * Uploads that lie: attachments and CSV imports whose name, claimed type and content disagree,
 * random bytes under random names, and bodies over the limits (declared or not). Each is
 * refused with a JSON error that says what the file really is, never a 500, and stores nothing.
 */
import { count, eq } from "drizzle-orm";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { attachments, importBatches } from "@/db/schema";
import { MAX_ATTACHMENT_BYTES } from "@/lib/attachments/categories";
import { MAX_IMPORT_BYTES } from "@/lib/import/limits";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

const attachRoute = await import("@/app/api/v1/sites/[siteId]/months/[month]/attachments/route");
const commitRoute = await import("@/app/api/v1/sites/[siteId]/imports/commit/route");
const previewRoute = await import("@/app/api/v1/sites/[siteId]/imports/preview/route");

const MONTH = "2026-03";
let org: FixtureOrg;

const PNG = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
const ELF = Uint8Array.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0, 0, 0]);
const ZIP = Uint8Array.from([0x50, 0x4b, 0x03, 0x04, 20, 0, 0, 0, 8, 0]);
const PDF = new TextEncoder().encode("%PDF-1.7\n%%EOF\n");
const HTML = new TextEncoder().encode("<html><script>alert(document.cookie)</script></html>");
const MAPPING = JSON.stringify({ name: "m", layout: "long", delimiter: ",", dateColumn: "Date", dateFormat: "YYYY-MM-DD", streamColumn: "Tag", quantityColumn: "Total" });

function attach(bytes: Uint8Array, name: string, type: string, headers: Record<string, string> = {}) {
  const f = new FormData();
  f.set("file", new File([bytes as BlobPart], name, { type }));
  f.set("category", "lab-certificate");
  return attachRoute.POST(new Request("http://t/", { method: "POST", body: f, headers }), ctx({ siteId: org.siteId, month: MONTH }));
}
function importFile(route: typeof commitRoute.POST, bytes: Uint8Array, name: string, type = "text/csv") {
  const f = new FormData();
  f.set("file", new File([bytes as BlobPart], name, { type }));
  f.set("mapping", MAPPING);
  return route(new Request("http://t/", { method: "POST", body: f }), ctx({ siteId: org.siteId }));
}
const stored = async () => ({
  attachments: (await testDb().select({ n: count() }).from(attachments).where(eq(attachments.organisationId, org.id)))[0].n,
  batches: (await testDb().select({ n: count() }).from(importBatches).where(eq(importBatches.siteId, org.siteId)))[0].n,
});

/** A body that never says how long it is, streamed in 1 MiB chunks. */
function endless(total: number, boundary: string): ReadableStream<Uint8Array> {
  let sent = 0;
  const head = new TextEncoder().encode(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\nContent-Type: text/csv\r\n\r\n`);
  return new ReadableStream({
    pull(c) {
      if (sent === 0) c.enqueue(head);
      if (sent >= total) return c.close();
      c.enqueue(new Uint8Array(1024 * 1024).fill(0x31));
      sent += 1024 * 1024;
    },
  });
}

beforeAll(async () => {
  org = await createOrg(testDb(), "Uploads");
});
afterAll(closeTestDb);

describe("attachments that lie about their type", () => {
  const cases: [string, Uint8Array, string, string, RegExp][] = [
    ["a PNG named and claimed as PDF", PNG, "certificate.pdf", "application/pdf", /really a PNG image/],
    ["an HTML page named .pdf", HTML, "certificate.pdf", "application/pdf", /really a CSV text file, not a PDF document/],
    ["a program named .csv", ELF, "figures.csv", "text/csv", /is a program or library/],
    ["an Office file named .csv", ZIP, "figures.csv", "text/csv", /ZIP archive/],
    ["a real PDF claimed as an image", PDF, "certificate.pdf", "image/png", /sent as image\/png but its content is a PDF document/],
    ["a real PDF named .png", PDF, "photo.png", "image/png", /really a PDF document, not a PNG image/],
  ];
  it.each(cases)("%s: 415 naming what it is, nothing stored", async (_label, bytes, name, type, message) => {
    actAs(org.session("process_engineer"));
    const before = await stored();
    const res = await attach(bytes, name, type);
    expect(res.status).toBe(415);
    expect((await res.json()).error).toMatchObject({ code: "type_mismatch", message: expect.stringMatching(message) });
    expect(await stored()).toEqual(before);
  });

  it("random bytes under random names and claims: accepted only when all three agree, never a 500", async () => {
    actAs(org.session("process_engineer"));
    const name = fc.tuple(fc.string({ maxLength: 12 }), fc.constantFrom("pdf", "png", "jpg", "csv", "exe", "html", "")).map(([b, e]) => (e ? `${b}.${e}` : b));
    const claim = fc.constantFrom("", "application/pdf", "image/png", "image/jpeg", "text/csv", "text/html", "application/octet-stream");
    const head = fc.constantFrom(PNG, PDF, ELF, ZIP, HTML, new Uint8Array());
    await fc.assert(
      fc.asyncProperty(head, fc.uint8Array({ maxLength: 64 }), name, claim, async (h, tail, n, c) => {
        const before = await stored();
        const res = await attach(Uint8Array.from([...h, ...tail]), n, c);
        expect(res.status).toBeLessThan(500);
        if (res.status === 201) {
          const { attachment } = await res.json();
          expect(n.toLowerCase().endsWith(`.${attachment.mediaType === "image/jpeg" ? "jpg" : attachment.mediaType.split("/")[1]}`)).toBe(true);
        } else {
          expect((await res.json()).error.message.length).toBeGreaterThan(0);
          expect(await stored()).toEqual(before);
        }
      }),
      { numRuns: 100 },
    );
  });
});

describe("CSV imports that are not CSV", () => {
  it.each([
    ["a PNG renamed .csv", PNG, /NUL bytes/],
    ["an .xlsx renamed .csv", ZIP, /NUL bytes/],
    ["UTF-16 text", Uint8Array.from([0xff, 0xfe, 0x44, 0, 0x61, 0]), /UTF-16/],
    ["Latin-1 text", Uint8Array.from([...new TextEncoder().encode("Date,Tag,Total\n2026-03-01,M"), 0xfc, 0x6c, 0x6c, 0x0a]), /not UTF-8/],
  ])("%s: 400 invalid_file with what to do, preview and commit alike, nothing stored", async (_label, bytes, message) => {
    actAs(org.session("process_engineer"));
    const before = await stored();
    for (const route of [previewRoute.POST, commitRoute.POST]) {
      const res = await importFile(route, bytes, "figures.csv");
      expect(res.status).toBe(400);
      expect((await res.json()).error).toMatchObject({ code: "invalid_file", message: expect.stringMatching(message), issues: [{ path: "file", message: expect.any(String) }] });
    }
    expect(await stored()).toEqual(before);
  });

  it("a JSON body sent where a form is expected: 415 with how to send it", async () => {
    actAs(org.session("process_engineer"));
    const res = await commitRoute.POST(new Request("http://t/", { method: "POST", body: "{}", headers: { "content-type": "application/json" } }), ctx({ siteId: org.siteId }));
    expect(res.status).toBe(415);
    expect((await res.json()).error.message).toMatch(/multipart\/form-data/);
  });
});

describe("oversized uploads", () => {
  it("a declared Content-Length over the limit is refused before reading: 413", async () => {
    actAs(org.session("process_engineer"));
    const res = await attach(PDF, "c.pdf", "application/pdf", { "content-length": String(MAX_ATTACHMENT_BYTES * 2) });
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe("too_large");
  });

  it("an import file one byte over 10 MiB: 413 naming the limit, nothing stored", async () => {
    actAs(org.session("process_engineer"));
    const before = await stored();
    const res = await importFile(commitRoute.POST, new Uint8Array(MAX_IMPORT_BYTES + 1).fill(0x31), "big.csv");
    expect(res.status).toBe(413);
    expect((await res.json()).error.message).toMatch(/limit is 10\.0 MiB/);
    expect(await stored()).toEqual(before);
  });

  it("a streamed body with no length that keeps going is cut off at the limit: 413", async () => {
    actAs(org.session("process_engineer"));
    const boundary = "xyzzy";
    const req = new Request("http://t/", { method: "POST", body: endless(64 * 1024 * 1024, boundary), headers: { "content-type": `multipart/form-data; boundary=${boundary}` }, duplex: "half" } as RequestInit);
    const res = await commitRoute.POST(req, ctx({ siteId: org.siteId }));
    expect(res.status).toBe(413);
  });
});
