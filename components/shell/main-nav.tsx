"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export interface NavItem {
  href: string;
  label: string;
  /** Path prefixes that count as "inside" this item, for the current-page marker; "*" stands for one segment. */
  match: string[];
}

/** True when `pathname` is `pattern` or below it; a "*" segment of the pattern matches any one segment. */
export function under(pathname: string, pattern: string): boolean {
  if (pattern === "/") return pathname === "/";
  const want = pattern.split("/").filter(Boolean);
  const have = pathname.split("/").filter(Boolean);
  return have.length >= want.length && want.every((w, i) => w === "*" || w === have[i]);
}

/** The primary navigation; the current section is marked for sight (underline) and for screen readers. */
export function MainNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  const isCurrent = (item: NavItem) => item.match.some((m) => under(pathname, m));
  return (
    <nav aria-label="Main" className="relative -mb-px flex min-w-0 max-w-full gap-x-1 overflow-x-auto whitespace-nowrap">
      {items.map((item) => {
        const current = isCurrent(item);
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={current ? "page" : undefined}
            className={`shrink-0 border-b-2 px-2.5 py-2 text-sm ${current ? "border-accent font-medium text-ink" : "border-transparent text-ink-soft hover:border-rule-strong hover:text-ink"}`}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
