import "server-only";
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { findAttachment, insertAttachment, listMonthAttachments, removeAttachment, type AttachmentMeta } from "@/db/queries/attachments";
import { recordAudit } from "@/db/queries/audit";
import { lockMonth } from "@/db/queries/months";
import { findMonth, findSite } from "@/db/queries/sites";
import { archivedSiteRefusal } from "@/lib/ledger/save-month";
import { months, streams } from "@/db/schema";
import { HttpError, forbidden, notFound } from "@/lib/auth/errors";
import { can, type Actor } from "@/lib/auth/guard";
import { ATTACHMENT_CATEGORIES, type AttachmentCategory } from "./categories";
import { checkAttachment } from "./detect";

/** A signed (or submitted) month's evidence is what the signatory signed over: it stays as it was. */
const FROZEN = ["signed", "submitted"];
const STATE_WORDS: Record<string, string> = { signed: "signed", submitted: "submitted" };

/** Whoever brings evidence to a month: engineers (lab, calibration), officers (invoices), administrators. */
export function canUploadAttachments(actor: Pick<Actor, "roles">): boolean {
  return can(actor, "month:enter") || can(actor, "month:prepare") || can(actor, "site:manage");
}

export function canDeleteAttachment(actor: Pick<Actor, "roles" | "userId">, a: Pick<AttachmentMeta, "uploadedBy" | "monthState">): boolean {
  const mayDelete = a.uploadedBy === actor.userId || actor.roles.includes("administrator");
  return mayDelete && !FROZEN.includes(a.monthState ?? "");
}

/** Metadata as the API and the list component show it. */
export function publicAttachment(actor: Actor, a: AttachmentMeta) {
  return {
    id: a.id,
    month: a.period,
    stream: a.streamKey,
    category: a.category,
    fileName: a.fileName,
    mediaType: a.mediaType,
    sizeBytes: a.sizeBytes,
    sha256: a.sha256,
    uploadedBy: a.uploadedByName,
    createdAt: a.createdAt,
    canDelete: canDeleteAttachment(actor, a),
    href: `/api/v1/attachments/${a.id}`,
  };
}
export type PublicAttachment = ReturnType<typeof publicAttachment>;

export async function listForMonth(db: Db, actor: Actor, siteId: string, period: string) {
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) throw notFound("The site");
  const month = await findMonth(db, site.id, period);
  if (!month) return [];
  return (await listMonthAttachments(db, actor.organisationId, month.id)).map((a) => publicAttachment(actor, a));
}

export interface UploadInput {
  name: string;
  type: string;
  bytes: Buffer;
  category: string;
  stream?: string;
}

export async function uploadAttachment(db: Db, actor: Actor, siteId: string, period: string, input: UploadInput) {
  if (!canUploadAttachments(actor)) throw forbidden("attach files to a month");
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) throw notFound("The site");
  if (site.archivedAt) throw archivedSiteRefusal(site.name);
  if (!(ATTACHMENT_CATEGORIES as readonly string[]).includes(input.category)) {
    throw new HttpError(400, "invalid_input", "Choose what the file is.", [{ path: "category", message: `must be one of ${ATTACHMENT_CATEGORIES.join(", ")}` }]);
  }
  const verdict = checkAttachment(input.name, input.type, input.bytes);
  if (!verdict.ok) throw new HttpError(415, "type_mismatch", verdict.reason, [{ path: "file", message: verdict.reason }]);
  const fileName = input.name.replace(/[\u0000-\u001f\u007f/\\]/g, "_").slice(0, 200);
  const sha256 = createHash("sha256").update(input.bytes).digest("hex");
  return db.transaction(async (tx) => {
    const month = await lockMonth(tx, site, period);
    if (FROZEN.includes(month.state)) throw new HttpError(409, "month_read_only", `${period} is ${STATE_WORDS[month.state]}: its evidence can no longer change.`);
    let streamId: string | null = null;
    if (input.stream) {
      const [s] = await tx.select({ id: streams.id }).from(streams).where(and(eq(streams.siteId, site.id), eq(streams.key, input.stream)));
      if (!s) throw new HttpError(400, "invalid_input", `No stream "${input.stream}" at ${site.name}.`, [{ path: "stream", message: "unknown stream" }]);
      streamId = s.id;
    }
    const row = await insertAttachment(tx, {
      organisationId: actor.organisationId,
      siteId: site.id,
      monthId: month.id,
      streamId,
      category: input.category,
      fileName,
      mediaType: verdict.type,
      sizeBytes: input.bytes.length,
      sha256,
      content: input.bytes,
      uploadedBy: actor.userId,
    });
    await recordAudit(tx, {
      organisationId: actor.organisationId, siteId: site.id, actorUserId: actor.userId, actorLabel: actor.name, channel: "form",
      action: "attachment.uploaded", entity: "attachment", entityId: row.id,
      after: { month: period, stream: input.stream ?? null, category: input.category as AttachmentCategory, fileName, mediaType: verdict.type, sizeBytes: input.bytes.length, sha256 },
    });
    const meta = await findAttachment(tx, actor.organisationId, row.id);
    return publicAttachment(actor, meta!);
  });
}

export async function deleteAttachment(db: Db, actor: Actor, id: string) {
  await db.transaction(async (tx) => {
    const a = await findAttachment(tx, actor.organisationId, id);
    if (!a) throw notFound("The attachment");
    // Lock the month so a signature cannot land between the check and the delete.
    if (a.monthId) await tx.select({ id: months.id }).from(months).where(eq(months.id, a.monthId)).for("update");
    const fresh = (await findAttachment(tx, actor.organisationId, id))!;
    if (fresh.uploadedBy !== actor.userId && !actor.roles.includes("administrator")) throw forbidden("delete a file someone else attached");
    if (FROZEN.includes(fresh.monthState ?? "")) throw new HttpError(409, "month_read_only", `${fresh.period} is ${STATE_WORDS[fresh.monthState!]}: its evidence can no longer change.`);
    await removeAttachment(tx, actor.organisationId, id);
    await recordAudit(tx, {
      organisationId: actor.organisationId, siteId: a.siteId, actorUserId: actor.userId, actorLabel: actor.name, channel: "form",
      action: "attachment.deleted", entity: "attachment", entityId: id,
      before: { month: a.period, stream: a.streamKey, category: a.category, fileName: a.fileName, mediaType: a.mediaType, sizeBytes: a.sizeBytes, sha256: a.sha256 },
    });
  });
}
