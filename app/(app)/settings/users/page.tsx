import type { Metadata } from "next";
import { formatDate, formatDateTime } from "@/reports/format";
import { Status, type StatusTone } from "@/components/ui/status";
import { pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { INVITATION_LIFETIME_HOURS, invitationStatus, listInvitations, type InvitationStatus } from "@/db/queries/invitations";
import { listMembers } from "@/db/queries/members";
import { requirePageActor } from "@/lib/auth/guard";
import { ROLE_LABELS, isRole } from "@/lib/auth/roles";
import { InviteForm } from "./_components/invite-form";
import { MemberAccessForm } from "./_components/member-access-form";
import { MemberRolesForm } from "./_components/member-roles-form";
import { RevokeInvitationForm } from "./_components/revoke-invitation-form";
import { SettingsTabs } from "../settings-tabs";

export const metadata: Metadata = { title: "Users and invitations" };

const INVITATION_STATUS: Record<InvitationStatus, { tone: StatusTone; label: string }> = {
  pending: { tone: "pending", label: "Waiting" },
  accepted: { tone: "ok", label: "Accepted" },
  revoked: { tone: "fault", label: "Revoked" },
  expired: { tone: "warn", label: "Expired" },
};

export default async function UsersPage() {
  const actor = await requirePageActor("org:manage-users");
  const db = getDb();
  const [members, invitations] = await Promise.all([listMembers(db, actor.organisationId), listInvitations(db, actor.organisationId)]);
  const now = new Date();

  return (
    <div className="space-y-8">
      <div>
        <h1 className={pageTitle}>Settings</h1>
        <SettingsTabs current="users" />
      </div>

      <section aria-labelledby="members-heading">
        <h2 id="members-heading" className="text-base font-semibold">
          Members of {actor.organisationName} <span className="num font-normal text-ink-soft">({members.length})</span>
        </h2>
        <p className="mt-0.5 text-sm text-ink-soft">Roles apply to every site of the organisation. A person may hold several.</p>
        <div className="relative mt-3 overflow-x-auto border border-rule bg-white" role="region" aria-label="Members" tabIndex={0}>
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule bg-paper-deep text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th scope="col" className="px-3 py-2 font-medium">Member</th>
                <th scope="col" className="px-3 py-2 font-medium">Roles</th>
                <th scope="col" className="px-3 py-2 font-medium whitespace-nowrap">Member since</th>
                <th scope="col" className="px-3 py-2 font-medium whitespace-nowrap">Last signed in</th>
                <th scope="col" className="px-3 py-2 font-medium">Access</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-rule">
              {members.map((m) => (
                <tr key={m.userId} className="align-top">
                  <td className="px-3 py-2.5">
                    <div className="font-medium">
                      {m.name}
                      {m.userId === actor.userId ? <span className="ml-1.5 text-xs font-normal text-ink-soft">(you)</span> : null}
                    </div>
                    <div className="text-ink-soft">{m.email}</div>
                    {m.disabled ? (
                      <div className="mt-1 text-xs">
                        <Status tone="locked">Account disabled</Status>
                      </div>
                    ) : null}
                  </td>
                  <td className="px-3 py-2.5">
                    <MemberRolesForm userId={m.userId} name={m.name} roles={m.roles.filter(isRole)} />
                  </td>
                  <td className="num px-3 py-2.5 whitespace-nowrap text-ink-soft">{formatDate(m.since)}</td>
                  <td className="num px-3 py-2.5 whitespace-nowrap text-ink-soft">{m.lastSignIn ? formatDateTime(m.lastSignIn) : "never"}</td>
                  <td className="px-3 py-2.5">
                    {m.userId === actor.userId ? <span className="text-xs text-ink-soft">Your own account: see Your account</span> : <MemberAccessForm userId={m.userId} name={m.name} disabled={m.disabled} />}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>

      <section aria-labelledby="invite-heading" className="border border-rule bg-white px-4 py-4">
        <h2 id="invite-heading" className="mb-3 text-base font-semibold">
          Invite someone
        </h2>
        <InviteForm lifetimeHours={INVITATION_LIFETIME_HOURS} />
      </section>

      <section aria-labelledby="invitations-heading">
        <h2 id="invitations-heading" className="text-base font-semibold">
          Invitations
        </h2>
        {invitations.length === 0 ? (
          <p className="mt-1 text-sm text-ink-soft">No invitations sent yet. Invitations you send appear here with their state until they are used.</p>
        ) : (
          <div className="relative mt-3 overflow-x-auto border border-rule bg-white" role="region" aria-label="Invitations" tabIndex={0}>
            <table className="w-full text-left text-sm">
              <thead className="border-b border-rule bg-paper-deep text-xs uppercase tracking-wide text-ink-soft">
                <tr>
                  <th scope="col" className="px-3 py-2 font-medium">E-mail</th>
                  <th scope="col" className="px-3 py-2 font-medium">Roles</th>
                  <th scope="col" className="px-3 py-2 font-medium">State</th>
                  <th scope="col" className="px-3 py-2 font-medium">Sent</th>
                  <th scope="col" className="px-3 py-2 font-medium">Expires</th>
                  <th scope="col" className="px-3 py-2 font-medium"><span className="sr-only">Actions</span></th>
                </tr>
              </thead>
              <tbody className="divide-y divide-rule">
                {invitations.map((inv) => {
                  const status = invitationStatus(inv, now);
                  const s = INVITATION_STATUS[status];
                  return (
                    <tr key={inv.id} className="align-top">
                      <td className="px-3 py-2">{inv.email}</td>
                      <td className="px-3 py-2">{inv.roles.filter(isRole).map((r) => ROLE_LABELS[r]).join(", ")}</td>
                      <td className="px-3 py-2 whitespace-nowrap">
                        <Status tone={s.tone}>{s.label}</Status>
                      </td>
                      <td className="px-3 py-2 text-ink-soft">
                        <span className="num whitespace-nowrap">{formatDate(inv.createdAt)}</span>
                        {inv.invitedByName ? <span className="block text-xs">by {inv.invitedByName}</span> : null}
                      </td>
                      <td className="num px-3 py-2 whitespace-nowrap text-ink-soft">{formatDateTime(inv.expiresAt)}</td>
                      <td className="px-3 py-2 text-right">
                        {status === "pending" ? <RevokeInvitationForm invitationId={inv.id} email={inv.email} /> : null}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
