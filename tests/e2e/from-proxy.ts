/**
 * Requests as a reverse proxy would send them. The test app trusts forwarding headers from
 * 127.0.0.2 only (TRUSTED_PROXY in scripts/test.sh); a connection from 127.0.0.1 is an ordinary
 * client whose X-Forwarded-* headers the server drops. On Linux every 127.x address is loopback,
 * so binding the connection's local end to 127.0.0.2 is all "being the proxy" takes.
 */
import { randomBytes } from "node:crypto";
import { Agent, fetch as undiciFetch } from "undici";

export const PROXY_ADDRESS = "127.0.0.2";
const proxyAgent = new Agent({ localAddress: PROXY_ADDRESS });

/** fetch through the trusted proxy address; the caller sets X-Forwarded-For and friends. */
export const proxyFetch = (url: string, init: RequestInit = {}): Promise<Response> =>
  undiciFetch(url, { ...(init as Record<string, unknown>), dispatcher: proxyAgent }) as unknown as Promise<Response>;

/** A made-up client address from the documentation range (RFC 5737), different each call. */
export const clientAddress = () => `198.51.100.${1 + (randomBytes(1)[0] % 250)}`;

/** fetch for a request carrying forwarding headers: through the proxy when it has any. */
export const fetchFor = (headers: Record<string, string>) => (Object.keys(headers).some((h) => h.startsWith("x-forwarded-")) ? proxyFetch : fetch);
