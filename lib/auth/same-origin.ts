import { HttpError } from "./errors";
import { env } from "@/lib/env";

/**
 * Cross-site request forgery guard for route handlers that a session cookie authenticates.
 * Server actions already get Next's own Origin check; route handlers do not, and a session
 * cookie is SameSite=Lax, which still rides along on some cross-site requests (top-level POST
 * navigations in older browsers, same-site sibling hosts). So a mutation must come from a page
 * of this app.
 *
 * The rule, in order:
 *  - GET, HEAD and OPTIONS are never checked: they change nothing.
 *  - An `Origin` header must name this host (Host / X-Forwarded-Host, the request URL's host, or
 *    APP_URL / AUTH_URL's host). `Origin: null` (sandboxed frames, privacy redirects) is refused.
 *  - Without Origin, `Sec-Fetch-Site` must be `same-origin` (or `none`: typed by the user).
 *  - With neither header the caller is not a browser (curl, a plant system, a test): every
 *    browser of the last years sends Origin on a cross-site POST/PUT/DELETE, so there is no
 *    cookie-riding request to refuse, and scripts keep working.
 * Bearer-token requests are exempt by the callers of this check: they carry no ambient credential.
 */
const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export const CROSS_SITE_MESSAGE =
  "This request came from another site, so it was refused: changes can only be made from Synledger's own pages (or with an API token).";

export const crossSiteRefused = () => new HttpError(403, "cross_site_request", CROSS_SITE_MESSAGE);

function hostOf(url: string | undefined | null): string | null {
  if (!url) return null;
  try {
    return new URL(url).host.toLowerCase();
  } catch {
    return null;
  }
}

/** Hosts this request may legitimately come from: the one it was sent to, and the configured public one. */
function ownHosts(req: Request): Set<string> {
  const hosts = new Set<string>();
  const add = (h: string | null | undefined) => {
    const v = h?.split(",")[0]?.trim().toLowerCase();
    if (v) hosts.add(v);
  };
  add(req.headers.get("x-forwarded-host"));
  add(req.headers.get("host"));
  add(hostOf(req.url));
  add(hostOf(env().APP_URL));
  add(hostOf(env().AUTH_URL));
  return hosts;
}

/** Null when the request may go on; otherwise why it looks cross-site (for logs and tests). */
export function crossSiteReason(req: Request): string | null {
  if (SAFE_METHODS.has(req.method.toUpperCase())) return null;
  const origin = req.headers.get("origin");
  if (origin !== null) {
    const host = origin === "null" ? null : hostOf(origin);
    if (host && ownHosts(req).has(host)) return null;
    return `Origin ${origin} is not this site`;
  }
  const site = req.headers.get("sec-fetch-site");
  if (site === null || site === "same-origin" || site === "none") return null;
  return `Sec-Fetch-Site is ${site}`;
}

/** Throws 403 cross_site_request for a cookie-authenticated mutation from another site. */
export function assertSameOrigin(req: Request): void {
  if (crossSiteReason(req) !== null) throw crossSiteRefused();
}
