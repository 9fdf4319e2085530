import type { Metadata } from "next";
import Link from "next/link";
import { SitesDataTable } from "@/components/sites/sites-table/data-table";
import { SitesEmptyState } from "@/components/sites/sites-table/empty-state";
import { buttonPrimary, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { listSitesForAdmin } from "@/db/queries/site-admin";
import { requirePageActor } from "@/lib/auth/guard";
import { SettingsTabs } from "../settings-tabs";

export const metadata: Metadata = { title: "Sites and meters" };

export default async function SitesSettingsPage() {
  const actor = await requirePageActor("site:manage");
  const sites = await listSitesForAdmin(getDb(), actor.organisationId);
  const rows = sites.map(({ archivedAt, ...s }) => ({ ...s, archived: archivedAt !== null }));
  return (
    <div className="space-y-6">
      <div>
        <h1 className={pageTitle}>Settings</h1>
        <SettingsTabs current="sites" />
      </div>
      {rows.length === 0 ? (
        <SitesEmptyState organisationName={actor.organisationName} />
      ) : (
        <section aria-labelledby="sites-heading" className="space-y-3">
          <div className="flex flex-wrap items-end justify-between gap-3">
            <div>
              <h2 id="sites-heading" className="text-base font-semibold">
                Sites of {actor.organisationName}
              </h2>
              <p className="text-sm text-ink-soft">Open a site to change its settings and its streams and meters.</p>
            </div>
            <Link href="/settings/sites/new" className={buttonPrimary}>
              Set up a site
            </Link>
          </div>
          <SitesDataTable rows={rows} />
        </section>
      )}
    </div>
  );
}
