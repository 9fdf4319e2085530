import { getDb } from "@/db";
import { activeCertificateWithKey } from "@/db/queries/statements";
import { v1Route } from "@/lib/api/route";
import { requireStartedMonth } from "@/lib/api/site-month";
import { HttpError } from "@/lib/auth/errors";
import { monthEvents } from "@/lib/lifecycle/history";
import { previewMonthlyStatement } from "@/lib/lifecycle/sign";

type Params = { siteId: string; month: string };

/**
 * GET /api/v1/sites/{siteId}/months/{month}/statement-preview: the unsigned PDF of a month In
 * review exactly as it would be signed now, from the same frozen record and statement model;
 * only the reference (given at signing) and the seal are missing. Any member may read it; the
 * signer printed is the caller when they hold the signatory role.
 */
export const GET = v1Route<Params>({ permission: "org:read", what: "preview statements" }, async (_req, caller, { siteId, month }) => {
  if (caller.kind !== "session") throw new HttpError(403, "token_scope", "Sign in as a person to preview a statement.");
  const b = await requireStartedMonth(caller, siteId, month);
  if (b.month.state !== "in_review") {
    throw new HttpError(409, "wrong_state", `${month} at ${b.site.name} is not In review: only a month sent for sign-off has a statement to preview.`);
  }
  const db = getDb();
  const actor = caller.actor;
  const [events, cert] = await Promise.all([monthEvents(db, actor.organisationId, b.month.id), activeCertificateWithKey(db, actor.organisationId)]);
  const signer = actor.roles.includes("signatory") ? actor : { ...actor, name: "the signatory, at signing" };
  const pdf = await previewMonthlyStatement(db, signer, b.site, b.month, events, cert);
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `inline; filename="${b.site.code}-${month}-rev${b.month.revision}-preview.pdf"`,
      "cache-control": "no-store",
    },
  });
});
