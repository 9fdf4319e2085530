"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db";
import { activeLabelTaken, createApiToken, lockApiToken, revokeApiToken } from "@/db/queries/api-tokens";
import { recordAudit } from "@/db/queries/audit";
import { findSite } from "@/db/queries/sites";
import { newApiToken } from "@/lib/api/tokens";
import { guardedAction, type ActionResult } from "@/lib/auth/guard";
import { createApiTokenSchema, revokeApiTokenSchema } from "@/lib/validations/api-token";
import { formFields } from "@/lib/validations/members";

const PAGE = "/settings/api-tokens";

export interface CreatedToken {
  token: string;
  label: string;
  siteId: string;
  siteName: string;
}

/**
 * Makes a token for one site. The secret goes back in the result only, once; the database and
 * the audit event keep its hash and first characters, so nothing stored can be replayed.
 */
export async function createSiteApiToken(_prev: ActionResult<CreatedToken> | null, formData: FormData): Promise<ActionResult<CreatedToken>> {
  const result = await guardedAction("site:manage", "manage API tokens", async (actor) => {
    const input = createApiTokenSchema.parse(formFields(formData));
    return getDb().transaction(async (tx): Promise<ActionResult<CreatedToken>> => {
      const site = await findSite(tx, actor.organisationId, input.siteId);
      if (!site || site.archivedAt) return { ok: false, message: "Check the highlighted fields.", errors: { siteId: "That site is not one of your organisation's active sites; reload the page." } };
      // The label is what the audit trail names as author, so two live tokens of a site must not share one.
      if (await activeLabelTaken(tx, site.id, input.label)) {
        return { ok: false, message: "Check the highlighted fields.", errors: { label: `An active token of ${site.name} is already labelled "${input.label}"; choose another label, or revoke that token first.` } };
      }
      const { token, tokenHash, prefix } = newApiToken();
      const row = await createApiToken(tx, { organisationId: actor.organisationId, siteId: site.id, label: input.label, prefix, tokenHash, createdBy: actor.userId });
      await recordAudit(tx, {
        organisationId: actor.organisationId,
        siteId: site.id,
        actorUserId: actor.userId,
        actorLabel: actor.name,
        channel: "form",
        action: "api-token.created",
        entity: "api_token",
        entityId: row.id,
        after: { label: input.label, prefix, site: site.name, scope: "readings:write" },
      });
      return { ok: true, message: `Token "${input.label}" created for ${site.name}.`, data: { token, label: input.label, siteId: site.id, siteName: site.name } };
    });
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}

/** Revokes a token at once: its next request is refused with 401. */
export async function revokeSiteApiToken(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction("site:manage", "manage API tokens", async (actor) => {
    const input = revokeApiTokenSchema.parse(formFields(formData));
    return getDb().transaction(async (tx): Promise<ActionResult> => {
      const token = await lockApiToken(tx, actor.organisationId, input.tokenId);
      if (!token) return { ok: false, message: "That token was not found; reload the page." };
      if (token.revokedAt) return { ok: false, message: `Token "${token.label}" is already revoked.` };
      await revokeApiToken(tx, token.id);
      await recordAudit(tx, {
        organisationId: actor.organisationId,
        siteId: token.siteId,
        actorUserId: actor.userId,
        actorLabel: actor.name,
        channel: "form",
        action: "api-token.revoked",
        entity: "api_token",
        entityId: token.id,
        before: { label: token.label, prefix: token.prefix, status: "active" },
        after: { label: token.label, prefix: token.prefix, status: "revoked" },
      });
      return { ok: true, message: `Token "${token.label}" revoked; plant systems using it are now refused.` };
    });
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}
