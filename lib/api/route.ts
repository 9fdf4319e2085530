import "server-only";
import { assertCan, errorResponse, type Actor } from "@/lib/auth/guard";
import { HttpError, unauthorized } from "@/lib/auth/errors";
import type { Permission } from "@/lib/auth/roles";
import { assertSameOrigin } from "@/lib/auth/same-origin";
import { apiActor, type ApiCaller } from "./actor";

/**
 * What a site's API token may do on a route. Tokens exist so plant systems can deliver meter
 * totals; anything more (reading months, results, other sites) needs a person signed in.
 */
export type TokenAccess = "read-streams" | "write-readings";

export interface RouteRule {
  permission: Permission;
  /** Completes "Your role does not allow you to …". */
  what: string;
  /** Leave out to refuse tokens on the route. */
  token?: TokenAccess;
}

export const TOKEN_LIMIT_MESSAGE = "API tokens are limited to writing readings of their own site (and reading that site's streams)";

export const tokenRefused = (detail: string) => new HttpError(403, "token_scope", `${TOKEN_LIMIT_MESSAGE}; ${detail}.`);

type RouteContext<P> = { params: Promise<P> };

/**
 * The person calling a route whose rule admits no token: v1Route has already refused tokens
 * there, so this only narrows the type (and refuses again, should a rule ever change).
 */
export function personOf(caller: ApiCaller): Actor {
  if (caller.kind !== "session") throw tokenRefused("sign in as a person");
  return caller.actor;
}

function checkToken(caller: Extract<ApiCaller, { kind: "token" }>, rule: RouteRule, params: Record<string, string | undefined>) {
  if (!rule.token) throw tokenRefused(`sign in as a person to ${rule.what}`);
  if (rule.token === "write-readings" && caller.token.scope !== "readings:write") throw tokenRefused("this token may not write");
  // Compared as text, before any lookup, so a token learns nothing about sites that are not its own.
  if (params.siteId !== caller.token.siteId) throw tokenRefused("this token belongs to another site");
}

/**
 * Wraps a /api/v1 handler: works out the caller (session or bearer token), answers 401/403 in
 * the one error body, applies the token rules, and turns thrown errors into JSON. The handler
 * must still scope every query to `caller.organisationId`.
 */
export function v1Route<P extends Record<string, string> = Record<string, string>>(
  rule: RouteRule,
  handler: (req: Request, caller: ApiCaller, params: P) => Promise<Response>,
) {
  return async (req: Request, ctx: RouteContext<P>): Promise<Response> => {
    try {
      const caller = await apiActor(req);
      if (!caller) throw unauthorized();
      const params = await ctx.params;
      if (caller.kind === "token") checkToken(caller, rule, params);
      else {
        assertCan(caller.actor, rule.permission, rule.what);
        // A cookie rides along with cross-site requests; a bearer token never does, so only sessions are checked.
        assertSameOrigin(req);
      }
      return await handler(req, caller, params);
    } catch (err) {
      const res = errorResponse(err);
      if (res.status === 401) res.headers.set("WWW-Authenticate", 'Bearer realm="synledger"');
      return res;
    }
  };
}
