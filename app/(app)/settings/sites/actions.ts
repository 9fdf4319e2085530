"use server";

import { count, eq } from "drizzle-orm";
import { revalidatePath } from "next/cache";
import { getDb } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { followSiteDefaults, insertSite, lockSite, setInstallation, setSiteArchived, siteSnapshot, updateSite } from "@/db/queries/site-admin";
import { insertStream, lockStream, streamSnapshot, updateStream } from "@/db/queries/streams";
import { readings } from "@/db/schema";
import { guardedAction, type ActionResult, type Actor } from "@/lib/auth/guard";
import { EMPTY_INSTALLATION, installationSchema, missingInstallationFields, type InstallationInput } from "@/lib/validations/installation";
import { siteSchema, type SiteInput } from "@/lib/validations/site";
import { streamSchema, type StreamInput } from "@/lib/validations/stream";

const LIST = "/settings/sites";

/**
 * PostgreSQL names the unique index that refused a row; we turn it into a message on the field,
 * so a duplicate found by a concurrent insert reads the same as one found by a check beforehand.
 */
function uniqueViolation(err: unknown): string | null {
  for (let e: unknown = err; e && typeof e === "object"; e = (e as { cause?: unknown }).cause) {
    const pg = e as { code?: string; constraint?: string };
    if (pg.code === "23505") return pg.constraint ?? "";
  }
  return null;
}

const audit = (actor: Actor, siteId: string | null) => ({
  organisationId: actor.organisationId,
  siteId,
  actorUserId: actor.userId,
  actorLabel: actor.name,
  channel: "form" as const,
});

export async function createSite(raw: SiteInput): Promise<ActionResult<{ id: string }>> {
  const result = await guardedAction("site:manage", "set up sites", async (actor): Promise<ActionResult<{ id: string }>> => {
    const values = siteSchema.parse(raw);
    try {
      const site = await getDb().transaction(async (tx) => {
        const row = await insertSite(tx, actor.organisationId, values);
        await recordAudit(tx, { ...audit(actor, row.id), action: "site.created", entity: "site", entityId: row.id, before: null, after: siteSnapshot(row) });
        return row;
      });
      return { ok: true, message: `${site.name} set up. Add its streams below.`, data: { id: site.id } };
    } catch (err) {
      if (uniqueViolation(err) === "sites_org_code_key") return codeTaken(values.code);
      throw err;
    }
  });
  if (result.ok) revalidatePath(LIST, "layout");
  return result;
}

function codeTaken(code: string): ActionResult<never> {
  return { ok: false, message: "Check the highlighted fields.", errors: { code: `Another site of your organisation already uses the code "${code}".` } };
}

export async function editSite(siteId: string, raw: SiteInput): Promise<ActionResult> {
  const result = await guardedAction("site:manage", "change sites", async (actor): Promise<ActionResult> => {
    const values = siteSchema.parse(raw);
    try {
      return await getDb().transaction(async (tx): Promise<ActionResult> => {
        const before = await lockSite(tx, actor.organisationId, siteId);
        if (!before) return { ok: false, message: "That site was not found; reload the page." };
        const after = await updateSite(tx, before.id, values);
        const [b, a] = [siteSnapshot(before), siteSnapshot(after)];
        if (JSON.stringify(b) === JSON.stringify(a)) return { ok: true, message: "Nothing changed." };
        const followed = await followSiteDefaults(tx, before.id, before, after);
        await recordAudit(tx, { ...audit(actor, before.id), action: "site.changed", entity: "site", entityId: before.id, before: b, after: { ...a, monthsFollowing: followed } });
        const reach = followed.length ? ` The new method defaults now apply to ${followed.length} ${followed.length === 1 ? "month" : "months"} not yet sent for review (${followed.join(", ")}).` : "";
        return { ok: true, message: `${after.name} saved.${reach} Months in review, signed or submitted keep what they were frozen with.` };
      });
    } catch (err) {
      if (uniqueViolation(err) === "sites_org_code_key") return codeTaken(values.code);
      throw err;
    }
  });
  if (result.ok) revalidatePath(LIST, "layout");
  return result;
}

/**
 * The installation identity of a site. Saved as far as it is known (only what is typed is
 * checked); months go for sign-off once it is complete. Months already frozen keep the identity
 * they were frozen with.
 */
export async function saveInstallation(siteId: string, raw: InstallationInput): Promise<ActionResult> {
  const result = await guardedAction("site:manage", "change sites", async (actor) => {
    const values = installationSchema.parse(raw);
    return getDb().transaction(async (tx): Promise<ActionResult> => {
      const before = await lockSite(tx, actor.organisationId, siteId);
      if (!before) return { ok: false, message: "That site was not found; reload the page." };
      const old = before.installation ?? EMPTY_INSTALLATION;
      if (JSON.stringify(old) === JSON.stringify(values)) return { ok: true, message: "Nothing changed." };
      await setInstallation(tx, before.id, values);
      await recordAudit(tx, { ...audit(actor, before.id), action: "site.installation-changed", entity: "site", entityId: before.id, before: before.installation, after: values });
      const missing = missingInstallationFields(values);
      return {
        ok: true,
        message: missing.length
          ? `Installation identity saved. Still needed before sign-off: ${missing.map((m) => m.label).join("; ")}.`
          : "Installation identity saved and complete. Months already sent for sign-off keep the identity they were frozen with.",
      };
    });
  });
  if (result.ok) revalidatePath(LIST, "layout");
  return result;
}

