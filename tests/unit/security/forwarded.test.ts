/**
 * Who the client is (lib/net/forwarded.ts). The reading of X-Forwarded-For right to left, each
 * proxy appending the address it saw, is the header's de-facto definition (MDN, "X-Forwarded-For":
 * "the rightmost IP address is the IP address of the most recent proxy"); RFC 7239 section 5.2
 * describes the same order for its Forwarded header.
 */
import { describe, expect, it } from "vitest";
import { applyForwarding, CLIENT_ADDRESS_HEADER, clientAddress, parseTrustedProxies, TrustedProxyError } from "@/lib/net/forwarded";

describe("TRUSTED_PROXY", () => {
  it("reads addresses and CIDR blocks of both families, separated by commas or spaces", () => {
    const t = parseTrustedProxies("10.0.0.0/8, 192.0.2.7 fd00::/8");
    expect(t.has("10.200.3.4")).toBe(true);
    expect(t.has("192.0.2.7")).toBe(true);
    expect(t.has("192.0.2.8")).toBe(false);
    expect(t.has("fd12::1")).toBe(true);
    expect(t.has("::ffff:10.1.1.1")).toBe(true); // an IPv4 peer on a dual-stack socket
    expect(t.has("not an address")).toBe(false);
  });

  it.each(["10.0.0.0/33", "10.0.0.0/8/1", "proxy.internal", "10.0.0.0/x", "::1/129"])("stops at start for %s", (bad) => {
    expect(() => parseTrustedProxies(bad)).toThrow(TrustedProxyError);
  });

  it("unset trusts nobody", () => {
    expect(parseTrustedProxies(undefined).has("127.0.0.1")).toBe(false);
  });
});

describe("client address", () => {
  const trusted = parseTrustedProxies("10.0.0.0/8");

  it("from an untrusted peer is the peer, whatever X-Forwarded-For says", () => {
    expect(clientAddress("198.51.100.7", "203.0.113.1", trusted)).toBe("198.51.100.7");
  });

  it("from a trusted proxy is the rightmost address that is not a trusted proxy", () => {
    expect(clientAddress("10.0.0.2", "203.0.113.66, 198.51.100.7", trusted)).toBe("198.51.100.7");
    expect(clientAddress("10.0.0.2", "198.51.100.7, 10.0.0.9", trusted)).toBe("198.51.100.7");
  });

  it("a malformed hop ends belief in the chain: the proxy itself is the answer", () => {
    expect(clientAddress("10.0.0.2", "198.51.100.7, <script>", trusted)).toBe("10.0.0.2");
  });

  it("a request rewritten for an untrusted peer keeps no forwarding header, and the client's own marker is replaced", () => {
    const headers: Record<string, string | string[] | undefined> = {
      "x-forwarded-for": "203.0.113.1",
      "x-forwarded-host": "evil.example",
      "x-forwarded-proto": "https",
      "x-real-ip": "203.0.113.2",
      forwarded: "for=203.0.113.3",
      [CLIENT_ADDRESS_HEADER]: "203.0.113.4",
      host: "ledger.example",
    };
    applyForwarding(headers, "198.51.100.7", trusted);
    expect(headers).toEqual({ host: "ledger.example", [CLIENT_ADDRESS_HEADER]: "198.51.100.7" });
  });

  it("a request through a trusted proxy keeps its forwarding headers", () => {
    const headers: Record<string, string | string[] | undefined> = { "x-forwarded-for": "198.51.100.7", "x-forwarded-proto": "https", "x-forwarded-host": "ledger.example" };
    applyForwarding(headers, "::ffff:10.0.0.2", trusted);
    expect(headers).toMatchObject({ "x-forwarded-proto": "https", "x-forwarded-host": "ledger.example", [CLIENT_ADDRESS_HEADER]: "198.51.100.7" });
  });
});

describe("request target", () => {
  it("accepts ordinary and escaped paths, refuses escapes that are not whole UTF-8", async () => {
    const { wellFormedPath } = await import("@/lib/net/request-target");
    expect(wellFormedPath("/api/v1/sites/abc?q=%ED%A0%80")).toBe(true); // the query is the route's business
    expect(wellFormedPath("/sites/caf%C3%A9")).toBe(true);
    expect(wellFormedPath("/api/auth/%ED%A0%80")).toBe(false); // an escaped lone surrogate
    expect(wellFormedPath("/api/auth/%")).toBe(false);
    expect(wellFormedPath("/api/auth/%E0%A4%A")).toBe(false);
  });
});
