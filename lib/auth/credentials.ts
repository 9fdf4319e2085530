import type { Db } from "@/db/client";
import { findUserByEmail, membershipsOf, recordSignInAttempt, signInBlocked } from "@/db/queries/users";
import { verifyPassword } from "./password";
import { isRole, type Role } from "./roles";

export type SignInRefusal = "bad-credentials" | "rate-limited" | "no-role" | "disabled";

export interface SignedInUser {
  id: string;
  name: string;
  email: string;
  organisationId: string;
  organisationName: string;
  roles: Role[];
}

/**
 * Checks an e-mail and password. Wrong password and unknown e-mail are refused alike so the
 * answer does not tell which addresses exist; failures count towards the rate limit.
 */
export async function authenticate(
  db: Db,
  email: string,
  password: string,
  ip: string,
): Promise<{ ok: true; user: SignedInUser } | { ok: false; reason: SignInRefusal }> {
  const normalised = email.trim().toLowerCase();
  if (await signInBlocked(db, normalised, ip)) return { ok: false, reason: "rate-limited" };
  const user = await findUserByEmail(db, normalised);
  const ok = await verifyPassword(password, user?.passwordHash);
  await recordSignInAttempt(db, normalised, ip, Boolean(user && ok));
  if (!user || !ok) return { ok: false, reason: "bad-credentials" };
  if (user.disabled) return { ok: false, reason: "disabled" };
  const first = (await membershipsOf(db, user.id)).find((m) => m.roles.some(isRole));
  if (!first) return { ok: false, reason: "no-role" };
  return {
    ok: true,
    user: {
      id: user.id,
      name: user.name,
      email: user.email,
      organisationId: first.organisationId,
      organisationName: first.organisationName,
      roles: first.roles.filter(isRole),
    },
  };
}
