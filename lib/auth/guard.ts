import "server-only";
import { redirect } from "next/navigation";
import { cache } from "react";
import { NextResponse } from "next/server";
import { ZodError } from "zod";
import { getDb } from "@/db";
import { liveMembership, touchSession } from "@/db/queries/sessions";
import { HttpError, forbidden, unauthorized, zodIssues } from "./errors";
import { isRole, rolesGrant, type Permission, type Role } from "./roles";
import { sessionClaims } from "./session-token";
import { storageRefusal } from "./storage-refusal";

/** Who is acting, with the roles held in the active organisation as the database has them now. */
export interface Actor {
  userId: string;
  /** The user_sessions row of this sign-in. */
  sessionId: string;
  name: string;
  email: string;
  organisationId: string;
  organisationName: string;
  roles: Role[];
}

/**
 * The signed-in person, or null. The membership, the account and the session row are read again
 * from the database on every request, so a role taken away, a disabled account or a session
 * ended (sign-out, "sign out everywhere", a password change) lose access at once rather than
 * when the cookie expires. Cached per request: the layout and the page ask once between them.
 */
export const currentActor = cache(async (): Promise<Actor | null> => {
  const claims = await sessionClaims();
  if (!claims) return null;
  const db = getDb();
  const m = await liveMembership(db, claims.userId, claims.organisationId, claims.sessionId);
  if (!m) return null;
  const roles = m.roles.filter(isRole);
  if (roles.length === 0) return null;
  await touchSession(db, claims.sessionId, m.lastSeenAt);
  return {
    userId: claims.userId,
    sessionId: claims.sessionId,
    name: claims.name,
    email: claims.email,
    organisationId: claims.organisationId,
    organisationName: m.organisationName,
    roles,
  };
});

export function can(actor: Pick<Actor, "roles">, permission: Permission): boolean {
  return rolesGrant(actor.roles, permission);
}

/** Throws the HttpError a handler should answer with when the actor lacks the permission. */
export function assertCan(actor: Actor | null, permission: Permission, what: string): asserts actor is Actor {
  if (!actor) throw unauthorized();
  if (!can(actor, permission)) throw forbidden(what);
}

/** For pages and layouts: sends the signed-out to sign-in and the unauthorised to /forbidden. */
export async function requirePageActor(permission: Permission = "org:read"): Promise<Actor> {
  const actor = await currentActor();
  if (!actor) redirect("/sign-in");
  if (!can(actor, permission)) redirect(`/forbidden?need=${encodeURIComponent(permission)}`);
  return actor;
}

export function errorResponse(err: unknown): NextResponse {
  err = storageRefusal(err) ?? err;
  if (err instanceof HttpError) {
    return NextResponse.json(
      { error: { code: err.code, message: err.message, ...(err.issues.length ? { issues: err.issues } : {}) } },
      { status: err.status },
    );
  }
  if (err instanceof ZodError) {
    return NextResponse.json(
      { error: { code: "invalid_input", message: "The request body is not valid.", issues: zodIssues(err.issues) } },
      { status: 400 },
    );
  }
  console.error("[api] unexpected error:", err);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on our side; nothing was changed." } }, { status: 500 });
}

type RouteContext<P> = { params: Promise<P> };

/**
 * Wraps a route handler anyone may call without a session (public statement verification, the
 * health check): the same JSON errors as lib/api/route.ts's v1Route, no actor. The handler sees no organisation,
 * so it must answer from public facts only.
 */
export function publicRoute<P = Record<string, string>>(handler: (req: Request, params: P) => Promise<Response>) {
  const route = async (req: Request, ctx: RouteContext<P>): Promise<Response> => {
    try {
      return await handler(req, await ctx.params);
    } catch (err) {
      return errorResponse(err);
    }
  };
  // Marked so the cross-site tests know this handler reads no session and changes no record.
  return Object.assign(route, { [PUBLIC_ROUTE]: true as const });
}

/** The mark publicRoute leaves on its handler. */
export const PUBLIC_ROUTE = Symbol.for("synledger.public-route");

export function isPublicRoute(handler: unknown): boolean {
  return typeof handler === "function" && (handler as unknown as Record<symbol, unknown>)[PUBLIC_ROUTE] === true;
}

export type ActionResult<T = undefined> =
  | { ok: true; message?: string; data?: T }
  | { ok: false; message: string; errors?: Record<string, string> };

/** Wraps a server action with the same checks; errors come back as a typed result, not a throw. */
export async function guardedAction<T>(
  permission: Permission,
  what: string,
  run: (actor: Actor) => Promise<ActionResult<T>>,
): Promise<ActionResult<T>> {
  try {
    const actor = await currentActor();
    assertCan(actor, permission, what);
    return await run(actor);
  } catch (caught) {
    const err = storageRefusal(caught) ?? caught;
    if (err instanceof HttpError) {
      const errors = Object.fromEntries(err.issues.map((i) => [i.path, i.message]));
      return { ok: false, message: err.message, ...(err.issues.length ? { errors } : {}) };
    }
    if (err instanceof ZodError) {
      const errors = Object.fromEntries(zodIssues(err.issues).map((i) => [i.path, i.message]));
      return { ok: false, message: "Some fields need attention.", errors };
    }
    throw err;
  }
}
