/**
 * Stand-in for `@/auth` in integration tests: `auth()` returns the session the test chose with
 * `actAs()`. Everything below it (guard, membership re-check, queries) is the real code against
 * the real PostgreSQL.
 */
import type { Session } from "next-auth";

let current: Session | null = null;

export function actAs(session: Session | null): void {
  current = session;
}

export async function auth(): Promise<Session | null> {
  return current;
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
