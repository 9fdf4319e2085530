import "server-only";
/**
 * Signs the communication of embedded emissions to importers for a site and a period (issue 14):
 * the document (synledger.cbam-communication/1) is built from the stored months as the API
 * answers it, printed, carried inside the PDF as cbam-communication.json and sealed like the
 * statements (kind "cbam", period "YYYY-MM..YYYY-MM"). A second signing of the same period is a
 * new revision. Only ended months count; at least one must compute.
 */
import type { Db } from "@/db/client";
import { latestRevision } from "@/db/queries/statements";
import { HttpError, notFound } from "@/lib/auth/errors";
import type { Actor } from "@/lib/auth/guard";
import { buildCommunication, type CbamCommunication } from "@/lib/ledger/cbam-communication";
import { loadSiteRuns } from "@/lib/ledger/site-period";
import { monthsBetween } from "@/lib/period";
import { issueStatement, NoSigningCertificate, signOffFacts } from "@/lib/signing/issue";
import { installationFacts, installationSummary } from "@/reports/build-model";
import { meteringLabel } from "@/reports/build-model-parts";
import { STATEMENT_CAUTIONS } from "@/reports/model";
import { periodLabelOf } from "@/lib/statement-kind";
import { fixed, utcStamp } from "@/reports/format";
import { renderCommunication } from "@/reports/render";

export const COMMUNICATION_FILE = "cbam-communication.json";

export function communicationDeclaration(unconfirmed: number): string[] {
  return [
    "I have read this communication in full before signing it.",
    `To the best of my knowledge and belief, its figures were computed from the installation's records for the months named, by the rules it lists; ${unconfirmed} of those rules or codes were not confirmed in their published text, and it names them.`,
    "It is the operator's communication to importers. It is not a verification opinion: where one is required, an accredited verifier gives it separately.",
  ];
}

export async function signCommunication(db: Db, actor: Actor, siteId: string, from: string, to: string, shippedT: string | null) {
  const loaded = await loadSiteRuns(db, actor.organisationId, siteId, monthsBetween(from, to));
  if (!loaded) throw notFound("The site");
  if (!loaded.runs.some((r) => r.result !== null)) throw new HttpError(422, "precondition_failed", `No ended month of ${from} to ${to} computes from its stored figures; there is nothing to communicate.`);
  const preparedAt = new Date();
  const document: CbamCommunication = buildCommunication({
    organisation: actor.organisationName,
    site: { id: loaded.site.id, code: loaded.site.code, name: loaded.site.name, installation: loaded.site.installation ?? null },
    from, to, runs: loaded.runs, shippedT, preparedAt,
  });
  const period = `${from}..${to}`;
  const revision = (await latestRevision(db, loaded.site.id, "cbam", period)) + 1;
  const unconfirmed = document.methodology.rules.filter((r) => r.status === "unconfirmed").length + (document.good.cn_status === "unconfirmed" ? 1 : 0);
  const f = document.figures;
  try {
    return await issueStatement(db, {
      organisationId: actor.organisationId,
      siteId: loaded.site.id,
      kind: "cbam",
      period,
      monthId: null,
      revision,
      signer: { userId: actor.userId, name: actor.name, role: "Signatory" },
      location: loaded.site.name,
      contactInfo: actor.email,
      summary: {
        ...installationSummary(loaded.site.installation),
        ammonia: `${fixed(f.production.value, 1)} t NH3`,
        seeDirect: `${fixed(f.see_direct.value, 4)} t CO2e/t NH3 direct`,
        ...(f.see_indirect.value ? { seeIndirect: `${fixed(f.see_indirect.value, 4)} t CO2e/t NH3 indirect` } : {}),
        ...(f.see_total.value ? { seeTotal: `${fixed(f.see_total.value, 4)} t CO2e/t NH3 embedded` } : {}),
        months: `${document.period.months.length}`,
      },
      files: [{ name: COMMUNICATION_FILE, mediaType: "application/json", description: "synledger.cbam-communication/1, the document this PDF prints", bytes: new TextEncoder().encode(JSON.stringify(document, null, 1)) }],
      render: (ctx) =>
        renderCommunication({
          header: {
            organisation: actor.organisationName,
            installation: installationFacts(loaded.site.installation),
            siteName: loaded.site.name,
            siteCode: loaded.site.code,
            period,
            periodLabel: periodLabelOf("cbam", period),
            revision: String(revision),
            statementRef: ctx.statementId,
            meteringReference: meteringLabel(loaded.site.meteringReference),
            preparedBy: "from the stored months of the period",
            preparedAt: utcStamp(preparedAt),
          },
          document,
          signOff: { ...signOffFacts(actor.name, ctx), date: utcStamp(ctx.signedAt), revision: String(revision), declaration: communicationDeclaration(unconfirmed) },
          cautions: [...STATEMENT_CAUTIONS],
        }),
    });
  } catch (err) {
    if (err instanceof NoSigningCertificate) throw new HttpError(422, "no_certificate", err.message);
    throw err;
  }
}
