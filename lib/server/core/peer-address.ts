import "server-only";
import { randomBytes } from "node:crypto";
import http, { type IncomingMessage } from "node:http";

// Route handlers get a Web Request, which has no socket: Next 15 removed `NextRequest.ip`, and
// `next start` writes the socket's address into X-Forwarded-For only when the client sent none,
// so that header can never tell the peer. At start-up (instrumentation.ts) every request the
// Node HTTP server receives is stamped with the address of the socket it came on, in a header
// whose value carries a secret made fresh for each process: a client cannot forge it, and one
// sent before the stamping began (the first requests of a process) is simply not believed.

export const PEER_HEADER = "x-tenthwise-peer";
const STATE = Symbol.for("tenthwise.peer-address");
type PeerState = { proof: string };
type Stampable = { emit: (event: string | symbol, ...args: unknown[]) => boolean; [STATE]?: PeerState };

function state(): PeerState {
  const holder = globalThis as { [STATE]?: PeerState };
  holder[STATE] ??= { proof: randomBytes(16).toString("hex") };
  return holder[STATE];
}

/** The header value that says "this request came on a socket from `address`" in this process. */
export const stampFor = (address: string) => `${state().proof} ${address}`;

/** Stamps every request of every Node HTTP server in this process with its socket's address; once. */
export function installPeerStamp(): void {
  const proto = http.Server.prototype as unknown as Stampable;
  if (proto[STATE]) return;
  const emit = proto.emit;
  proto.emit = function stamped(this: unknown, event: string | symbol, ...args: unknown[]) {
    if (event === "request") {
      const req = args[0] as IncomingMessage;
      req.headers[PEER_HEADER] = stampFor(req.socket?.remoteAddress ?? "");
    }
    return emit.call(this, event, ...args);
  };
  proto[STATE] = state();
}

/** The socket address stamped on this request, or null when it carries no stamp of this process. */
export function peerAddress(req: Request): string | null {
  const value = req.headers.get(PEER_HEADER);
  const proof = `${state().proof} `;
  if (!value?.startsWith(proof)) return null;
  return value.slice(proof.length) || null;
}
