import { getDb } from "@/db";
import { statementPdf } from "@/db/queries/statements";
import { notFound } from "@/lib/auth/errors";
import { personOf, v1Route } from "@/lib/api/route";
import { UUID } from "@/db/queries/uuid";

/**
 * The stored bytes of a signed statement, exactly as signed, for any member of its organisation
 * (auditors included). Another organisation's statement answers 404 like a missing one.
 */
export const GET = v1Route<{ id: string }>({ permission: "org:read", what: "download statements" }, async (_req, caller, { id }) => {
  const actor = personOf(caller);
  const found = UUID.test(id) ? await statementPdf(getDb(), { organisationId: actor.organisationId }, id) : null;
  if (!found) throw notFound("The statement");
  return new Response(new Uint8Array(found.pdf), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `attachment; filename="${found.fileName.replace(/[^A-Za-z0-9._-]/g, "_")}"`,
      "Content-Length": String(found.pdf.length),
      // The hash lets a script check the download without parsing the PDF.
      "X-Content-SHA256": found.sha256,
      "Cache-Control": "private, no-store",
    },
  });
});
