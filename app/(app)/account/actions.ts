"use server";

import { eq } from "drizzle-orm";
import { headers } from "next/headers";
import { revalidatePath } from "next/cache";
import { signOut } from "@/auth";
import { getDb } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { endSession, endSessionsOf } from "@/db/queries/sessions";
import { users } from "@/db/schema";
import { checkPassword } from "@/lib/auth/credentials";
import { guardedAction, type ActionResult } from "@/lib/auth/guard";
import { hashPassword, passwordProblems } from "@/lib/auth/password";
import { changePasswordSchema, endSessionSchema } from "@/lib/validations/account";
import { formFields } from "@/lib/validations/members";
import { clientAddressOf } from "@/lib/net/forwarded";

const PAGE = "/account";

/**
 * Changes one's own password after checking the current one (throttled like a sign-in). Every
 * session of the account ends, this one included, so whoever held a copy of a cookie is out; the
 * holder signs in again with the new password.
 */
export async function changePassword(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction("org:read", "change your password", async (actor): Promise<ActionResult> => {
    const input = changePasswordSchema.parse(formFields(formData));
    const h = await headers();
    const db = getDb();
    const checked = await checkPassword(db, actor.email, input.current, { address: clientAddressOf(h), userAgent: h.get("user-agent") ?? "" });
    if (!checked.ok) {
      const message = checked.reason === "rate-limited" ? "Too many unsuccessful attempts. Wait about 15 minutes before trying again." : "That is not your current password.";
      return { ok: false, message, errors: { current: message } };
    }
    const problems = passwordProblems(input.password, actor.email);
    if (problems.length) {
      const message = `Choose a stronger password: ${problems.join("; ")}.`;
      return { ok: false, message, errors: { password: message } };
    }
    const passwordHash = await hashPassword(input.password);
    await db.transaction(async (tx) => {
      await tx.update(users).set({ passwordHash }).where(eq(users.id, actor.userId));
      const ended = await endSessionsOf(tx, actor.userId, "password-changed");
      await recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.userId,
        actorLabel: actor.name,
        channel: "form",
        action: "user.password-changed",
        entity: "user",
        entityId: actor.userId,
        after: { sessionsEnded: ended },
      });
    });
    return { ok: true, message: "Password changed." };
  });
  if (result.ok) await signOut({ redirectTo: "/sign-in?notice=password-changed" });
  return result;
}

/** Ends every session of the account, this one included. */
export async function signOutEverywhere(_prev: ActionResult | null, _formData: FormData): Promise<ActionResult> {
  const result = await guardedAction("org:read", "end your sessions", async (actor): Promise<ActionResult> => {
    await getDb().transaction(async (tx) => {
      const ended = await endSessionsOf(tx, actor.userId, "signed-out-everywhere");
      await recordAudit(tx, {
        organisationId: actor.organisationId,
        actorUserId: actor.userId,
        actorLabel: actor.name,
        channel: "form",
        action: "user.signed-out-everywhere",
        entity: "user",
        entityId: actor.userId,
        after: { sessionsEnded: ended },
      });
    });
    return { ok: true };
  });
  if (result.ok) await signOut({ redirectTo: "/sign-in?notice=signed-out-everywhere" });
  return result;
}

/** Ends one other session of one's own (a browser left signed in elsewhere). */
export async function endOneSession(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await guardedAction("org:read", "end your sessions", async (actor): Promise<ActionResult> => {
    const { sessionId } = endSessionSchema.parse(formFields(formData));
    if (sessionId === actor.sessionId) return { ok: false, message: "This is the session you are using; sign out instead." };
    const ended = await endSession(getDb(), actor.userId, sessionId, "ended-by-holder");
    return ended ? { ok: true, message: "That session has ended." } : { ok: false, message: "That session had already ended; reload the page." };
  });
  if (result.ok) revalidatePath(PAGE);
  return result;
}
