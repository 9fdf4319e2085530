import "server-only";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { recordAudit, type Channel } from "@/db/queries/audit";
import { lockMonth } from "@/db/queries/months";
import { findSite } from "@/db/queries/sites";
import { months } from "@/db/schema";
import { HttpError, notFound } from "@/lib/auth/errors";
import { monthTiming } from "@/lib/period";
import { monthMethodSchema, type MonthMethodInput } from "@/lib/validations/month-method";
import { isFrozenState } from "./month-runs";
import { archivedSiteRefusal } from "./save-month";

export interface MethodChooser {
  organisationId: string;
  userId: string;
  name: string;
  channel?: Channel;
}

/**
 * Sets a month's emissions method, factor set and GWP set, while the month is Open or Balanced:
 * one transaction, a version check against what the chooser saw, an audit record. From In
 * review on the choice is frozen with the rest of the revision.
 */
export async function setMonthMethod(db: Db, who: MethodChooser, siteId: string, period: string, raw: MonthMethodInput) {
  const input = monthMethodSchema.parse(raw);
  if (monthTiming(period).kind === "future") {
    throw new HttpError(400, "future_month", `${period} has not begun yet; its method can be chosen from its first day.`, [{ path: "month", message: "is a month in the future" }]);
  }
  return db.transaction(async (tx) => {
    const site = await findSite(tx, who.organisationId, siteId);
    if (!site) throw notFound("The site");
    if (site.archivedAt) throw archivedSiteRefusal(site.name);
    const month = await lockMonth(tx, site, period);
    if (isFrozenState(month.state)) {
      throw new HttpError(409, "month_read_only", `${period} is ${month.state.replace("_", " ")}: its method is frozen with the revision. Return or reopen it to choose again.`);
    }
    if (month.version !== input.expectedVersion) {
      throw new HttpError(409, "version_conflict", `${period} changed after you opened it (version ${month.version}, you started from ${input.expectedVersion}). Reload to see the current choice.`);
    }
    const before = { emissions: month.emissionsMethod, factor_set: month.factorSet, gwp: month.gwp };
    const after = { emissions: input.emissions, factor_set: input.factor_set, gwp: input.gwp };
    if (before.emissions === after.emissions && before.factor_set === after.factor_set && before.gwp === after.gwp) {
      return { version: month.version, method: after, changed: false };
    }
    const version = month.version + 1;
    await tx
      .update(months)
      .set({ emissionsMethod: after.emissions, factorSet: after.factor_set, gwp: after.gwp, version, updatedBy: who.userId, updatedAt: new Date() })
      .where(eq(months.id, month.id));
    await recordAudit(tx, {
      organisationId: who.organisationId,
      siteId: site.id,
      actorUserId: who.userId,
      actorLabel: who.name,
      channel: who.channel ?? "form",
      action: "month.method-changed",
      entity: "month",
      entityId: month.id,
      before: { ...before, version: month.version, period },
      after: { ...after, version, period },
    });
    return { version, method: after, changed: true };
  });
}
