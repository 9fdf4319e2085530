import Link from "next/link";
import { link, pageTitle } from "@/components/ui/styles";

type ViewName = "trends" | "year" | "what-if";

/**
 * Heading of a site's trends, year and what-if pages: where you are, the sibling views, and the
 * years the site has months in (each a link, the current one marked).
 */
export function SiteViewHeader({
  site,
  title,
  current,
  year,
  years,
  yearHref,
}: {
  site: { id: string; name: string; code: string };
  title: string;
  current: ViewName;
  year: string | null;
  years: string[];
  yearHref?: (y: string) => string;
}) {
  const views: [ViewName, string, string][] = [
    ["trends", "Trends", `/sites/${site.id}/trends${year ? `?year=${year}` : ""}`],
    ["year", "Year", `/sites/${site.id}/years/${year ?? ""}`],
    ["what-if", "What-if", `/sites/${site.id}/what-if${year ? `?year=${year}` : ""}`],
  ];
  return (
    <div className="flex flex-wrap items-end justify-between gap-3">
      <div>
        <p className="text-sm text-ink-soft">
          {site.name} <span className="num text-ink-faint">{site.code}</span>
        </p>
        <h1 className={pageTitle}>{title}</h1>
      </div>
      <div className="space-y-1 text-sm">
        <nav aria-label="Views of the site" className="flex gap-3">
          {views.map(([v, label, href]) =>
            v === current ? (
              <span key={v} aria-current="page" className="font-semibold">
                {label}
              </span>
            ) : (
              <Link key={v} href={href} className={link}>
                {label}
              </Link>
            ),
          )}
        </nav>
        {yearHref && years.length > 1 ? (
          <nav aria-label="Years" className="flex gap-2">
            {years.map((y) =>
              y === year ? (
                <span key={y} aria-current="page" className="num font-semibold">
                  {y}
                </span>
              ) : (
                <Link key={y} href={yearHref(y)} className={`num ${link}`}>
                  {y}
                </Link>
              ),
            )}
          </nav>
        ) : null}
      </div>
    </div>
  );
}
