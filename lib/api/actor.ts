import "server-only";
import { getDb } from "@/db";
import { findActiveToken, touchApiToken } from "@/db/queries/api-tokens";
import { currentActor, type Actor } from "@/lib/auth/guard";
import { HttpError } from "@/lib/auth/errors";
import type { Editor } from "@/lib/ledger/save-month";
import type { Channel } from "@/db/queries/audit";
import { hashApiToken } from "./tokens";

/** A plant system holding a per-site token: it acts for its site only, under its label. */
export interface TokenActor {
  tokenId: string;
  organisationId: string;
  siteId: string;
  label: string;
  scope: string;
}

/** Who calls an API route: a signed-in person (cookie session) or a site's API token. */
export type ApiCaller =
  | { kind: "session"; organisationId: string; actor: Actor }
  | { kind: "token"; organisationId: string; token: TokenActor };

const BEARER = /^Bearer\s+(\S+)\s*$/i;

export const invalidToken = () =>
  new HttpError(401, "invalid_token", "This API token is unknown or has been revoked; ask an administrator for a new one.");

/**
 * The caller of a request. An Authorization header wins over the cookie: a plant system never
 * silently acts as whoever is signed in on the same machine, and a bad token is refused (401)
 * rather than falling back to the session.
 */
export async function apiActor(req: Request): Promise<ApiCaller | null> {
  const header = req.headers.get("authorization");
  if (header !== null) {
    const m = BEARER.exec(header);
    if (!m) throw new HttpError(401, "invalid_token", 'The Authorization header must read "Bearer <token>".');
    const db = getDb();
    const row = await findActiveToken(db, hashApiToken(m[1]));
    if (!row) throw invalidToken();
    await touchApiToken(db, row.id);
    return {
      kind: "token",
      organisationId: row.organisationId,
      token: { tokenId: row.id, organisationId: row.organisationId, siteId: row.siteId, label: row.label, scope: row.scope },
    };
  }
  const actor = await currentActor();
  return actor ? { kind: "session", organisationId: actor.organisationId, actor } : null;
}

/** The editor saveMonthFigures records: the person under the given channel, a token always as "api-token". */
export function editorOf(caller: ApiCaller, channel: Channel = "form"): Editor {
  if (caller.kind === "token") return { organisationId: caller.organisationId, userId: null, label: caller.token.label, channel: "api-token" };
  return { organisationId: caller.organisationId, userId: caller.actor.userId, label: caller.actor.name, channel };
}
