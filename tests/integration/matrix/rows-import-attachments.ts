import { attachments } from "@/db/schema";
import { type MatrixContext, type MatrixRow, matrixRequest } from "./types";

/** Rows of the CSV import and attachment routes (their own file, beside the other teams'). */
const csv = "Date,Tag,Total\n01/03/2026,feed,1\n";
const mapping = { name: "Matrix", layout: "long", dateColumn: "Date", dateFormat: "DD/MM/YYYY", streamColumn: "Tag", quantityColumn: "Total" };
const PDF = "%PDF-1.4\n%%EOF\n";

function upload(fields: Record<string, string>, file: { text: string; name: string; type: string }): Request {
  const fd = new FormData();
  fd.set("file", new File([file.text], file.name, { type: file.type }));
  for (const [k, v] of Object.entries(fields)) fd.set(k, v);
  return matrixRequest("http://matrix/", { method: "POST", body: fd });
}

/** An attachment nobody in particular uploaded, so only an administrator may delete it. */
async function storedAttachment({ db, target }: MatrixContext): Promise<string> {
  const [row] = await db
    .insert(attachments)
    .values({ organisationId: target.id, siteId: target.siteId, category: "invoice", fileName: "i.pdf", mediaType: "application/pdf", sizeBytes: PDF.length, sha256: "0".repeat(64), content: Buffer.from(PDF) })
    .returning({ id: attachments.id });
  return row.id;
}

const ALL = ["administrator", "process_engineer", "environmental_officer", "signatory", "auditor"] as const;

export const importAttachmentRows: MatrixRow[] = [
  {
    id: "GET /api/v1/sites/[siteId]/imports",
    allowed: ALL,
    async call({ target }) {
      const { GET } = await import("@/app/api/v1/sites/[siteId]/imports/route");
      return GET(matrixRequest("http://matrix/"), { params: Promise.resolve({ siteId: target.siteId }) });
    },
  },
  {
    id: "POST /api/v1/sites/[siteId]/imports/preview",
    allowed: ["process_engineer"],
    async call({ target }) {
      const { POST } = await import("@/app/api/v1/sites/[siteId]/imports/preview/route");
      return POST(upload({ mapping: JSON.stringify(mapping) }, { text: csv, name: "m.csv", type: "text/csv" }), { params: Promise.resolve({ siteId: target.siteId }) });
    },
  },
  {
    // The fixture site has no streams, so an allowed call ends in 400 (unknown stream): past the gate.
    id: "POST /api/v1/sites/[siteId]/imports/commit",
    allowed: ["process_engineer"],
    async call({ target }) {
      const { POST } = await import("@/app/api/v1/sites/[siteId]/imports/commit/route");
      return POST(upload({ mapping: JSON.stringify(mapping) }, { text: csv, name: "m.csv", type: "text/csv" }), { params: Promise.resolve({ siteId: target.siteId }) });
    },
  },
  {
    id: "GET /api/v1/sites/[siteId]/months/[month]/attachments",
    allowed: ALL,
    async call({ target }) {
      const { GET } = await import("@/app/api/v1/sites/[siteId]/months/[month]/attachments/route");
      return GET(matrixRequest("http://matrix/"), { params: Promise.resolve({ siteId: target.siteId, month: "2026-03" }) });
    },
  },
  {
    id: "POST /api/v1/sites/[siteId]/months/[month]/attachments",
    allowed: ["administrator", "process_engineer", "environmental_officer"],
    async call({ target }) {
      const { POST } = await import("@/app/api/v1/sites/[siteId]/months/[month]/attachments/route");
      return POST(upload({ category: "invoice" }, { text: PDF, name: "i.pdf", type: "application/pdf" }), { params: Promise.resolve({ siteId: target.siteId, month: "2026-03" }) });
    },
  },
  {
    id: "GET /api/v1/attachments/[attachmentId]",
    allowed: ALL,
    async call(ctx) {
      const { GET } = await import("@/app/api/v1/attachments/[attachmentId]/route");
      return GET(matrixRequest("http://matrix/"), { params: Promise.resolve({ attachmentId: await storedAttachment(ctx) }) });
    },
  },
  {
    id: "DELETE /api/v1/attachments/[attachmentId]",
    allowed: ["administrator"],
    async call(ctx) {
      const { DELETE } = await import("@/app/api/v1/attachments/[attachmentId]/route");
      return DELETE(matrixRequest("http://matrix/", { method: "DELETE" }), { params: Promise.resolve({ attachmentId: await storedAttachment(ctx) }) });
    },
  },
];
