import { getDb } from "@/db";
import { statementPdf } from "@/db/queries/statements";
import { notFound } from "@/lib/auth/errors";
import { v1Route } from "@/lib/api/route";
import { COMMUNICATION_FILE } from "@/lib/lifecycle/sign-cbam";
import { readEmbeddedFiles } from "@/lib/signing/embed";
import { UUID } from "@/db/queries/uuid";


/**
 * GET /api/v1/statements/{id}/document: the machine-readable communication of embedded emissions
 * (synledger.cbam-communication/1) a signed communication carries inside its PDF, byte for byte as
 * signed. Statements that carry none (monthly and annual ones) and other organisations' answer 404.
 */
export const GET = v1Route<{ id: string }>({ permission: "org:read", what: "download statements" }, async (_req, caller, { id }) => {
  const found = UUID.test(id) ? await statementPdf(getDb(), { organisationId: caller.organisationId }, id) : null;
  if (!found) throw notFound("The statement");
  // A stored statement is always a PDF; one that cannot be read carries no document either.
  const files = await readEmbeddedFiles(found.pdf).catch(() => []);
  const file = files.find((f) => f.name === COMMUNICATION_FILE);
  if (!file) throw notFound("A communication document in this statement");
  return new Response(new Uint8Array(file.bytes), {
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      "Content-Disposition": `attachment; filename="${found.fileName.replace(/\.pdf$/, ".json").replace(/[^A-Za-z0-9._-]/g, "_")}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
