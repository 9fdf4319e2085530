import type { Metadata } from "next";
import Link from "next/link";
import { SiteForm } from "@/components/sites/site-form";
import { ArrowLeftIcon } from "@/components/ui/icons";
import { link, pageTitle } from "@/components/ui/styles";
import { requirePageActor } from "@/lib/auth/guard";
import { SITE_DEFAULTS } from "@/lib/validations/site";

export const metadata: Metadata = { title: "Set up a site" };

export default async function NewSitePage() {
  await requirePageActor("site:manage");
  return (
    <div className="max-w-3xl space-y-5">
      <Link href="/settings/sites" className={`${link} inline-flex items-center gap-1 text-sm`}>
        <ArrowLeftIcon /> All sites
      </Link>
      <h1 className={pageTitle}>Set up a site</h1>
      <div className="border border-rule bg-white p-5">
        <SiteForm defaults={SITE_DEFAULTS} />
      </div>
    </div>
  );
}
