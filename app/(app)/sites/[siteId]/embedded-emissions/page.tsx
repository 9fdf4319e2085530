import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { SignButtonForm } from "@/components/overview/annual-sign-form";
import { FigureTable, QtyCell, Section } from "@/components/review/figure-table";
import { Notice } from "@/components/ui/status";
import { buttonSecondary, input, label, link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { listStatements } from "@/db/queries/statements";
import { can, requirePageActor } from "@/lib/auth/guard";
import { COMMUNICATION_FIGURE_ROWS, buildCommunication, communicationPeriod } from "@/lib/ledger/cbam-communication";
import { loadSiteRuns } from "@/lib/ledger/site-period";
import { monthsBetween } from "@/lib/period";
import { periodLabelOf } from "@/lib/statement-kind";
import { fixed, utcStamp } from "@/reports/format";
import { signCommunicationAction } from "./actions";

export const metadata: Metadata = { title: "Embedded emissions" };

type Search = { from?: string; to?: string; shipped_t?: string };
/**
 * The communication of embedded emissions to importers: the officer picks the period (and a
 * shipped quantity) and reads the draft; a signatory signs it, sealed like the statements with
 * the JSON document inside the PDF. Earlier communications of the site are listed with both files.
 */
export default async function EmbeddedEmissionsPage({ params, searchParams }: { params: Promise<{ siteId: string }>; searchParams: Promise<Search> }) {
  const { siteId } = await params;
  const q = await searchParams;
  const actor = await requirePageActor();
  const db = getDb();
  const p = communicationPeriod(q.from ?? null, q.to ?? null, q.shipped_t ? q.shipped_t : null);
  const months = p.ok ? monthsBetween(p.from, p.to) : [];
  const loaded = await loadSiteRuns(db, actor.organisationId, siteId, months.length ? months : [new Date().toISOString().slice(0, 7)]);
  if (!loaded) notFound();
  const site = loaded.site;
  const doc = p.ok && loaded.runs.some((r) => r.result)
    ? buildCommunication({ organisation: actor.organisationName, site: { id: site.id, code: site.code, name: site.name, installation: site.installation ?? null }, from: p.from, to: p.to, runs: loaded.runs, shippedT: p.shippedT, preparedAt: new Date() })
    : null;
  const signed = await listStatements(db, { organisationId: actor.organisationId }, { siteId: site.id, kind: "cbam" });
  const draftUrl = p.ok ? `/api/v1/sites/${site.id}/embedded-emissions?from=${p.from}&to=${p.to}${p.shippedT ? `&shipped_t=${p.shippedT}` : ""}` : null;

  return (
    <div className="space-y-6">
      <div>
        <p className="text-sm text-ink-soft">
          {site.name} <span className="num text-ink-faint">{site.code}</span> ·{" "}
          <Link className={link} href={`/sites/${site.id}/years/${p.ok ? p.to.slice(0, 4) : ""}`}>back to the year</Link>
        </p>
        <h1 className={pageTitle}>Embedded emissions: communication to importers</h1>
      </div>

      <form method="get" className="grid max-w-3xl gap-3 sm:grid-cols-4 sm:items-end">
        <div>
          <label className={label} htmlFor="from">First month</label>
          <input className={input} id="from" name="from" type="month" defaultValue={p.ok ? p.from : q.from} aria-invalid={!p.ok && p.path === "from"} />
        </div>
        <div>
          <label className={label} htmlFor="to">Last month</label>
          <input className={input} id="to" name="to" type="month" defaultValue={p.ok ? p.to : q.to} aria-invalid={!p.ok && p.path === "to"} />
        </div>
        <div>
          <label className={label} htmlFor="shipped_t">Shipped, t NH3 (optional)</label>
          <input className={input} id="shipped_t" name="shipped_t" inputMode="decimal" defaultValue={q.shipped_t ?? ""} aria-invalid={!p.ok && p.path === "shipped_t"} />
        </div>
        <button type="submit" className={buttonSecondary}>Prepare</button>
      </form>

      {!p.ok ? (
        <Notice tone="fault" title={`Check the ${p.path === "shipped_t" ? "shipped quantity" : p.path === "from" ? "first month" : "last month"}`}>{p.message}.</Notice>
      ) : !doc ? (
        <Notice tone="pending" title="Nothing to communicate yet">No ended month of {p.from} to {p.to} computes from its stored figures.</Notice>
      ) : (
        <Section id="draft" title={`Draft, ${periodLabelOf("cbam", `${p.from}..${p.to}`)}`} note="Unsigned: what a signatory will sign. Months not yet ended are never counted.">
          <FigureTable
            caption="Embedded emissions, draft"
            rows={[...COMMUNICATION_FIGURE_ROWS]}
            columns={[
              { title: "Figure", cell: ([, l]) => l },
              { title: "Value", numeric: true, cell: ([k, , places]) => <QtyCell q={{ value: doc.figures[k].value === null ? "not computed" : fixed(doc.figures[k].value, places), unit: doc.figures[k].unit }} /> },
              { title: "How it was obtained", cell: ([k]) => <span className="text-xs text-ink-soft">{doc.figures[k].how}</span> },
            ]}
          />
          {doc.shipment ? (
            <p className="text-sm">
              Shipment of <span className="num">{fixed(doc.shipment.quantity_t, 1)} t NH3</span>: embedded{" "}
              <span className="num">{doc.shipment.total_t === null ? "not computed" : `${fixed(doc.shipment.total_t, 1)} t CO2e`}</span> (direct{" "}
              <span className="num">{fixed(doc.shipment.direct_t, 1)} t CO2e</span>).
            </p>
          ) : null}
          <p className="text-sm">
            {doc.good.description}, CN {doc.good.cn_code} <span className="text-ink-soft">(code unconfirmed)</span>. Months signed:{" "}
            <span className="num">{doc.data_quality.months_signed} of {doc.data_quality.months_in_period}</span>
            {doc.data_quality.months_not_signed.length ? `; not yet signed: ${doc.data_quality.months_not_signed.join(", ")}` : ""}
            {doc.data_quality.months_missing.length ? `; missing: ${doc.data_quality.months_missing.join(", ")}` : ""}.
          </p>
          <p className="text-sm">
            <a className={link} href={draftUrl!}>Draft as JSON</a> · <a className={link} href="/api/v1/schemas/cbam-communication.json">JSON Schema</a>
          </p>
          <ul className="list-disc space-y-0.5 pl-5 text-xs text-ink-soft">
            {doc.cautions.map((c) => <li key={c}>{c}</li>)}
          </ul>
          {can(actor, "month:sign") ? (
            <SignButtonForm action={signCommunicationAction} fields={{ siteId: site.id, from: p.from, to: p.to, shipped_t: p.shippedT ?? "" }} label="Sign and issue this communication" />
          ) : (
            <p className="text-sm text-ink-soft">A signatory signs it: send them this page&apos;s address, which holds the period and the quantity.</p>
          )}
        </Section>
      )}

      <Section id="signed" title="Signed communications">
        <FigureTable
          caption="Signed communications of embedded emissions"
          rows={signed}
          empty="None signed for this site yet."
          columns={[
            { title: "Period", cell: (s) => periodLabelOf("cbam", s.period) },
            { title: "Rev.", numeric: true, cell: (s) => <span className="num">{s.revision}</span> },
            { title: "Signed", cell: (s) => <span className="text-sm">{s.signerName}, {utcStamp(s.signedAt)}</span> },
            { title: "Embedded", cell: (s) => <span className="num text-sm">{s.summary.seeTotal ?? s.summary.seeDirect ?? ""}</span> },
            {
              title: "Files",
              cell: (s) => (
                <span className="text-sm">
                  <a className={link} href={`/api/v1/statements/${s.id}/pdf`}>PDF</a> · <a className={link} href={`/api/v1/statements/${s.id}/document`}>JSON</a>
                </span>
              ),
            },
          ]}
        />
      </Section>
    </div>
  );
}
