"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export interface NavItem {
  href: string;
  label: string;
  /** Path prefixes that count as "inside" this item, for the current-page marker. */
  match: string[];
}

/** The primary navigation; the current section is marked for sight (underline) and for screen readers. */
export function MainNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  const isCurrent = (item: NavItem) =>
    item.match.some((m) => (m === "/" ? pathname === "/" : pathname === m || pathname.startsWith(`${m}/`)));
  return (
    <nav aria-label="Main" className="-mb-px flex flex-wrap gap-x-1">
      {items.map((item) => {
        const current = isCurrent(item);
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={current ? "page" : undefined}
            className={`border-b-2 px-2.5 py-2 text-sm ${current ? "border-accent font-medium text-ink" : "border-transparent text-ink-soft hover:border-rule-strong hover:text-ink"}`}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
