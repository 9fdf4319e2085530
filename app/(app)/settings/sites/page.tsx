import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/empty-state";
import { pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { listSites } from "@/db/queries/sites";
import { requirePageActor } from "@/lib/auth/guard";
import { SettingsTabs } from "../settings-tabs";

export const metadata: Metadata = { title: "Sites and meters" };

export default async function SitesSettingsPage() {
  const actor = await requirePageActor("site:manage");
  const sites = await listSites(getDb(), actor.organisationId);
  return (
    <div className="space-y-6">
      <div>
        <h1 className={pageTitle}>Settings</h1>
        <SettingsTabs current="sites" />
      </div>
      {sites.length === 0 ? (
        <EmptyState title="No sites set up yet">
          <p>
            Each site of {actor.organisationName} will be listed here with its metering reference, closure tolerance, emissions
            method and factor set, and the streams and meters that cross its boundary.
          </p>
          <p>Adding and editing sites arrives with the site set-up work; until then sites are loaded by the seed script.</p>
        </EmptyState>
      ) : (
        <EmptyState title={`${sites.length} site${sites.length === 1 ? "" : "s"} on record`}>
          <ul className="list-inside list-disc">
            {sites.map((s) => (
              <li key={s.id}>
                {s.name} <span className="num text-ink-faint">({s.code})</span>
              </li>
            ))}
          </ul>
          <p>Editing a site&rsquo;s streams, meters and factor set will be possible here once the site set-up work lands.</p>
        </EmptyState>
      )}
    </div>
  );
}
