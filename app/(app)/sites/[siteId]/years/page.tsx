import { notFound, redirect } from "next/navigation";
import { getDb } from "@/db";
import { latestYearOfSite } from "@/db/queries/overview";
import { findSite } from "@/db/queries/sites";
import { requirePageActor } from "@/lib/auth/guard";

/** "Year" in the navigation: the site's latest year with months (this calendar year when it has none). */
export default async function YearsIndex({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const actor = await requirePageActor();
  const site = await findSite(getDb(), actor.organisationId, siteId);
  if (!site) notFound();
  const year = (await latestYearOfSite(getDb(), site.id)) ?? String(new Date().getUTCFullYear());
  redirect(`/sites/${site.id}/years/${year}`);
}
