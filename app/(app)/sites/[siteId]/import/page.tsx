import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ImportWizard } from "@/components/import/import-wizard";
import type { SavedMapping, WizardStream } from "@/components/import/types";
import { formatDateTime } from "@/reports/format";
import { pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { importStreams, listBatches, listMappings } from "@/db/queries/imports";
import { findSite } from "@/db/queries/sites";
import { requirePageActor } from "@/lib/auth/guard";
import { UNITS_BY_KIND } from "@/lib/balance/schema";
import { importMappingSchema } from "@/lib/import/mapping";

export const metadata: Metadata = { title: "Import figures" };

/** The CSV import of one site; another organisation's site is a plain 404. */
export default async function ImportPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const actor = await requirePageActor("month:enter");
  const db = getDb();
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) notFound();
  const [streams, mappings, batches] = await Promise.all([importStreams(db, site.id), listMappings(db, site.id), listBatches(db, site.id, 5)]);
  const wizardStreams: WizardStream[] = streams
    .filter((s) => !s.archived)
    .map((s) => ({ key: s.key, name: s.name, kind: s.kind, unit: s.unit, meterTag: s.meterTag, analysisKey: s.analysisKey, units: UNITS_BY_KIND[s.kind] }));
  // A mapping saved by an older version that no longer validates is simply not offered.
  const saved: SavedMapping[] = mappings.flatMap((m) => {
    const r = importMappingSchema.safeParse(m.mapping);
    return r.success ? [{ name: m.name, mapping: r.data }] : [];
  });

  return (
    <div className="space-y-6">
      <div>
        <p className="text-sm text-ink-soft">
          {site.name} <span className="num text-ink-faint">{site.code}</span>
        </p>
        <h1 className={pageTitle}>Import figures from a CSV file</h1>
        <p className="mt-1 max-w-prose text-ink-soft">
          Daily or monthly meter totals and lab analyses exported by plant systems. Daily values are summed per stream into calendar
          months; every row is checked before anything is written, and the whole file is written at once or not at all.
        </p>
      </div>

      <ImportWizard siteId={site.id} streams={wizardStreams} saved={saved} />

      <section aria-labelledby="recent-imports" className="border-t border-rule pt-4">
        <h2 id="recent-imports" className="text-base font-semibold">
          Recent imports at {site.name}
        </h2>
        {batches.length === 0 ? (
          <p className="mt-1 text-sm text-ink-soft">None yet. Each import is listed here with its file, who imported it and when.</p>
        ) : (
          <table className="mt-2 w-full max-w-3xl text-sm">
            <thead className="text-left text-xs text-ink-soft">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">File</th>
                <th scope="col" className="py-1 pr-3 font-medium">Imported</th>
                <th scope="col" className="py-1 pr-3 font-medium">By</th>
                <th scope="col" className="py-1 text-right font-medium">Rows</th>
              </tr>
            </thead>
            <tbody>
              {batches.map((b) => (
                <tr key={b.id} className="border-t border-rule">
                  <td className="py-1 pr-3">{b.fileName}</td>
                  <td className="num py-1 pr-3">{formatDateTime(b.importedAt)}</td>
                  <td className="py-1 pr-3">{b.importedBy ?? "—"}</td>
                  <td className="num py-1 text-right">{b.rowCount}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}
