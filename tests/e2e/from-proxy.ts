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

/**
 * A made-up client address from the benchmarking range 198.18.0.0/15 (RFC 2544), a new one each
 * call: a counter from a random start, so two checks never share an address by chance (with 250
 * random addresses they did about once in 250 runs, and a sign-in limit then fired early).
 */
let nextClient = randomBytes(2).readUInt16BE(0);
export const clientAddress = () => {
  const n = nextClient++ % 65_000;
  return `198.18.${n >> 8}.${1 + (n & 0xff) % 254}`;
};

/** fetch for a request carrying forwarding headers: through the proxy when it has any. */
export const fetchFor = (headers: Record<string, string>) => (Object.keys(headers).some((h) => h.startsWith("x-forwarded-")) ? proxyFetch : fetch);
