import type { Metadata } from "next";
import Link from "next/link";
import { BeamMark, LockIcon } from "@/components/ui/icons";
import { link } from "@/components/ui/styles";
import { currentActor } from "@/lib/auth/guard";
import { PERMISSIONS, ROLE_LABELS, type Permission, type Role } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Not allowed" };

/** What each permission lets a person do, in the words of the page. */
const DOING: Record<Permission, string> = {
  "org:read": "read your organisation's data",
  "org:manage-users": "manage users and invitations",
  "site:manage": "set up sites, streams and meters",
  "month:enter": "enter monthly figures",
  "month:balance": "close balances",
  "month:prepare": "prepare statements",
  "month:explain": "explain flags",
  "month:method": "choose a month's method and factor set",
  "month:sign": "sign statements",
  "audit:read": "read the audit trail",
};

function isPermission(v: unknown): v is Permission {
  return typeof v === "string" && v in PERMISSIONS;
}

/** Where requirePageActor sends someone whose roles do not allow a page (`?need=permission`). */
export default async function ForbiddenPage({ searchParams }: { searchParams: Promise<{ need?: string | string[] }> }) {
  const { need } = await searchParams;
  const actor = await currentActor();
  const permission = isPermission(need) ? need : null;
  const roles: readonly Role[] = permission ? PERMISSIONS[permission] : [];
  const roleNames = roles.map((r) => ROLE_LABELS[r]);

  return (
    <main className="mx-auto max-w-lg px-5 py-16">
      <p className="flex items-center gap-1.5 font-semibold text-ink">
        <BeamMark className="size-5 text-accent" /> Synledger
      </p>
      <h1 className="mt-6 flex items-center gap-2 text-xl font-semibold">
        <LockIcon className="size-5" /> Your role does not allow this page
      </h1>
      {permission ? (
        <p className="mt-3">
          To {DOING[permission]} you need the role{roleNames.length > 1 ? "s" : ""}{" "}
          <strong>{roleNames.length > 1 ? `${roleNames.slice(0, -1).join(", ")} or ${roleNames.at(-1)}` : roleNames[0]}</strong>.
        </p>
      ) : (
        <p className="mt-3">The page you opened needs a role you do not hold.</p>
      )}
      {actor ? (
        <p className="mt-2 text-ink-soft">
          You are signed in to {actor.organisationName} as {actor.name}, with the role{actor.roles.length > 1 ? "s" : ""}{" "}
          {actor.roles.map((r) => ROLE_LABELS[r]).join(", ")}. An administrator of your organisation can change your roles.
        </p>
      ) : null}
      <p className="mt-5 flex gap-4">
        <Link href="/" className={link}>
          Back to the overview
        </Link>
        {actor ? null : (
          <Link href="/sign-in" className={link}>
            Sign in
          </Link>
        )}
      </p>
    </main>
  );
}
