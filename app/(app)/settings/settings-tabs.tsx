import Link from "next/link";

const TABS = [
  { key: "users", href: "/settings/users", label: "Users and invitations" },
  { key: "sites", href: "/settings/sites", label: "Sites and meters" },
  { key: "api-tokens", href: "/settings/api-tokens", label: "API tokens" },
  { key: "signing", href: "/settings/signing", label: "Signing certificate" },
] as const;

/** Sub-navigation of the settings area (administrators only). */
export function SettingsTabs({ current }: { current: (typeof TABS)[number]["key"] }) {
  return (
    <nav aria-label="Settings sections" className="relative mt-3 flex gap-1 overflow-x-auto border-b border-rule">
      {TABS.map((t) => (
        <Link
          key={t.key}
          href={t.href}
          aria-current={t.key === current ? "page" : undefined}
          className={`-mb-px shrink-0 border-b-2 px-3 py-1.5 text-sm whitespace-nowrap ${t.key === current ? "border-accent font-medium text-ink" : "border-transparent text-ink-soft hover:text-ink"}`}
        >
          {t.label}
        </Link>
      ))}
    </nav>
  );
}
