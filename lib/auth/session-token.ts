import "server-only";
import { headers } from "next/headers";
import { decode, getToken, type JWT } from "next-auth/jwt";
import { env } from "@/lib/env";
import { boundedCache } from "@/lib/memo";

/** The claims our jwt callback (auth.config.ts) writes into the session cookie. */
export interface SessionClaims {
  userId: string;
  sessionId: string;
  organisationId: string;
  name: string;
  email: string;
}

/** Auth.js's cookie names: the `__Secure-` one is what it sets over HTTPS. */
const COOKIE_NAMES = ["__Secure-authjs.session-token", "authjs.session-token"] as const;

/**
 * Decoded cookies by their exact text. Decoding derives the key (HKDF) and decrypts the JWE again,
 * about a millisecond each time; the same cookie text always decodes to the same claims, so a
 * token already opened is looked up instead (its expiry still checked on every use). Whether the
 * session may still act is not cached: the guard asks the database on every request.
 */
const memo = boundedCache<JWT>("session-claims", 2_000);

async function memoDecode(params: Parameters<typeof decode>[0]): Promise<JWT | null> {
  const key = `${params.salt}\u0000${params.token}`;
  const hit = memo.get(key);
  if (hit) return hit;
  const claims = await decode(params);
  if (!claims) return null;
  memo.set(key, claims);
  return claims;
}

function unexpired(claims: JWT | null): claims is JWT {
  return !!claims && typeof claims.exp === "number" && claims.exp * 1000 > Date.now();
}

/**
 * The session cookie's claims, or null when there is no cookie, it does not decode with
 * AUTH_SECRET, it has expired, or it lacks the ids the guard needs. Reads the cookie only: an
 * Authorization header is the API token's business (lib/api/actor.ts), never a session.
 *
 * Why not `auth()`: in a route handler or a page it runs the whole Auth.js session action (a
 * Request built, the cookie decoded and a refreshed one encoded) for the few claims we read; the
 * pages' proxy still refreshes the cookie as Auth.js does.
 */
export async function sessionClaims(): Promise<SessionClaims | null> {
  // The request's headers first, whatever happens next: reading them is what tells Next that a
  // page depends on who asks. Returning before it (no secret at build time) would let the build
  // render a signed-in page once, as a redirect to sign-in, and serve that to everyone.
  const cookie = (await headers()).get("cookie");
  const secret = env().AUTH_SECRET;
  if (!cookie || !secret) return null;
  const req = { headers: new Headers({ cookie }) };
  for (const cookieName of COOKIE_NAMES) {
    const claims = await getToken({ req, secret, cookieName, salt: cookieName, secureCookie: cookieName.startsWith("__Secure-"), decode: memoDecode, logger: quiet });
    if (!unexpired(claims)) continue;
    const { userId, sessionId, organisationId } = claims;
    if (typeof userId !== "string" || typeof sessionId !== "string" || typeof organisationId !== "string") return null;
    return { userId, sessionId, organisationId, name: claims.name ?? claims.email ?? "", email: claims.email ?? "" };
  }
  return null;
}

/** A cookie that does not decode is simply no session; Auth.js's logger would print it as an error. */
const quiet = { error: () => undefined, warn: () => undefined, debug: () => undefined };
