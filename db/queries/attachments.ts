import "server-only";
import { and, desc, eq } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { attachments, months, streams, users } from "../schema";
import { UUID } from "./uuid";

/** Everything but the content, so lists never pull file bytes out of the database. */
const meta = {
  id: attachments.id,
  organisationId: attachments.organisationId,
  siteId: attachments.siteId,
  monthId: attachments.monthId,
  period: months.period,
  monthState: months.state,
  streamKey: streams.key,
  category: attachments.category,
  fileName: attachments.fileName,
  mediaType: attachments.mediaType,
  sizeBytes: attachments.sizeBytes,
  sha256: attachments.sha256,
  uploadedBy: attachments.uploadedBy,
  uploadedByName: users.name,
  createdAt: attachments.createdAt,
};

export async function listMonthAttachments(db: Db | Tx, organisationId: string, monthId: string) {
  return db
    .select(meta)
    .from(attachments)
    .leftJoin(months, eq(months.id, attachments.monthId))
    .leftJoin(streams, eq(streams.id, attachments.streamId))
    .leftJoin(users, eq(users.id, attachments.uploadedBy))
    .where(and(eq(attachments.organisationId, organisationId), eq(attachments.monthId, monthId)))
    .orderBy(desc(attachments.createdAt));
}


/** One attachment's metadata, only within the organisation (anything else reads as not found). */
export async function findAttachment(db: Db | Tx, organisationId: string, id: string) {
  if (!UUID.test(id)) return null;
  const [row] = await db
    .select(meta)
    .from(attachments)
    .leftJoin(months, eq(months.id, attachments.monthId))
    .leftJoin(streams, eq(streams.id, attachments.streamId))
    .leftJoin(users, eq(users.id, attachments.uploadedBy))
    .where(and(eq(attachments.organisationId, organisationId), eq(attachments.id, id)))
    .limit(1);
  return row ?? null;
}
export type AttachmentMeta = NonNullable<Awaited<ReturnType<typeof findAttachment>>>;

export async function attachmentContent(db: Db | Tx, organisationId: string, id: string) {
  if (!UUID.test(id)) return null;
  const [row] = await db
    .select({ fileName: attachments.fileName, mediaType: attachments.mediaType, sha256: attachments.sha256, content: attachments.content })
    .from(attachments)
    .where(and(eq(attachments.organisationId, organisationId), eq(attachments.id, id)))
    .limit(1);
  return row ?? null;
}

export async function insertAttachment(tx: Tx, values: typeof attachments.$inferInsert) {
  const [row] = await tx.insert(attachments).values(values).returning({ id: attachments.id, createdAt: attachments.createdAt });
  return row;
}

export async function removeAttachment(tx: Tx, organisationId: string, id: string) {
  await tx.delete(attachments).where(and(eq(attachments.organisationId, organisationId), eq(attachments.id, id)));
}
