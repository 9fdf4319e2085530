import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { StreamForm } from "@/components/sites/stream-form";
import { getDb } from "@/db";
import { findSite } from "@/db/queries/sites";
import { listStreams } from "@/db/queries/streams";
import { requirePageActor } from "@/lib/auth/guard";
import { STREAM_DEFAULTS } from "@/lib/validations/stream";
import { StreamPageFrame } from "../stream-page-frame";

export const metadata: Metadata = { title: "Add a stream" };

export default async function NewStreamPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const actor = await requirePageActor("site:manage");
  const db = getDb();
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) notFound();
  const streams = await listStreams(db, site.id);
  const analysisKeys = [...new Set(streams.flatMap((s) => (s.analysisKey ? [s.analysisKey] : [])))];
  const nextOrder = streams.reduce((m, s) => Math.max(m, s.sortOrder + 1), 0);
  return (
    <StreamPageFrame siteId={site.id} siteName={site.name} title={`Add a stream to ${site.name}`}>
      <StreamForm siteId={site.id} defaults={{ ...STREAM_DEFAULTS, sortOrder: String(nextOrder) }} analysisKeys={analysisKeys} />
    </StreamPageFrame>
  );
}
