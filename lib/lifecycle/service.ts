import "server-only";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { recordAudit } from "@/db/queries/audit";
import { findSite } from "@/db/queries/sites";
import { months } from "@/db/schema";
import { HttpError, forbidden, notFound, type IssueDetail } from "@/lib/auth/errors";
import { monthLabel, signed } from "@/reports/format";
import { monthEvents } from "./history";
import { flagNotesOf } from "@/db/queries/flag-notes";
import { insertSnapshot } from "@/db/queries/snapshots";
import { runStoredMonth, snapshotOf } from "@/lib/ledger/month-runs";
import { missingInstallationFields } from "@/lib/validations/installation";
import { dayLabel as dayText, monthTiming } from "@/lib/period";
import { actAsLifecycle } from "./db-flag";
import { queueTransitionNotice } from "./notify";
import type { LifecycleActor } from "./actor";
import { signMonth } from "./sign";
import { MIN_REASON_CHARS, RULES, mayPerform, reasonIsLongEnough, rolesText, type TransitionName } from "./transitions";
import { STATE_LABELS, type MonthState } from "@/lib/month-states";


export interface TransitionInput {
  siteId: string;
  period: string;
  transition: TransitionName;
  /** The month version the actor saw; a newer one means someone acted first. */
  expectedVersion: number;
  reason?: string | null;
  /** record-submission: the authority's reference and the date it was submitted (YYYY-MM-DD). */
  reference?: string | null;
  submittedOn?: string | null;
  /** sign: the declaration ticked, and the keys of the unconfirmed values acknowledged one by one. */
  declaration?: boolean;
  acknowledged?: readonly string[];
}

export interface TransitionOutcome {
  state: MonthState;
  version: number;
  revision: number;
  statementId?: string;
  notified: number;
}

const DATE = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;

const refuse = (code: string, message: string, issues: IssueDetail[] = []) => new HttpError(409, code, message, issues);
const unmet = (message: string, issues: IssueDetail[]) => new HttpError(422, "precondition_failed", message, issues);

/**
 * Performs one life-cycle transition in one transaction: lock the month row, check version,
 * state, role and preconditions, make the change (signing included), write the audit record and
 * queue the notices. Anything that fails leaves the month exactly as it was.
 */
