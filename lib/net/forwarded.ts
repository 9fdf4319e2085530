/**
 * Who is on the other end of a request. The socket's address is the only fact; X-Forwarded-For,
 * X-Forwarded-Host and X-Forwarded-Proto are claims anyone can type, believed only when the peer
 * that sent them is a proxy the operator named in TRUSTED_PROXY (addresses or CIDR blocks,
 * separated by commas or spaces). The app server (server.ts) applies this to every request before
 * Next.js sees it; the app then reads the client's address from one header only it sets.
 */
import { BlockList, isIP } from "node:net";

/** Set by server.ts on every request, after removing whatever the client sent under this name. */
export const CLIENT_ADDRESS_HEADER = "x-synledger-client-address";

/** Forwarding headers a client may not set unless its peer is trusted. */
export const FORWARDING_HEADERS = ["x-forwarded-for", "x-forwarded-host", "x-forwarded-proto", "x-forwarded-port", "x-real-ip", "forwarded"] as const;

export class TrustedProxyError extends Error {}

/** "::ffff:10.0.0.1" → "10.0.0.1": an IPv4 client on a dual-stack socket is still that IPv4 address. */
export function normaliseAddress(address: string): string {
  const a = address.trim().toLowerCase();
  return a.startsWith("::ffff:") && isIP(a.slice(7)) === 4 ? a.slice(7) : a;
}

export interface TrustedProxies {
  /** The entries as configured, for the start-up log. */
  entries: string[];
  has(address: string): boolean;
}

/** Reads TRUSTED_PROXY. An entry that is not an address or a CIDR block stops the server at start. */
export function parseTrustedProxies(spec: string | undefined): TrustedProxies {
  const list = new BlockList();
  const entries = (spec ?? "").split(/[\s,]+/).filter(Boolean);
  for (const entry of entries) {
    const [addr, bits, extra] = entry.split("/");
    const family = isIP(addr);
    const prefix = bits === undefined ? (family === 6 ? 128 : 32) : Number(bits);
    const max = family === 6 ? 128 : 32;
    if (family === 0 || extra !== undefined || !Number.isInteger(prefix) || prefix < 0 || prefix > max || (bits !== undefined && !/^\d{1,3}$/.test(bits))) {
      throw new TrustedProxyError(`TRUSTED_PROXY: "${entry}" is not an IP address or a CIDR block (e.g. 10.0.0.0/8, 192.0.2.7, fd00::/8)`);
    }
    list.addSubnet(addr, prefix, family === 6 ? "ipv6" : "ipv4");
  }
  return {
    entries,
    has(address: string) {
      const a = normaliseAddress(address);
      const family = isIP(a);
      return family !== 0 && list.check(a, family === 6 ? "ipv6" : "ipv4");
    },
  };
}

/**
 * The client's address. From an untrusted peer, the peer itself. From a trusted proxy, the
 * X-Forwarded-For chain is read right to left (each proxy appends the address it saw) and the
 * first address that is not itself a trusted proxy is the client; entries further left were
 * written by whoever the client is and prove nothing.
 */
export function clientAddress(peer: string, forwardedFor: string | undefined, trusted: TrustedProxies): string {
  const p = normaliseAddress(peer);
  if (!trusted.has(p) || !forwardedFor) return p;
  const hops = forwardedFor.split(",").map((h) => normaliseAddress(h)).filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) {
    if (isIP(hops[i]) === 0) return p; // a malformed hop: stop believing the chain
    if (!trusted.has(hops[i])) return hops[i];
  }
  return hops[0] ?? p;
}

type Headers = Record<string, string | string[] | undefined>;

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v.join(",") : v);

/**
 * Rewrites a Node request's headers in place: forwarding headers survive only from a trusted
 * peer, and the client's address goes into CLIENT_ADDRESS_HEADER (whatever the client sent
 * under that name is dropped first).
 */
export function applyForwarding(headers: Headers, peer: string | undefined, trusted: TrustedProxies): string {
  const peerAddress = peer ?? "unknown";
  const client = clientAddress(peerAddress, first(headers["x-forwarded-for"]), trusted);
  if (!trusted.has(peerAddress)) for (const h of FORWARDING_HEADERS) delete headers[h];
  headers[CLIENT_ADDRESS_HEADER] = client;
  return client;
}

/** The client's address as the app server recorded it; "local" when no app server set it (next dev, tests). */
export function clientAddressOf(headers: { get(name: string): string | null }): string {
  return headers.get(CLIENT_ADDRESS_HEADER)?.trim() || "local";
}
