import "server-only";
import { env } from "@/lib/server/core/env";
import { isListed, normalizeAddress, type ProxyList } from "@/lib/server/core/ip";
import { peerAddress } from "@/lib/server/core/peer-address";

/** What a request's address is called when it cannot be known (no stamp and no trusted proxy). */
export const UNKNOWN_ADDRESS = "unknown";

/**
 * The address of the client that sent `req`: the socket's peer, unless that peer is one of
 * TRUSTED_PROXIES; then X-Forwarded-For is walked from the right (the entry the nearest proxy
 * wrote), skipping trusted hops, and the first untrusted hop is the client. With no trusted
 * proxies X-Forwarded-For is ignored entirely, since any client can write it.
 *
 * When the peer is not known (see peer-address.ts) but proxies are configured, the request is
 * taken as having come through them: the deployment promise in the README is that the app port
 * is reachable only from those proxies.
 */
export function clientAddress(req: Request, proxies: ProxyList = env().TRUSTED_PROXIES): string {
  const stamped = peerAddress(req);
  const peer = stamped ? normalizeAddress(stamped) : null;
  if (!proxies.entries.length) return peer ?? UNKNOWN_ADDRESS;
  if (peer && !isListed(proxies, peer)) return peer;
  const hops = (req.headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((h) => h.trim())
    .filter(Boolean);
  let nearest = peer ?? UNKNOWN_ADDRESS;
  for (const hop of hops.reverse()) {
    const address = normalizeAddress(hop);
    // Text a trusted proxy passed on that is no address: the hop before it is all that is known.
    if (!address) return nearest;
    if (!isListed(proxies, address)) return address;
    nearest = address;
  }
  return nearest;
}
