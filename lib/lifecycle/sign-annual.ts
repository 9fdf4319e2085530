import "server-only";
import type { Db, Tx } from "@/db/client";
import { lastMonthlySigning, lockMonthsOfYear } from "@/db/queries/overview";
import { loadSiteYear, type SiteYear } from "@/lib/ledger/site-year";
import { latestRevision, listStatements } from "@/db/queries/statements";
import { HttpError, notFound } from "@/lib/auth/errors";
import type { Actor } from "@/lib/auth/guard";
import { annualReadiness, rollUpRuns, yearBenchmarks, yearTheoreticalMinimum } from "@/lib/ledger/year";
import { installationSummary } from "@/reports/build-model";
import { issueStatement, NoSigningCertificate, signOffFacts } from "@/lib/signing/issue";
import { renderAnnualStatement } from "@/reports/render";
import { annualSummary, buildAnnualModel } from "@/reports/build-annual-model";

/** Each month's monthly statement (of its current revision) and frozen result digest, by period. */
export async function monthSourcesOf(db: Db | Tx, organisationId: string, y: SiteYear) {
  const monthly = await listStatements(db as Db, { organisationId }, { siteId: y.site.id, kind: "monthly" });
  const out = new Map<string, { statementRef: string; resultSha256: string }>();
  for (const r of y.runs) {
    const statement = monthly.find((s) => s.period === r.period && s.revision === r.revision);
    const frozen = y.frozen.get(r.period);
    if (statement && frozen) out.set(r.period, { statementRef: statement.id, resultSha256: frozen.resultSha256 });
  }
  return out;
}

/**
 * Signs the annual statement of a site's year, sealed and stored like the monthly ones, from the
 * twelve months' sealed snapshots (nothing is computed again). Allowed once all twelve months
 * are Signed or Submitted; a second revision only after a month has been re-signed since the last
 * annual statement (otherwise it would say nothing new). The year's months are locked for the
 * duration, so none can be reopened half-way.
 */
export async function signAnnual(db: Db, actor: Actor, siteId: string, year: string) {
  return db.transaction(async (tx) => {
    const loaded = await loadSiteYear(tx, actor.organisationId, siteId, year);
    if (!loaded) throw notFound("The site");
    await lockMonthsOfYear(tx, loaded.site.id, year);
    const y = (await loadSiteYear(tx, actor.organisationId, siteId, year))!;
    const ready = annualReadiness(year, y.runs);
    if (!ready.ready) {
      throw new HttpError(
        409,
        "months_not_signed",
        y.runs.length === 0
          ? `${y.site.name} has no months in ${year}; there is nothing to state.`
          : `All twelve months of ${year} must be Signed or Submitted first; still waiting: ${ready.waiting.join(", ")}.`,
      );
    }
    const unsealed = y.runs.filter((r) => !r.frozen).map((r) => r.period);
    if (unsealed.length) {
      throw new HttpError(409, "months_not_sealed", `${unsealed.join(", ")} ${unsealed.length === 1 ? "was" : "were"} signed before frozen records were kept; reopen and sign ${unsealed.length === 1 ? "it" : "them"} again so the year adds up sealed figures.`);
    }
    const rollUp = rollUpRuns(y.runs);
    const monthSources = await monthSourcesOf(tx, actor.organisationId, y);
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
        summary: { ...installationSummary(y.frozen.get(`${year}-12`)?.context.site.installation ?? y.site.installation), ...annualSummary(rollUp) },
        render: (ctx) =>
          renderAnnualStatement(
            buildAnnualModel({
              organisation: actor.organisationName,
              // The installation as frozen with the year's last month (December's signed revision).
              site: { ...y.site, installation: y.frozen.get(`${year}-12`)?.context.site.installation ?? y.site.installation },
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
              monthSources,
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
