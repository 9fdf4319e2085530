import "server-only";
import type { Db } from "@/db/client";
import { recordAudit } from "@/db/queries/audit";
import { saveFlagNote } from "@/db/queries/flag-notes";
import { lockMonth } from "@/db/queries/months";
import { findSite } from "@/db/queries/sites";
import { HttpError, notFound } from "@/lib/auth/errors";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { LIMITS } from "@/lib/balance/limits";
import { MIN_REASON_CHARS } from "@/lib/lifecycle/transitions";
import { isFrozenState, runOfBundle } from "./month-runs";
import { loadMonthBundle } from "@/db/queries/months";

export interface FlagExplainer {
  organisationId: string;
  userId: string;
  name: string;
  roles: Role[];
}

/**
 * Writes the explanation of one flag of the month's current revision. Only a flag the engine
 * raises for the stored figures now can be explained; the month must be Open or Balanced (from
 * In review on the explanations are frozen with the revision, by trigger too).
 */
export async function explainFlag(db: Db, who: FlagExplainer, siteId: string, period: string, input: { code: string; stream: string; text: string }) {
  const text = input.text.trim();
  if (text.length < MIN_REASON_CHARS) throw new HttpError(400, "invalid_input", `Write at least ${MIN_REASON_CHARS} characters.`, [{ path: "text", message: `at least ${MIN_REASON_CHARS} characters` }]);
  if (text.length > LIMITS.noteChars) throw new HttpError(400, "invalid_input", `Keep it under ${LIMITS.noteChars} characters.`, [{ path: "text", message: `at most ${LIMITS.noteChars} characters` }]);
  const bundle = await loadMonthBundle(db, who.organisationId, siteId, period);
  if (!bundle) throw notFound("The site");
  if (!bundle.month) throw notFound(`The month ${period}`);
  const run = await runOfBundle(db, bundle, period);
  const raised = run.ok && run.doc.flags.some((f) => f.code === input.code && (f.stream ?? "") === input.stream);
  if (!raised) throw new HttpError(404, "not_found", "That flag is not raised for this month's figures (any more); reload the page.");
  const role = who.roles.includes("environmental_officer") ? "environmental_officer" : "process_engineer";
  return db.transaction(async (tx) => {
    const site = await findSite(tx, who.organisationId, siteId);
    if (!site) throw notFound("The site");
    const month = await lockMonth(tx, site, period);
    if (isFrozenState(month.state)) throw new HttpError(409, "month_read_only", `${period} is ${month.state.replace("_", " ")}: its explanations are frozen with the revision.`);
    const before = await saveFlagNote(tx, {
      monthId: month.id,
      revision: month.revision,
      code: input.code,
      stream: input.stream,
      text,
      writtenBy: who.userId,
      writtenByName: who.name,
      writtenRole: ROLE_LABELS[role],
    });
    await recordAudit(tx, {
      organisationId: who.organisationId,
      siteId: site.id,
      actorUserId: who.userId,
      actorLabel: who.name,
      channel: "form",
      action: "flag.explained",
      entity: "month",
      entityId: month.id,
      before: before === null ? null : { flag: input.code, stream: input.stream || undefined, explanation: before },
      after: { flag: input.code, stream: input.stream || undefined, explanation: text, revision: month.revision },
    });
    return { text };
  });
}