/** Archiving hides a site from pickers and new work; its months and statements stay readable. */
export async function archiveSite(siteId: string, archived: boolean): Promise<ActionResult> {
  const result = await guardedAction("site:manage", "archive sites", async (actor) =>
    getDb().transaction(async (tx): Promise<ActionResult> => {
      const before = await lockSite(tx, actor.organisationId, siteId);
      if (!before) return { ok: false, message: "That site was not found; reload the page." };
      if ((before.archivedAt !== null) === archived) return { ok: true, message: "Nothing changed." };
      const after = await setSiteArchived(tx, before.id, archived);
      await recordAudit(tx, { ...audit(actor, before.id), action: archived ? "site.archived" : "site.restored", entity: "site", entityId: before.id, before: siteSnapshot(before), after: siteSnapshot(after) });
      return { ok: true, message: archived ? `${before.name} archived.` : `${before.name} restored.` };
    }),
  );
  if (result.ok) revalidatePath(LIST, "layout");
  return result;
}

function keyTaken(key: string): ActionResult<never> {
  return { ok: false, message: "Check the highlighted fields.", errors: { key: `This site already has a stream with the key "${key}" (archived streams keep their key).` } };
}

export async function createStream(siteId: string, raw: StreamInput): Promise<ActionResult<{ id: string }>> {
  const result = await guardedAction("site:manage", "set up streams", async (actor): Promise<ActionResult<{ id: string }>> => {
    const values = streamSchema.parse(raw);
    try {
      return await getDb().transaction(async (tx): Promise<ActionResult<{ id: string }>> => {
        const site = await lockSite(tx, actor.organisationId, siteId);
        if (!site) return { ok: false, message: "That site was not found; reload the page." };
        const row = await insertStream(tx, site.id, values);
        await recordAudit(tx, { ...audit(actor, site.id), action: "stream.created", entity: "stream", entityId: row.id, before: null, after: streamSnapshot(row) });
        return { ok: true, message: `Stream ${row.key} added to ${site.name}.`, data: { id: row.id } };
      });
    } catch (err) {
      if (uniqueViolation(err) === "streams_site_key_key") return keyTaken(values.key);
      throw err;
    }
  });
  if (result.ok) revalidatePath(LIST, "layout");
  return result;
}

export async function editStream(siteId: string, streamId: string, raw: StreamInput): Promise<ActionResult> {
  const result = await guardedAction("site:manage", "change streams", async (actor): Promise<ActionResult> => {
    const values = streamSchema.parse(raw);
    try {
      return await getDb().transaction(async (tx): Promise<ActionResult> => {
        const before = await lockStream(tx, actor.organisationId, siteId, streamId);
        if (!before) return { ok: false, message: "That stream was not found; reload the page." };
        if (values.kind !== before.kind) {
          // Old months keep their readings in the old kind's units: changing the kind would rewrite history.
          const [{ n }] = await tx.select({ n: count() }).from(readings).where(eq(readings.streamId, before.id));
          if (n > 0) return { ok: false, message: "Check the highlighted fields.", errors: { kind: `This stream has readings in ${n} month${n === 1 ? "" : "s"}, so its kind stays ${before.kind}. Archive it and add a new stream instead.` } };
        }
        const after = await updateStream(tx, before.id, values);
        const [b, a] = [streamSnapshot(before), streamSnapshot(after)];
        if (JSON.stringify(b) === JSON.stringify(a)) return { ok: true, message: "Nothing changed." };
        await recordAudit(tx, { ...audit(actor, before.siteId), action: "stream.changed", entity: "stream", entityId: before.id, before: b, after: a });
        return { ok: true, message: `Stream ${after.key} saved.` };
      });
    } catch (err) {
      if (uniqueViolation(err) === "streams_site_key_key") return keyTaken(values.key);
      throw err;
    }
  });
  if (result.ok) revalidatePath(LIST, "layout");
  return result;
}

/** Archive, never delete: old months keep showing the stream and its readings. */
export async function archiveStream(siteId: string, streamId: string, archived: boolean): Promise<ActionResult> {
  const result = await guardedAction("site:manage", "archive streams", async (actor) =>
    getDb().transaction(async (tx): Promise<ActionResult> => {
      const before = await lockStream(tx, actor.organisationId, siteId, streamId);
      if (!before) return { ok: false, message: "That stream was not found; reload the page." };
      if ((before.archivedAt !== null) === archived) return { ok: true, message: "Nothing changed." };
      const after = await updateStream(tx, before.id, { archivedAt: archived ? new Date() : null });
      await recordAudit(tx, { ...audit(actor, before.siteId), action: archived ? "stream.archived" : "stream.restored", entity: "stream", entityId: before.id, before: streamSnapshot(before), after: streamSnapshot(after) });
      return { ok: true, message: archived ? `Stream ${before.key} archived; months that used it still show it.` : `Stream ${before.key} restored.` };
    }),
  );
  if (result.ok) revalidatePath(LIST, "layout");
  return result;
}
