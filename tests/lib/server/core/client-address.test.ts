import { describe, expect, it } from "vitest";
import { clientAddress, UNKNOWN_ADDRESS } from "@/lib/server/core/client-address";
import { addressBucket, normalizeAddress, parseProxyList, type ProxyList } from "@/lib/server/core/ip";
import { PEER_HEADER, stampFor } from "@/lib/server/core/peer-address";

function proxies(text: string): ProxyList {
  const parsed = parseProxyList(text);
  if (!("list" in parsed)) throw new Error(`bad test list ${text}`);
  return parsed;
}

const request = (peer: string | null, forwardedFor?: string, extra: Record<string, string> = {}) => {
  const headers: Record<string, string> = { ...extra };
  if (peer !== null) headers[PEER_HEADER] = stampFor(peer);
  if (forwardedFor !== undefined) headers["x-forwarded-for"] = forwardedFor;
  return new Request("http://localhost/api/session", { headers });
};

const NONE = proxies("");
const HAPROXY = proxies("10.0.0.2, 10.0.1.0/24, fd00:1::/64");

describe("clientAddress", () => {
  it.each([
    // [what, trusted proxies, socket peer, X-Forwarded-For, client address]
    ["no proxies: the peer, the header ignored", NONE, "192.0.2.7", "198.51.100.9", "192.0.2.7"],
    ["no proxies and no peer: unknown, never the header", NONE, null, "198.51.100.9", UNKNOWN_ADDRESS],
    ["an untrusted peer's header is ignored", HAPROXY, "192.0.2.7", "198.51.100.9", "192.0.2.7"],
    ["a trusted peer: the entry it appended", HAPROXY, "10.0.0.2", "198.51.100.9", "198.51.100.9"],
    [
      "a client's own entries left of the proxy's are skipped",
      HAPROXY,
      "10.0.0.2",
      "1.1.1.1, 198.51.100.9",
      "198.51.100.9",
    ],
    [
      "two trusted hops (a network listed as CIDR)",
      HAPROXY,
      "10.0.0.2",
      "1.1.1.1, 198.51.100.9, 10.0.1.40",
      "198.51.100.9",
    ],
    ["every hop trusted: the farthest one", HAPROXY, "10.0.0.2", "10.0.1.5, 10.0.1.6", "10.0.1.5"],
    ["a trusted peer with no header: the peer", HAPROXY, "10.0.0.2", undefined, "10.0.0.2"],
    ["garbage behind a trusted hop: that hop", HAPROXY, "10.0.0.2", "not-an-ip, 10.0.1.7", "10.0.1.7"],
    [
      "no peer stamp but proxies set: the header from the right",
      HAPROXY,
      null,
      "1.1.1.1, 198.51.100.9",
      "198.51.100.9",
    ],
    ["IPv6 client behind an IPv6 proxy", HAPROXY, "fd00:1::5", "2001:DB8:0:0::1", "2001:db8::1"],
    ["IPv4-mapped peer counts as IPv4", HAPROXY, "::ffff:10.0.0.2", "198.51.100.9", "198.51.100.9"],
    ["a proxy that writes ports and brackets", HAPROXY, "10.0.0.2", "[2001:db8::9]:4431", "2001:db8::9"],
  ])("%s", (_what, list, peer, forwardedFor, expected) => {
    expect(clientAddress(request(peer, forwardedFor), list)).toBe(expected);
  });

  it("never reads X-Real-IP", () => {
    expect(clientAddress(request("192.0.2.7", undefined, { "x-real-ip": "1.2.3.4" }), HAPROXY)).toBe("192.0.2.7");
  });

  it("does not believe a peer stamp a client wrote itself", () => {
    const forged = new Request("http://localhost/", { headers: { [PEER_HEADER]: "anything 10.0.0.2" } });
    expect(clientAddress(forged, NONE)).toBe(UNKNOWN_ADDRESS);
  });
});

describe("normalizeAddress and addressBucket", () => {
  it.each([
    ["10.1.2.3", "10.1.2.3"],
    ["10.1.2.3:8080", "10.1.2.3"],
    ["::FFFF:10.1.2.3", "10.1.2.3"],
    ["2001:0db8:0000:0000:0000:0000:0000:0001", "2001:db8::1"], // RFC 5952, 4.2.1 (zeros compressed)
    ["fe80::1%eth0", "fe80::1"],
    ["[::1]", "::1"],
    ["10.1.2", null],
    ["hello", null],
  ])("%s is written %s", (raw, expected) => {
    expect(normalizeAddress(raw)).toBe(expected);
  });

  it("counts IPv6 clients by their /64 and IPv4 clients by address", () => {
    expect(addressBucket("2001:db8:1:2:aaaa::1")).toBe("2001:db8:1:2::/64");
    expect(addressBucket("2001:db8:1:2:bbbb:cccc:dddd:eeee")).toBe("2001:db8:1:2::/64");
    expect(addressBucket("2001:db8::1")).toBe("2001:db8:0:0::/64");
    expect(addressBucket("192.0.2.7")).toBe("192.0.2.7");
  });
});

describe("parseProxyList", () => {
  it.each(["10.0.0.0/33", "10.0.0.0/8/1", "proxy.local", "fd00::/129", "10.0.0.0/x"])("names %s as bad", (entry) => {
    expect(parseProxyList(`10.0.0.2, ${entry}`)).toEqual({ bad: entry });
  });

  it("matches addresses inside listed networks only", () => {
    const list = proxies("10.0.0.0/8, fd00::/8, 192.0.2.1");
    const inside = ["10.255.0.1", "fd12::1", "192.0.2.1"];
    const outside = ["11.0.0.1", "fe80::1", "192.0.2.2"];
    for (const a of inside) expect(clientAddress(request(a, "198.51.100.1"), list)).toBe("198.51.100.1");
    for (const a of outside) expect(clientAddress(request(a, "198.51.100.1"), list)).toBe(a);
  });
});
