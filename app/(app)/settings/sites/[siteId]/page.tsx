import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ArchiveSiteButton } from "@/components/sites/archive-site-button";
import { InstallationForm } from "@/components/sites/installation-form";
import { SiteForm } from "@/components/sites/site-form";
import { StreamsDataTable } from "@/components/sites/streams-table/data-table";
import { StreamsEmptyState } from "@/components/sites/streams-table/empty-state";
import { ArrowLeftIcon } from "@/components/ui/icons";
import { Notice, Status } from "@/components/ui/status";
import { buttonPrimary, link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { findSite } from "@/db/queries/sites";
import { monthsReachedBySetup } from "@/db/queries/site-admin";
import { listStreams } from "@/db/queries/streams";
import { SetupReach } from "@/components/sites/setup-reach";
import { requirePageActor } from "@/lib/auth/guard";
import { EMPTY_INSTALLATION } from "@/lib/validations/installation";

export const metadata: Metadata = { title: "Site set-up" };

export default async function SiteSettingsPage({ params, searchParams }: { params: Promise<{ siteId: string }>; searchParams: Promise<{ created?: string }> }) {
  const { siteId } = await params;
  const { created } = await searchParams;
  const actor = await requirePageActor("site:manage");
  const db = getDb();
  const site = await findSite(db, actor.organisationId, siteId);
  if (!site) notFound();
  const [streams, reach] = await Promise.all([listStreams(db, site.id), monthsReachedBySetup(db, site.id)]);
  const rows = streams.map(({ archivedAt, createdAt: _c, ...s }) => ({ ...s, archived: archivedAt !== null }));
  return (
    <div className="space-y-6">
      <Link href="/settings/sites" className={`${link} inline-flex items-center gap-1 text-sm`}>
        <ArrowLeftIcon /> All sites
      </Link>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="num text-sm text-ink-soft">{site.code}</p>
          <h1 className={pageTitle}>{site.name}</h1>
        </div>
        <div className="flex items-center gap-3">
          {site.archivedAt ? <Status tone="locked">Archived</Status> : null}
          <ArchiveSiteButton siteId={site.id} archived={site.archivedAt !== null} />
        </div>
      </div>
      {created ? (
        <Notice tone="ok" title={`${site.name} is set up`}>
          Add its streams below: each metered flow crossing the site boundary, with its kind, unit and meter.
        </Notice>
      ) : null}
      <section aria-labelledby="site-settings" className="max-w-4xl border border-rule bg-white p-5">
        <h2 id="site-settings" className="mb-3 text-base font-semibold">
          Site settings
        </h2>
        <div className="mb-4">
          <SetupReach reached={reach.reached} frozen={reach.frozen} what="the default method, factor set, GWP set, tolerance or a stream" />
        </div>
        <SiteForm
          siteId={site.id}
          defaults={{
            name: site.name,
            code: site.code,
            meteringReference: site.meteringReference,
            closureTolerancePct: site.closureTolerancePct,
            factorSet: site.factorSet,
            emissionsMethod: site.emissionsMethod as never,
            gwp: site.gwp as never,
          }}
        />
      </section>
      <section aria-labelledby="installation-heading" className="max-w-4xl border border-rule bg-white p-5">
        <h2 id="installation-heading" className="text-base font-semibold">
          Installation identity
        </h2>
        <p className="mb-4 text-sm text-ink-soft">Who the statements are issued by and for, as the competent authority and a verifier will look them up.</p>
        <InstallationForm siteId={site.id} defaults={{ ...EMPTY_INSTALLATION, ...(site.installation ?? {}) }} />
      </section>
      <section aria-labelledby="streams-heading" className="space-y-3">
        <div className="flex flex-wrap items-end justify-between gap-3">
          <div>
            <h2 id="streams-heading" className="text-base font-semibold">
              Streams and meters
            </h2>
            <p className="text-sm text-ink-soft">
              Archived streams leave the entry form but stay readable in the months that used them.
            </p>
          </div>
          {rows.length ? (
            <Link href={`/settings/sites/${site.id}/streams/new`} className={buttonPrimary}>
              Add a stream
            </Link>
          ) : null}
        </div>
        {rows.length === 0 ? <StreamsEmptyState siteId={site.id} siteName={site.name} /> : <StreamsDataTable rows={rows} />}
      </section>
    </div>
  );
}
