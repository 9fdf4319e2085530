import Link from "next/link";
import { signOutAction } from "@/app/(app)/actions";
import { BeamMark } from "@/components/ui/icons";
import { can, type Actor } from "@/lib/auth/guard";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { ContextSwitcher, type SiteOption } from "./context-switcher";
import { MainNav, type NavItem } from "./main-nav";
import { PhonePicker } from "./phone-picker";
import { SiteViewsNav } from "./site-views-nav";

/** Header of every signed-in page: product, organisation, who is signed in, navigation, site and month. */
export function AppHeader({ actor, sites, defaultMonth }: { actor: Actor; sites: SiteOption[]; defaultMonth: string }) {
  const items: NavItem[] = [
    { href: "/", label: "Overview", match: ["/"] },
    { href: "/months", label: "Monthly ledger", match: ["/months", "/sites/*/months", "/sites/*/import"] },
    { href: "/statements", label: "Statements", match: ["/statements"] },
    { href: "/verify", label: "Verify", match: ["/verify"] },
    { href: "/audit", label: "Audit trail", match: ["/audit"] },
  ];
  // Settings hold users and sites, both administrator work; others never see a link they cannot use.
  if (can(actor, "org:manage-users")) items.push({ href: "/settings/users", label: "Settings", match: ["/settings"] });

  return (
    <header className="border-t-[3px] border-t-accent border-b border-b-rule bg-white print:border-0">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-x-6 gap-y-2 px-5 pt-3">
        <div className="flex min-w-0 items-baseline gap-3">
          <Link href="/" className="flex items-center gap-1.5 self-center font-semibold tracking-tight text-ink no-underline">
            <BeamMark className="size-5 text-accent" />
            <span className="text-[1.05rem]">Synledger</span>
          </Link>
          <span aria-hidden="true" className="text-rule-strong">
            /
          </span>
          <span className="truncate text-ink-soft" title="Organisation">
            {actor.organisationName}
          </span>
        </div>
        <div className="no-print flex items-center gap-3 text-sm">
          <div className="hidden text-right leading-tight sm:block">
            <Link href="/account" className="font-medium text-ink no-underline hover:underline" title="Your account: password and sessions">
              {actor.name}
            </Link>
            <div className="text-xs text-ink-soft">
              <span className="sr-only">Roles: </span>
              {actor.roles.map((r) => ROLE_LABELS[r]).join(" · ")}
            </div>
          </div>
          <Link href="/account" className="text-sm text-ink sm:hidden">
            Account
          </Link>
          <form action={signOutAction}>
            <button type="submit" className="border border-rule-strong px-2.5 py-1 text-sm text-ink hover:bg-paper-deep">
              Sign out
            </button>
          </form>
        </div>
      </div>
      <div className="no-print mx-auto flex max-w-6xl flex-wrap items-end justify-between gap-x-6 gap-y-2 px-5 pt-2">
        <div className="flex min-w-0 max-w-full flex-wrap items-end gap-x-2">
          <MainNav items={items} />
          <SiteViewsNav sites={sites} />
        </div>
        <div className="hidden pb-2 sm:block">
          <ContextSwitcher sites={sites} defaultMonth={defaultMonth} />
        </div>
        <PhonePicker sites={sites} defaultMonth={defaultMonth} />
      </div>
    </header>
  );
}
