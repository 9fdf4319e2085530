import { randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { invitations, userSessions } from "@/db/schema";
import { ROLES } from "@/lib/auth/roles";
import { newInvitationToken } from "@/db/queries/invitations";
import type { MatrixContext, MatrixRow } from "./types";

const form = (fields: Record<string, string | string[]>) => {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) for (const x of [v].flat()) fd.append(k, x);
  return fd;
};

/** Server actions of the foundation: sign-in, sign-out, users and invitations. */
export const foundationRows: MatrixRow[] = [
  {
    id: "app/(auth)/sign-in/actions.ts#signInAction",
    allowed: "public",
    async call() {
      const { signInAction } = await import("@/app/(auth)/sign-in/actions");
      return signInAction({}, form({ email: "", password: "" }));
    },
  },
  {
    id: "app/(app)/actions.ts#signOutAction",
    allowed: "public",
    async call() {
      const { signOutAction } = await import("@/app/(app)/actions");
      return signOutAction();
    },
  },
  {
    id: "app/invitations/[token]/actions.ts#acceptInvitation",
    allowed: "public",
    async call() {
      const { acceptInvitation } = await import("@/app/invitations/[token]/actions");
      return acceptInvitation({}, form({ token: "no-such-token", name: "X", password: "x", confirm: "x" }));
    },
  },
  {
    id: "app/(app)/settings/users/actions.ts#changeMemberRoles",
    allowed: ["administrator"],
    async call({ target }) {
      const { changeMemberRoles } = await import("@/app/(app)/settings/users/actions");
      return changeMemberRoles(null, form({ userId: target.members.auditor.id, roles: ["auditor", "signatory"] }));
    },
  },
  {
    id: "app/(app)/settings/users/actions.ts#inviteMember",
    allowed: ["administrator"],
    async call({ target }) {
      const { inviteMember } = await import("@/app/(app)/settings/users/actions");
      const email = `invitee-${randomUUID().slice(0, 8)}@fixture.example`;
      const result = await inviteMember(null, form({ email, roles: ["auditor"] }));
      return Object.assign({}, result, { email, targetId: target.id });
    },
    // An invitation is always made in the inviter's own organisation: none may appear in target's.
    async crossOrgSeesNothing(result, { db, target }) {
      const { email } = result as { email: string };
      const rows = await db.select().from(invitations).where(and(eq(invitations.organisationId, target.id), eq(invitations.email, email)));
      return rows.length === 0;
    },
  },
  {
    id: "app/(app)/settings/users/actions.ts#revokeMemberInvitation",
    allowed: ["administrator"],
    async call({ db, target }) {
      const { revokeMemberInvitation } = await import("@/app/(app)/settings/users/actions");
      const [inv] = await db
        .insert(invitations)
        .values({
          organisationId: target.id,
          email: `pending-${randomUUID().slice(0, 8)}@fixture.example`,
          roles: ["auditor"],
          tokenHash: newInvitationToken().tokenHash,
          expiresAt: new Date(Date.now() + 3_600_000),
        })
        .returning();
      return revokeMemberInvitation(null, form({ invitationId: inv.id }));
    },
  },
  {
    id: "app/(app)/settings/users/actions.ts#setMemberAccess",
    allowed: ["administrator"],
    async call({ target }) {
      const { setMemberAccess } = await import("@/app/(app)/settings/users/actions");
      return setMemberAccess(null, form({ userId: target.members.auditor.id, access: "disable" }));
    },
  },
  {
    id: "app/(app)/settings/users/actions.ts#removeMember",
    allowed: ["administrator"],
    async call({ target }) {
      const { removeMember } = await import("@/app/(app)/settings/users/actions");
      return removeMember(null, form({ userId: target.members.auditor.id }));
    },
  },
  {
    id: "app/(app)/account/actions.ts#changePassword",
    allowed: ROLES,
    async call() {
      const { changePassword } = await import("@/app/(app)/account/actions");
      return changePassword(null, form({ current: "Not#TheCurrent0ne", password: "Another#Passw0rd-9", confirm: "Another#Passw0rd-9" }));
    },
    crossOrgSeesNothing: (_r, { db, target }) => sessionsIntact(db, target),
  },
  {
    id: "app/(app)/account/actions.ts#signOutEverywhere",
    allowed: ROLES,
    async call() {
      const { signOutEverywhere } = await import("@/app/(app)/account/actions");
      return signOutEverywhere(null, form({}));
    },
    crossOrgSeesNothing: (_r, { db, target }) => sessionsIntact(db, target),
  },
  {
    id: "app/(app)/account/actions.ts#endOneSession",
    allowed: ROLES,
    async call({ target }) {
      const { endOneSession } = await import("@/app/(app)/account/actions");
      return endOneSession(null, form({ sessionId: target.members.auditor.sessionId }));
    },
    // Only one's own sessions can be ended: target's stay open whoever asks.
    crossOrgSeesNothing: (_r, { db, target }) => sessionsIntact(db, target),
  },
];

/** True when no session of the target organisation's members has been ended. */
async function sessionsIntact(db: MatrixContext["db"], target: MatrixContext["target"]): Promise<boolean> {
  const ids = Object.values(target.members).map((m) => m.sessionId);
  const rows = await db.select({ endedAt: userSessions.endedAt }).from(userSessions).where(inArray(userSessions.id, ids));
  return rows.length === ids.length && rows.every((r) => r.endedAt === null);
}