export async function transitionMonth(db: Db, actor: LifecycleActor, input: TransitionInput): Promise<TransitionOutcome> {
  const rule = RULES[input.transition];
  if (!rule) throw new HttpError(400, "invalid_input", `Unknown transition "${String(input.transition)}".`);
  if (!mayPerform(actor.roles, input.transition)) throw forbidden(`${rule.label.toLowerCase()} (needs ${rolesText(input.transition)})`);
  const reason = input.reason?.trim() || null;

  return db.transaction(async (tx) => {
    // The database lets only this transaction move the month's state (migration frozen_months).
    await actAsLifecycle(tx);
    const site = await findSite(tx, actor.organisationId, input.siteId);
    if (!site) throw notFound("The site");
    const [month] = await tx
      .select()
      .from(months)
      .where(and(eq(months.siteId, site.id), eq(months.period, input.period)))
      .for("update");
    if (!month) throw notFound(`The month ${input.period}`);
    const label = `${site.name}, ${monthLabel(input.period)}`;
    if (month.version !== input.expectedVersion) {
      throw refuse(
        "version_conflict",
        `${label} changed after you opened it (version ${month.version}, you started from ${input.expectedVersion}). Reload to see its current state.`,
      );
    }
    if (!rule.from.includes(month.state)) {
      throw refuse("wrong_state", `${label} is ${STATE_LABELS[month.state]}; "${rule.label}" needs ${rule.from.map((s) => STATE_LABELS[s]).join(" or ")}.`);
    }
    if (rule.reason === "always" && !reasonIsLongEnough(reason)) {
      throw unmet(`Write a reason of at least ${MIN_REASON_CHARS} characters.`, [{ path: "reason", message: `at least ${MIN_REASON_CHARS} characters` }]);
    }

    const timing = monthTiming(input.period);
    if ((input.transition === "balance" || input.transition === "send-for-review") && timing.kind !== "ended") {
      const when = timing.kind === "in-progress" ? `it can be ${input.transition === "balance" ? "balanced" : "sent for sign-off"} from ${dayText(timing.closesOn)}, once its last day (${dayText(timing.lastDay)}) has passed` : `it has not begun (it opens on ${dayText(timing.opensOn)})`;
      throw refuse("month_not_ended", `${label} is ${timing.kind === "in-progress" ? "in progress" : "in the future"}: ${when}.`, [{ path: "month", message: timing.kind === "in-progress" ? `in progress until ${timing.lastDay}` : "has not begun" }]);
    }

    const extra: Record<string, unknown> = {};
    let balanceNote = month.balanceNote;
    let revision = month.revision;
    let statementId: string | undefined;
    let mailExtra: string | null = null;

    if (input.transition === "send-for-review") {
      // Checked before the engine runs: without a method the engine can only say "invalid input".
      const missing: IssueDetail[] = [];
      if (!month.emissionsMethod.trim()) missing.push({ path: "emissions_method", message: "choose the month's emissions method on the review page" });
      if (!month.factorSet.trim()) missing.push({ path: "factor_set", message: "choose the month's factor set on the review page" });
      if (missing.length) throw unmet("The statement needs an emissions method and a factor set.", missing);
      // The statement names the installation on its first page; it cannot go for sign-off without it.
      const identity = missingInstallationFields(site.installation);
      if (identity.length) {
        throw unmet(
          `The statement needs the installation identity of ${site.name}; an administrator completes it in site settings (Installation identity). Missing: ${identity.map((f) => f.label).join("; ")}.`,
          identity.map((f) => ({ path: f.path, message: `missing: ${f.label}` })),
        );
      }
      extra.method = month.emissionsMethod;
      extra.factorSet = month.factorSet;
      extra.gwp = month.gwp;
    }

    if (input.transition === "balance" || input.transition === "send-for-review") {
      const run = await runStoredMonth(tx, actor.organisationId, site.id, input.period);
      if (!run || !run.ok) {
        const issues = run && !run.ok ? run.issues.map((i) => ({ path: i.path, message: i.reason })) : [];
        throw unmet(`${label} does not compute from its stored figures; correct them first.`, issues);
      }
      if (input.transition === "send-for-review") {
        // Freeze: from now on every view of this revision reads this snapshot, never the live rows.
        const notes = (await flagNotesOf(tx, month.id, month.revision)).map((n) => ({ code: n.code, stream: n.stream, text: n.text, by: `${n.writtenByName}, ${n.writtenRole.toLowerCase()}` }));
        const snapshot = await insertSnapshot(tx, snapshotOf(run, actor.userId, notes));
        extra.snapshot = { id: snapshot.id, seq: snapshot.seq, documentSha256: snapshot.documentSha256, resultSha256: snapshot.resultSha256, engineVersion: snapshot.engineVersion };
      }
      if (input.transition === "balance") {
        const outside = run.balances.filter((b) => !b.within);
        if (outside.length && !reasonIsLongEnough(reason)) {
          throw unmet(
            `${outside.map((b) => `The ${b.element} balance closes at ${signed(b.closurePct, 2)} %`).join("; ")}, beyond ±${site.closureTolerancePct} %. Write why (at least ${MIN_REASON_CHARS} characters) to close it anyway.`,
            outside.map((b) => ({ path: `balances.${b.element}`, message: `closes at ${signed(b.closurePct, 2)} %, beyond ±${b.tolerancePct} %` })),
          );
        }
        balanceNote = reason ?? null;
        extra.closures = Object.fromEntries(run.balances.map((b) => [b.element, b.closurePct]));
      }
    }

    if (input.transition === "record-submission") {
      const reference = input.reference?.trim() ?? "";
      const on = input.submittedOn?.trim() ?? "";
      const issues: IssueDetail[] = [];
      if (reference.length < 2 || reference.length > 120) issues.push({ path: "reference", message: "the authority's reference, 2 to 120 characters" });
      if (!DATE.test(on) || Number.isNaN(Date.parse(`${on}T00:00:00Z`))) issues.push({ path: "submittedOn", message: "a date as YYYY-MM-DD" });
      else if (on > new Date().toISOString().slice(0, 10)) issues.push({ path: "submittedOn", message: "cannot be in the future" });
      if (issues.length) throw unmet("Enter the authority's reference and the submission date.", issues);
      extra.reference = reference;
      extra.submittedOn = on;
      mailExtra = `Authority reference: ${reference}, submitted on ${on}.`;
    }

    if (input.transition === "sign") {
      const events = await monthEvents(tx, actor.organisationId, month.id);
      const signed = await signMonth(tx, actor, site, month, events, { declaration: input.declaration, acknowledged: input.acknowledged });
      statementId = signed.id;
      extra.statementId = signed.id;
      extra.sha256 = signed.sha256;
      extra.declaration = "made";
      extra.acknowledgedUnconfirmed = signed.acknowledged;
      mailExtra = `Statement SHA-256: ${signed.sha256}`;
    }

    if (input.transition === "reopen") {
      revision = month.revision + 1;
      // The note explained the previous revision's balances; the new revision is judged afresh.
      balanceNote = null;
    }

    const version = month.version + 1;
    const updated = await tx
      .update(months)
      .set({ state: rule.to, version, revision, balanceNote, updatedBy: actor.userId, updatedAt: new Date() })
      .where(and(eq(months.id, month.id), eq(months.version, month.version)))
      .returning({ id: months.id });
    if (updated.length !== 1) throw refuse("version_conflict", `${label} changed while you acted; reload and try again.`);

    await recordAudit(tx, {
      organisationId: actor.organisationId,
      siteId: site.id,
      actorUserId: actor.userId,
      actorLabel: actor.name,
      channel: actor.channel ?? "form",
      action: `month.${input.transition}`,
      entity: "month",
      entityId: month.id,
      before: { state: month.state, version: month.version, revision: month.revision },
      after: { state: rule.to, version, revision, period: input.period, ...extra },
      reason,
    });
    const notified = await queueTransitionNotice(tx, {
      organisationId: actor.organisationId,
      siteId: site.id,
      siteName: site.name,
      period: input.period,
      transition: input.transition,
      actorName: actor.name,
      actorUserId: actor.userId,
      revision,
      reason,
      extra: mailExtra,
    });
    return { state: rule.to, version, revision, statementId, notified };
  });
}

