import Link from "next/link";
import type { ReactNode } from "react";
import { ArrowLeftIcon } from "@/components/ui/icons";
import { link, pageTitle } from "@/components/ui/styles";

/** Heading and back link shared by the add and edit stream pages. */
export function StreamPageFrame({ siteId, siteName, title, children }: { siteId: string; siteName: string; title: string; children: ReactNode }) {
  return (
    <div className="max-w-4xl space-y-5">
      <Link href={`/settings/sites/${siteId}`} className={`${link} inline-flex items-center gap-1 text-sm`}>
        <ArrowLeftIcon /> {siteName}
      </Link>
      <h1 className={pageTitle}>{title}</h1>
      <div className="border border-rule bg-white p-5">{children}</div>
    </div>
  );
}
