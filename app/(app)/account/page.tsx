import type { Metadata } from "next";
import { formatDateTime } from "@/reports/format";
import { Status } from "@/components/ui/status";
import { pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { openSessionsOf } from "@/db/queries/sessions";
import { requirePageActor } from "@/lib/auth/guard";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { PasswordForm } from "./_components/password-form";
import { EndSessionForm, SignOutEverywhereForm } from "./_components/session-forms";

export const metadata: Metadata = { title: "Your account" };

/** "Mozilla/5.0 (X11; Linux x86_64) … Chrome/156 …" → "Chrome on Linux": enough to recognise a session. */
function browserOf(ua: string): string {
  if (!ua) return "Unknown browser";
  const browser = ua.includes("Firefox/") ? "Firefox" : ua.includes("Edg/") ? "Edge" : ua.includes("Chrome/") ? "Chrome" : ua.includes("Safari/") ? "Safari" : ua.slice(0, 40);
  const os = ua.includes("Windows") ? "Windows" : ua.includes("Android") ? "Android" : ua.includes("iPhone") || ua.includes("iPad") ? "iOS" : ua.includes("Mac OS") ? "macOS" : ua.includes("Linux") ? "Linux" : null;
  return os ? `${browser} on ${os}` : browser;
}

export default async function AccountPage() {
  const actor = await requirePageActor("org:read");
  const sessions = await openSessionsOf(getDb(), actor.userId);
  return (
    <div className="space-y-8">
      <div>
        <h1 className={pageTitle}>Your account</h1>
        <p className="mt-1 text-sm text-ink-soft">
          {actor.name} · {actor.email} · {actor.roles.map((r) => ROLE_LABELS[r]).join(", ")} at {actor.organisationName}
        </p>
      </div>

      <section aria-labelledby="sessions-heading">
        <h2 id="sessions-heading" className="text-base font-semibold">
          Where you are signed in <span className="num font-normal text-ink-soft">({sessions.length})</span>
        </h2>
        <p className="mt-0.5 text-sm text-ink-soft">Each sign-in is a session until it signs out. End any you do not recognise; it stops working at its next request.</p>
        <div className="relative mt-3 overflow-x-auto border border-rule bg-white" role="region" aria-label="Sessions" tabIndex={0}>
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule bg-paper-deep text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th scope="col" className="px-3 py-2 font-medium">Browser</th>
                <th scope="col" className="px-3 py-2 font-medium">Address</th>
                <th scope="col" className="px-3 py-2 font-medium whitespace-nowrap">Signed in</th>
                <th scope="col" className="px-3 py-2 font-medium whitespace-nowrap">Last used</th>
                <th scope="col" className="px-3 py-2 font-medium"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody className="divide-y divide-rule">
              {sessions.map((s) => {
                const label = `${browserOf(s.userAgent)} from ${s.address}`;
                return (
                  <tr key={s.id} className="align-top">
                    <td className="px-3 py-2">{browserOf(s.userAgent)}</td>
                    <td className="num px-3 py-2">{s.address}</td>
                    <td className="num px-3 py-2 whitespace-nowrap">{formatDateTime(s.createdAt)}</td>
                    <td className="num px-3 py-2 whitespace-nowrap">{formatDateTime(s.lastSeenAt)}</td>
                    <td className="px-3 py-2 text-right">
                      {s.id === actor.sessionId ? <Status tone="ok">This session</Status> : <EndSessionForm sessionId={s.id} label={label} />}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
        <div className="mt-3">
          <SignOutEverywhereForm count={sessions.length} />
        </div>
      </section>

      <section aria-labelledby="password-heading" className="border border-rule bg-white px-4 py-4">
        <h2 id="password-heading" className="text-base font-semibold">
          Change your password
        </h2>
        <p className="mb-3 text-sm text-ink-soft">Every session of your account ends when the password changes, this one included; sign in again with the new password.</p>
        <PasswordForm email={actor.email} />
      </section>
    </div>
  );
}
