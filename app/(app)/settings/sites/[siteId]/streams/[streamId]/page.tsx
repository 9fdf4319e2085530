import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { StreamForm } from "@/components/sites/stream-form";
import { Notice } from "@/components/ui/status";
import { getDb } from "@/db";
import { findSite } from "@/db/queries/sites";
import { findStream, listStreams } from "@/db/queries/streams";
import { requirePageActor } from "@/lib/auth/guard";
import { StreamPageFrame } from "../stream-page-frame";
import { SetupReach } from "@/components/sites/setup-reach";
import { monthsReachedBySetup } from "@/db/queries/site-admin";

export const metadata: Metadata = { title: "Edit stream" };

export default async function EditStreamPage({ params }: { params: Promise<{ siteId: string; streamId: string }> }) {
  const { siteId, streamId } = await params;
  const actor = await requirePageActor("site:manage");
  const db = getDb();
  const site = await findSite(db, actor.organisationId, siteId);
  const s = site ? await findStream(db, actor.organisationId, site.id, streamId) : null;
  if (!site || !s) notFound();
  const analysisKeys = [...new Set((await listStreams(db, site.id)).flatMap((x) => (x.analysisKey ? [x.analysisKey] : [])))];
  const reach = await monthsReachedBySetup(db, site.id);
  return (
    <StreamPageFrame siteId={site.id} siteName={site.name} title={`Stream ${s.key}`}>
      <div className="mb-4">
        <SetupReach reached={reach.reached} frozen={reach.frozen} what={`this stream's definition (kind, analysis, uncertainty, meter tag, factor)`} />
      </div>
      {s.archivedAt ? (
        <div className="mb-4">
          <Notice tone="locked" title="Archived">
            This stream no longer appears in new months; its readings stay in the months that have them.
          </Notice>
        </div>
      ) : null}
      <StreamForm
        siteId={site.id}
        streamId={s.id}
        analysisKeys={analysisKeys}
        defaults={{
          key: s.key,
          name: s.name,
          kind: s.kind,
          unit: s.unit,
          analysisKey: s.analysisKey ?? "",
          destination: (s.destination ?? "") as never,
          fate: (s.fate ?? "") as never,
          uncertaintyPct: s.uncertaintyPct ?? "",
          metered: s.metered,
          systematicPct: s.systematicPct ?? "",
          indirectFactor: s.indirectFactor ?? "",
          meterTag: s.meterTag ?? "",
          calibratedOn: s.calibratedOn ?? "",
          calibrationIntervalMonths: s.calibrationIntervalMonths === null ? "" : String(s.calibrationIntervalMonths),
          sortOrder: String(s.sortOrder),
        }}
      />
    </StreamPageFrame>
  );
}
