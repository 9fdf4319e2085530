import type { Db } from "@/db/client";
import { openSession } from "@/db/queries/sessions";
import { findUserByEmail, membershipsOf, recordSignInAttempt, signInFailureCounts } from "@/db/queries/users";
import { failedSignInsMail } from "@/lib/mail/account-mail";
import { enqueueMail } from "@/lib/mail/outbox";
import { verifyPassword } from "./password";
import { isRole, type Role } from "./roles";
import { isNoticeFailure, SIGN_IN_WINDOW_MINUTES, signInVerdict } from "./sign-in-policy";

export type SignInRefusal = "bad-credentials" | "rate-limited" | "no-role" | "disabled";

export interface SignedInUser {
  id: string;
  sessionId: string;
  name: string;
  email: string;
  organisationId: string;
  organisationName: string;
  roles: Role[];
}

export interface AttemptContext {
  /** The client's address as the app server established it (lib/net/forwarded.ts). */
  address: string;
  userAgent?: string;
  /** How to wait; tests pass one that records the delay instead of sleeping. */
  sleep?: (ms: number) => Promise<void>;
}

const realSleep = (ms: number) => new Promise<void>((r) => setTimeout(r, ms));

/**
 * Checks a password, with the throttling of lib/auth/sign-in-policy.ts. Wrong password and
 * unknown e-mail are refused alike so the answer does not tell which addresses exist. Every
 * check of a password, wherever it happens (sign-in, accepting an invitation), goes through here.
 */
export async function checkPassword(db: Db, email: string, password: string, ctx: AttemptContext) {
  const normalised = email.trim().toLowerCase();
  const verdict = signInVerdict(await signInFailureCounts(db, normalised, ctx.address));
  if (verdict.refuse) return { ok: false as const, reason: "rate-limited" as const };
  if (verdict.delayMs > 0) await (ctx.sleep ?? realSleep)(verdict.delayMs);
  const user = await findUserByEmail(db, normalised);
  // Checked even for an unknown e-mail, so the time taken does not tell which addresses exist.
  const matches = await verifyPassword(password, user?.passwordHash);
  const ok = Boolean(user) && matches;
  await recordSignInAttempt(db, normalised, ctx.address, ok);
  if (!user || !ok) {
    if (user) {
      const after = await signInFailureCounts(db, normalised, ctx.address);
      if (isNoticeFailure(after.account)) {
        await enqueueMail(db, failedSignInsMail({ to: user.email, name: user.name, failures: after.account, addresses: after.addresses, windowMinutes: SIGN_IN_WINDOW_MINUTES }));
      }
    }
    return { ok: false as const, reason: "bad-credentials" as const };
  }
  return { ok: true as const, user };
}

/** A sign-in: the password check, then the account and its first organisation with a role; opens the session row. */
export async function authenticate(
  db: Db,
  email: string,
  password: string,
  ctx: AttemptContext,
): Promise<{ ok: true; user: SignedInUser } | { ok: false; reason: SignInRefusal }> {
  const checked = await checkPassword(db, email, password, ctx);
  if (!checked.ok) return checked;
  const user = checked.user;
  if (user.disabled) return { ok: false, reason: "disabled" };
  const first = (await membershipsOf(db, user.id)).find((m) => m.roles.some(isRole));
  if (!first) return { ok: false, reason: "no-role" };
  const sessionId = await openSession(db, user.id, ctx.address, ctx.userAgent ?? "");
  return {
    ok: true,
    user: {
      id: user.id,
      sessionId,
      name: user.name,
      email: user.email,
      organisationId: first.organisationId,
      organisationName: first.organisationName,
      roles: first.roles.filter(isRole),
    },
  };
}
