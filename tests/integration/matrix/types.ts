import type { Db } from "@/db/client";
import type { Role } from "@/lib/auth/roles";
import type { FixtureOrg } from "../../support/fixtures";

/** What a call came to, as far as access control is concerned. */
export type Outcome = "allowed" | "unauthorized" | "forbidden" | "not-found";

export interface MatrixContext {
  db: Db;
  /** The organisation whose records the call addresses. */
  target: FixtureOrg;
}

/**
 * One route handler method or server action. `id` is "METHOD /api/path" for route handlers
 * and "path/to/actions.ts#exportName" for server actions; the discovery test insists that
 * every one that exists has a row.
 */
export interface MatrixRow {
  id: string;
  /** Roles of the owning organisation that may call it; "public" needs no session at all. */
  allowed: readonly Role[] | "public";
  /** Makes the call as whoever the harness has signed in, addressing ctx.target's records. */
  call(ctx: MatrixContext): Promise<unknown>;
  /**
   * For calls that address no particular record (lists), how to tell that a member of another
   * organisation saw none of target's data. Without it, the cross-organisation call must be
   * refused (not found or forbidden).
   */
  crossOrgSeesNothing?(result: unknown, ctx: MatrixContext): boolean | Promise<boolean>;
  /** Machine tokens: "refused" (default) or "allowed". Filled for /api/v1 rows. */
  token?: "allowed" | "refused";
}

/** Reads an outcome off a Response or an action's result object. */
export async function outcomeOf(result: unknown): Promise<Outcome> {
  if (result instanceof Response) {
    if (result.status === 401) return "unauthorized";
    if (result.status === 403) return "forbidden";
    if (result.status === 404) return "not-found";
    return "allowed";
  }
  if (result && typeof result === "object" && "message" in result && (result as { ok?: boolean }).ok !== true) {
    const message = String((result as { message: unknown }).message);
    const errors = Object.values((result as { errors?: Record<string, string> }).errors ?? {}).join(" ");
    if (/^Sign in first/.test(message)) return "unauthorized";
    if (/^Your role does not allow/.test(message)) return "forbidden";
    if (/not found|not (a member|one) of your organisation/i.test(`${message} ${errors}`)) return "not-found";
  }
  return "allowed";
}

let bearer: string | null = null;

/** The harness sets a machine token here; every row's request then carries it. */
export function setMatrixBearer(token: string | null): void {
  bearer = token;
}

/** A Request as a row makes it, with the harness's bearer token when one is set. */
export function matrixRequest(url: string, init: RequestInit = {}): Request {
  const headers = new Headers(init.headers);
  if (bearer) headers.set("authorization", `Bearer ${bearer}`);
  return new Request(url, { ...init, headers });
}
