import "server-only";
import type { Db } from "@/db/client";
import { lastMonthlySigning, loadSiteYear, lockMonthsOfYear } from "@/db/queries/overview";
import { latestRevision, listStatements } from "@/db/queries/statements";
import { HttpError, notFound } from "@/lib/auth/errors";
import type { Actor } from "@/lib/auth/guard";
import { annualReadiness, rollUpRuns, yearBenchmarks, yearTheoreticalMinimum } from "@/lib/ledger/year";
import { issueStatement, NoSigningCertificate, signOffFacts } from "@/lib/signing/issue";
import { renderAnnualStatement } from "@/reports/render";
import { annualSummary, buildAnnualModel } from "./annual-model";

/**
 * Signs the annual statement of a site's year, sealed and stored like the monthly ones. Allowed
 * once every month of the year that exists is Signed or Submitted; a second revision only after
 * a month has been re-signed since the last annual statement (otherwise it would say nothing new).
 * The year's months are locked for the duration, so none can be reopened half-way.
 */
export async function signAnnual(db: Db, actor: Actor, siteId: string, year: string) {
  return db.transaction(async (tx) => {
    const loaded = await loadSiteYear(tx, actor.organisationId, siteId, year);
    if (!loaded) throw notFound("The site");
    await lockMonthsOfYear(tx, loaded.site.id, year);
    const y = (await loadSiteYear(tx, actor.organisationId, siteId, year))!;
    const ready = annualReadiness(y.runs);
    if (!ready.ready) {
      throw new HttpError(
        409,
        "months_not_signed",
        y.runs.length === 0
          ? `${y.site.name} has no months in ${year}; there is nothing to state.`
          : `Every month of ${year} must be Signed or Submitted first; still waiting: ${ready.waiting.join(", ")}.`,
      );
    }
    const rollUp = rollUpRuns(y.runs);
    if (!rollUp) throw new HttpError(422, "precondition_failed", "No month of the year computes from its stored figures.");
    const earlier = await listStatements(tx as unknown as Db, { organisationId: actor.organisationId }, { siteId: y.site.id, kind: "annual", period: year });
    const previous = await latestRevision(tx, y.site.id, "annual", year);
    const lastMonthly = await lastMonthlySigning(tx, y.site.id, year);
    const latest = earlier.find((s) => s.revision === previous);
    if (latest && !(lastMonthly && lastMonthly > latest.signedAt)) {
      throw new HttpError(409, "already_signed", `The annual statement of ${year} is signed (revision ${previous}) and no month has been re-signed since.`);
    }
    const revision = previous + 1;
    const revisions = [...earlier]
      .sort((a, b) => a.revision - b.revision)
      .map((s) => ({ revision: s.revision, signedAt: s.signedAt, signer: s.signerName, reason: s.revision === 1 ? "First issue" : "A month was re-signed" }));
    try {
      return await issueStatement(tx, {
        organisationId: actor.organisationId,
        siteId: y.site.id,
        kind: "annual",
        period: year,
        monthId: null,
        revision,
        signer: { userId: actor.userId, name: actor.name, role: "Signatory" },
        location: y.site.name,
        contactInfo: actor.email,
        summary: annualSummary(rollUp),
        render: (ctx) =>
          renderAnnualStatement(
            buildAnnualModel({
              organisation: actor.organisationName,
              site: y.site,
              year,
              revision,
              statementRef: ctx.statementId,
              runs: y.runs,
              rollUp,
              benchmarks: yearBenchmarks(y.runs, rollUp),
              theoreticalMin: yearTheoreticalMinimum(y.runs),
              preparedBy: "from the signed monthly statements of the year",
              preparedAt: lastMonthly,
              revisions: [...revisions, { revision, signedAt: ctx.signedAt, signer: actor.name, reason: revision === 1 ? "First issue" : "A month was re-signed" }],
              signOff: signOffFacts(actor.name, ctx),
            }),
          ),
      });
    } catch (err) {
      if (err instanceof NoSigningCertificate) throw new HttpError(422, "no_certificate", err.message);
      throw err;
    }
  });
}
