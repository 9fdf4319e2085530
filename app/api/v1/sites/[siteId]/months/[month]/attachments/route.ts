import { getDb } from "@/db";
import { findSite } from "@/db/queries/sites";
import { forbidden, notFound } from "@/lib/auth/errors";
import { personOf, v1Route } from "@/lib/api/route";
import { MAX_ATTACHMENT_BYTES } from "@/lib/attachments/categories";
import { canUploadAttachments, listForMonth, uploadAttachment } from "@/lib/attachments/service";
import { formFile, readLimitedForm } from "@/lib/import/read-multipart";
import { PERIOD } from "@/lib/validations/month";

type Params = { siteId: string; month: string };

/** GET → the month's attachments (metadata, with a download link and whether you may delete each). */
export const GET = v1Route<Params>({ permission: "org:read", what: "see attachments" }, async (_req, caller, { siteId, month }) => {
  const actor = personOf(caller);
  if (!PERIOD.test(month)) throw notFound("The month");
  return Response.json({ attachments: await listForMonth(getDb(), actor, siteId, month) });
});

/** POST multipart: `file`, `category` (lab-certificate, calibration-certificate, invoice, other), optional `stream` key. */
export const POST = v1Route<Params>({ permission: "org:read", what: "attach files" }, async (req, caller, { siteId, month }) => {
  const actor = personOf(caller);
  if (!canUploadAttachments(actor)) throw forbidden("attach files to a month");
  if (!PERIOD.test(month)) throw notFound("The month");
  // The site is checked before the body is read, so another organisation's id costs nothing.
  if (!(await findSite(getDb(), actor.organisationId, siteId))) throw notFound("The site");
  const form = await readLimitedForm(req, MAX_ATTACHMENT_BYTES);
  const file = await formFile(form, MAX_ATTACHMENT_BYTES);
  const stream = String(form.get("stream") ?? "").trim();
  const attachment = await uploadAttachment(getDb(), actor, siteId, month, {
    ...file,
    category: String(form.get("category") ?? ""),
    ...(stream ? { stream } : {}),
  });
  return Response.json({ attachment }, { status: 201 });
});
