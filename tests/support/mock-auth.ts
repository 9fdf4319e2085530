/**
 * Stand-in for `@/auth` and for the guard's cookie reader (`@/lib/auth/session-token`) in
 * integration tests: both answer with the session the test chose with `actAs()`. Everything below
 * them (guard, membership re-check, queries) is the real code against the real PostgreSQL; the
 * cookie reader itself is tested in tests/integration/session-token.test.ts.
 */
import type { Session } from "next-auth";
import type { SessionClaims } from "@/lib/auth/session-token";

let current: Session | null = null;

export function actAs(session: Session | null): void {
  current = session;
}

export async function auth(): Promise<Session | null> {
  return current;
}

export async function sessionClaims(): Promise<SessionClaims | null> {
  const u = current?.user;
  if (!u?.id || !u.organisationId || !u.sessionId) return null;
  return { userId: u.id, sessionId: u.sessionId, organisationId: u.organisationId, name: u.name ?? u.email ?? "", email: u.email ?? "" };
}

export async function signIn(): Promise<never> {
  throw new Error("signIn is not available in integration tests");
}

export async function signOut(): Promise<void> {
  current = null;
}

export const handlers = {
  GET: async () => new Response(null, { status: 404 }),
  POST: async () => new Response(null, { status: 404 }),
};
