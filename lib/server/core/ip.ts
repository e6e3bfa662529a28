import "server-only";
import { BlockList, isIP } from "node:net";

// IP addresses as proxies and sockets write them, in one spelling, and the proxy list of
// TRUSTED_PROXIES. Pure: no request, no configuration.

/**
 * One spelling per address: brackets and a port dropped, an IPv4 address mapped into IPv6 written
 * as IPv4, IPv6 lower-case and compressed (so "2001:DB8:0::1" and "2001:db8::1" are one client);
 * null when the text is not an IP address.
 */
export function normalizeAddress(raw: string): string | null {
  let text = raw.trim();
  const bracketed = /^\[([^\]]+)\](?::\d+)?$/.exec(text);
  if (bracketed) text = bracketed[1];
  else if (/^\d{1,3}(?:\.\d{1,3}){3}:\d+$/.test(text)) text = text.slice(0, text.lastIndexOf(":"));
  text = text.replace(/%.*$/, "");
  const mapped = /^::ffff:(\d{1,3}(?:\.\d{1,3}){3})$/i.exec(text);
  if (mapped) text = mapped[1];
  const family = isIP(text);
  if (family === 4) return text;
  if (family !== 6) return null;
  // The URL parser writes IPv6 hosts in the compressed lower-case form of RFC 5952.
  const canonical = new URL(`http://[${text}]/`).hostname.slice(1, -1);
  const remapped = /^::ffff:([0-9a-f]{1,4}):([0-9a-f]{1,4})$/.exec(canonical);
  if (!remapped) return canonical;
  const [high, low] = [parseInt(remapped[1], 16), parseInt(remapped[2], 16)];
  return [high >> 8, high & 255, low >> 8, low & 255].join(".");
}

function ipv6Groups(address: string): string[] {
  const [head, tail] = address.includes("::") ? address.split("::") : [address, undefined];
  const split = (s: string | undefined) => (s ? s.split(":") : []);
  const [h, t] = [split(head), split(tail)];
  const zeros = tail === undefined ? [] : Array<string>(8 - h.length - t.length).fill("0");
  return [...h, ...zeros, ...t];
}

/**
 * The unit a throttle counts an address in: an IPv4 address itself; for IPv6 its /64 network,
 * since one home or office line is usually given a whole /64 and could step through it.
 */
export function addressBucket(address: string): string {
  if (isIP(address) !== 6) return address;
  return `${ipv6Groups(address).slice(0, 4).join(":")}::/64`;
}

export type ProxyList = { list: BlockList; entries: string[] };

/**
 * Parses "10.0.0.5, 10.1.0.0/16, fd00::/8" into a list addresses are checked against; an entry
 * that is neither an address nor a network comes back as `bad` so the configuration error names it.
 */
export function parseProxyList(text: string): ProxyList | { bad: string } {
  const list = new BlockList();
  const entries = text
    .split(",")
    .map((e) => e.trim())
    .filter(Boolean);
  for (const entry of entries) {
    const [addressText, prefixText, ...rest] = entry.split("/");
    const address = normalizeAddress(addressText);
    const family = address ? isIP(address) : 0;
    if (!address || rest.length) return { bad: entry };
    const type = family === 4 ? "ipv4" : "ipv6";
    if (prefixText === undefined) {
      list.addAddress(address, type);
      continue;
    }
    const prefix = Number(prefixText);
    if (!/^\d{1,3}$/.test(prefixText) || prefix > (family === 4 ? 32 : 128)) return { bad: entry };
    list.addSubnet(address, prefix, type);
  }
  return { list, entries };
}

/** True when `address` (normalised) is one of the listed proxies or inside one of their networks. */
export function isListed(proxies: ProxyList, address: string): boolean {
  return proxies.list.check(address, isIP(address) === 6 ? "ipv6" : "ipv4");
}
