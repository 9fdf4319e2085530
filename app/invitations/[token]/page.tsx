import type { Metadata } from "next";
import Link from "next/link";
import { CautionLine } from "@/components/ui/caution-line";
import { formatDateTime } from "@/reports/format";
import { BeamMark } from "@/components/ui/icons";
import { Notice } from "@/components/ui/status";
import { link } from "@/components/ui/styles";
import { getDb } from "@/db";
import { findInvitationByToken, invitationStatus } from "@/db/queries/invitations";
import { findUserByEmail } from "@/db/queries/users";
import { ROLE_LABELS, isRole } from "@/lib/auth/roles";
import { AcceptForm } from "./accept-form";
import { STATUS_MESSAGES } from "./status-messages";

export const metadata: Metadata = { title: "Invitation", referrer: "no-referrer" };

const TITLES = { unknown: "Invitation not found", expired: "Invitation expired", revoked: "Invitation withdrawn", accepted: "Invitation already used" };

/** Public page behind the one-time link in an invitation e-mail. */
export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const db = getDb();
  // Tokens are 43 base64url characters; anything else cannot match and needs no look-up.
  const invitation = /^[A-Za-z0-9_-]{20,200}$/.test(token) ? await findInvitationByToken(db, token) : null;
  const status = invitation ? invitationStatus(invitation) : "unknown";
  const hasAccount = invitation && status === "pending" ? !!(await findUserByEmail(db, invitation.email)) : false;

  return (
    <div className="flex min-h-dvh flex-col">
      <main className="mx-auto w-full max-w-md flex-1 px-5 py-12">
        <p className="flex items-center gap-1.5 text-lg font-semibold">
          <BeamMark className="size-6 text-accent" /> Synledger
        </p>
        {invitation && status === "pending" ? (
          <div className="mt-8 border border-rule bg-white px-6 py-6">
            <h1 className="text-lg font-semibold">Join {invitation.organisationName}</h1>
            <dl className="mt-3 space-y-1 text-sm">
              <div className="flex gap-2">
                <dt className="w-24 shrink-0 text-ink-soft">E-mail</dt>
                <dd>{invitation.email}</dd>
              </div>
              <div className="flex gap-2">
                <dt className="w-24 shrink-0 text-ink-soft">Roles</dt>
                <dd>{invitation.roles.filter(isRole).map((r) => ROLE_LABELS[r]).join(", ")}</dd>
              </div>
              <div className="flex gap-2">
                <dt className="w-24 shrink-0 text-ink-soft">Valid until</dt>
                <dd className="num">{formatDateTime(invitation.expiresAt)}</dd>
              </div>
            </dl>
            <p className="mt-4 mb-4 text-sm text-ink-soft">
              {hasAccount
                ? "This address already has a Synledger account. Enter its password to add these roles to it."
                : "Set up your account to accept. The link works once."}
            </p>
            <AcceptForm token={token} email={invitation.email} hasAccount={hasAccount} />
          </div>
        ) : (
          <div className="mt-8 space-y-4">
            <h1 className="text-lg font-semibold">{TITLES[status as keyof typeof TITLES]}</h1>
            <Notice tone={status === "accepted" ? "info" : "warn"}>{STATUS_MESSAGES[status as keyof typeof STATUS_MESSAGES]}</Notice>
            <p>
              <Link href="/sign-in" className={link}>
                Go to sign-in
              </Link>
            </p>
          </div>
        )}
      </main>
      <footer className="border-t border-rule px-5 py-4">
        <CautionLine className="mx-auto max-w-md" />
      </footer>
    </div>
  );
}
