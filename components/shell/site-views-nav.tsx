"use client";

import Link from "next/link";
import { useParams, usePathname } from "next/navigation";
import type { SiteOption } from "./context-switcher";

/**
 * Trends, Year and What-if of the site in view (the one in the URL, else the first site), beside
 * the main navigation. Year links to the site's latest year; the page picks it.
 */
export function SiteViewsNav({ sites }: { sites: SiteOption[] }) {
  const params = useParams<{ siteId?: string }>();
  const pathname = usePathname();
  const site = sites.find((s) => s.id === params.siteId) ?? sites[0];
  if (!site) return null;
  const base = `/sites/${site.id}`;
  const items = [
    { href: `${base}/trends`, label: "Trends", match: `${base}/trends` },
    { href: `${base}/years`, label: "Year", match: `${base}/years` },
    { href: `${base}/what-if`, label: "What-if", match: `${base}/what-if` },
  ];
  return (
    <nav aria-label={`Views of ${site.name}`} className="relative -mb-px flex min-w-0 max-w-full items-end gap-x-1 overflow-x-auto whitespace-nowrap border-l border-rule pl-2">
      <span className="shrink-0 px-1 pb-2 text-sm text-ink-soft">
        {site.name}
        <span aria-hidden="true">:</span>
      </span>
      {items.map((i) => {
        const current = pathname === i.match || pathname.startsWith(`${i.match}/`);
        return (
          <Link
            key={i.href}
            href={i.href}
            aria-current={current ? "page" : undefined}
            className={`shrink-0 border-b-2 px-2.5 py-2 text-sm ${current ? "border-accent font-medium text-ink" : "border-transparent text-ink-soft hover:border-rule-strong hover:text-ink"}`}
          >
            {i.label}
          </Link>
        );
      })}
    </nav>
  );
}
