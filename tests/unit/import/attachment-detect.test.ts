import { describe, expect, it } from "vitest";
import { checkAttachment, detectType } from "@/lib/attachments/detect";

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
const PDF = new TextEncoder().encode("%PDF-1.7\n%%EOF\n");
const JPEG = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 16]);
const CSV = new TextEncoder().encode("Date,Tag,Total\n2026-03-01,feed,1\n");
const ZIP = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0]);

describe("attachment types are read from the content", () => {
  it("recognises the four accepted types by their first bytes", () => {
    expect(detectType(PDF).type).toBe("application/pdf");
    expect(detectType(PNG).type).toBe("image/png");
    expect(detectType(JPEG).type).toBe("image/jpeg");
    expect(detectType(CSV).type).toBe("text/csv");
    expect(detectType(new Uint8Array([0x41, 0, 0x42])).type).toBeNull();
  });
  it("refuses a name that does not match, saying what the file really is", () => {
    expect(checkAttachment("certificate.pdf", "application/pdf", PNG)).toEqual({
      ok: false,
      reason: '"certificate.pdf" is really a PNG image, not a PDF document; rename it to .png if that is what you meant to attach.',
    });
    expect(checkAttachment("invoice.xlsx", "", ZIP)).toEqual({ ok: false, reason: expect.stringMatching(/^"invoice.xlsx" is a ZIP archive .*only PDF document, PNG image, JPEG image, CSV text file can be attached/) });
  });
  it("refuses a claimed type that contradicts the content, but tolerates the usual CSV labels", () => {
    expect(checkAttachment("scan.png", "image/jpeg", PNG)).toEqual({ ok: false, reason: '"scan.png" was sent as image/jpeg but its content is a PNG image.' });
    expect(checkAttachment("totals.csv", "application/vnd.ms-excel", CSV)).toEqual({ ok: true, type: "text/csv" });
    expect(checkAttachment("photo.JPEG", "", JPEG)).toEqual({ ok: true, type: "image/jpeg" });
  });
});
