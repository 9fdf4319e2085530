/**
 * The guard's reader of the Auth.js session cookie (lib/auth/session-token.ts), with real
 * cookies encoded by Auth.js's own `encode` (next-auth/jwt) and the AUTH_SECRET of the test run.
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { encode } from "next-auth/jwt";
import { setRequestHeaders } from "../support/next-headers";

vi.unmock("@/lib/auth/session-token");
const { sessionClaims } = await import("@/lib/auth/session-token");

const secret = process.env.AUTH_SECRET!;
const claims = {
  userId: "7d1c2a5e-0b7b-4a39-9a63-3f8f3c0b2e11",
  sessionId: "0e9b7f52-5d0c-4f4e-8b39-2a7f3e1d9c44",
  organisationId: "c2a4d7e1-6b3f-4c8e-9d2a-1f5e7b9c3a66",
  organisationName: "Test Organisation",
  roles: ["engineer" as const],
  name: "Ada Tester",
  email: "ada@example.test",
};
const PLAIN = "authjs.session-token";
const SECURE = "__Secure-authjs.session-token";

async function cookieFor(name: string, opts: { secret?: string; salt?: string; maxAge?: number; token?: Record<string, unknown> } = {}) {
  const value = await encode({ token: opts.token ?? claims, secret: opts.secret ?? secret, salt: opts.salt ?? name, maxAge: opts.maxAge });
  return `${name}=${value}`;
}

afterEach(() => {
  setRequestHeaders(null);
  vi.useRealTimers();
});

describe("sessionClaims reads the session cookie Auth.js wrote", () => {
  it("answers the ids, name and e-mail of a cookie set over HTTP", async () => {
    setRequestHeaders({ cookie: `other=1; ${await cookieFor(PLAIN)}` });
    expect(await sessionClaims()).toEqual({
      userId: claims.userId,
      sessionId: claims.sessionId,
      organisationId: claims.organisationId,
      name: "Ada Tester",
      email: "ada@example.test",
    });
  });

  it("reads the __Secure- cookie Auth.js sets over HTTPS", async () => {
    setRequestHeaders({ cookie: await cookieFor(SECURE) });
    expect((await sessionClaims())?.sessionId).toBe(claims.sessionId);
  });

  it("answers the same claims again from its memo, and none once the cookie has expired", async () => {
    vi.useFakeTimers({ toFake: ["Date"], now: new Date("2026-12-03T10:00:00Z") });
    setRequestHeaders({ cookie: await cookieFor(PLAIN, { maxAge: 60 }) });
    expect((await sessionClaims())?.userId).toBe(claims.userId);
    expect((await sessionClaims())?.userId).toBe(claims.userId);
    vi.setSystemTime(new Date("2026-12-03T10:01:01Z"));
    expect(await sessionClaims()).toBeNull();
  });

  it("refuses a cookie sealed with another secret", async () => {
    setRequestHeaders({ cookie: await cookieFor(PLAIN, { secret: "another-secret-of-sufficient-length-0123456789" }) });
    expect(await sessionClaims()).toBeNull();
  });

  it("refuses a token moved from one cookie name to the other (the name is the key's salt)", async () => {
    const moved = (await cookieFor(PLAIN)).replace(`${PLAIN}=`, `${SECURE}=`);
    setRequestHeaders({ cookie: moved });
    expect(await sessionClaims()).toBeNull();
  });

  it("refuses a cookie without the ids the guard needs", async () => {
    setRequestHeaders({ cookie: await cookieFor(PLAIN, { token: { name: "No Ids", email: "x@example.test" } }) });
    expect(await sessionClaims()).toBeNull();
  });

  it("never takes a session from an Authorization header (that is the API token's header)", async () => {
    const value = (await cookieFor(PLAIN)).slice(PLAIN.length + 1);
    setRequestHeaders({ authorization: `Bearer ${value}` });
    expect(await sessionClaims()).toBeNull();
  });

  it("treats a cookie that is not a token as no session, quietly", async () => {
    const errors = vi.spyOn(console, "error");
    setRequestHeaders({ cookie: `${PLAIN}=not-a-token; ${SECURE}=eyJ.also.not.a.token` });
    expect(await sessionClaims()).toBeNull();
    expect(errors).not.toHaveBeenCalled();
    errors.mockRestore();
  });
});
