// A bad shop Wi-Fi on loopback: an HTTP proxy that loses a share of the exchanges. A lost exchange
// is either a request dropped before it reaches the server, or a response dropped after the server
// handled it (the tablet cannot tell which; it must resend the same readings). Seeded, so a run can
// be repeated with the same losses in the same order.
import { createServer, request, type IncomingMessage, type ServerResponse } from "node:http";
import type { AddressInfo, Socket } from "node:net";

export interface LossStats {
  forwarded: number;
  droppedRequests: number;
  droppedResponses: number;
  upstreamErrors: number;
}

/** mulberry32: a small, well-known seeded generator; the same seed gives the same losses. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 2 ** 32;
  };
}

export interface LossyProxy {
  url: string;
  stats: LossStats;
  stop(): Promise<void>;
}

/**
 * Forwards to `target` (http://host:port). Each exchange is lost with probability `dropRate`; a lost
 * one is a dropped request or a dropped response, half and half. Only paths matching `lossy` are
 * ever dropped (the test's own sign-in goes through untouched).
 */
export async function startLossyProxy(o: {
  target: string;
  dropRate: number;
  seed: number;
  lossy?: (path: string) => boolean;
}): Promise<LossyProxy> {
  const random = seededRandom(o.seed);
  const target = new URL(o.target);
  const stats: LossStats = { forwarded: 0, droppedRequests: 0, droppedResponses: 0, upstreamErrors: 0 };
  const sockets = new Set<Socket>();
  const cut = (res: ServerResponse) => res.socket?.destroy();

  const server = createServer((req: IncomingMessage, res: ServerResponse) => {
    const eligible = (o.lossy ?? (() => true))(req.url ?? "/");
    const roll = eligible ? random() : 1;
    const lose = roll < o.dropRate ? (roll < o.dropRate / 2 ? "request" : "response") : null;
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      if (lose === "request") {
        stats.droppedRequests++;
        return cut(res);
      }
      const up = request(
        {
          host: target.hostname,
          port: target.port,
          method: req.method,
          path: req.url,
          headers: { ...req.headers, host: target.host },
        },
        (upRes) => {
          const body: Buffer[] = [];
          upRes.on("data", (c: Buffer) => body.push(c));
          upRes.on("end", () => {
            // The server has handled it and answered: the answer is lost on the way back.
            if (lose === "response") {
              stats.droppedResponses++;
              return cut(res);
            }
            stats.forwarded++;
            res.writeHead(upRes.statusCode ?? 502, upRes.headers);
            res.end(Buffer.concat(body));
          });
          upRes.on("error", () => cut(res));
        },
      );
      up.on("error", () => {
        stats.upstreamErrors++;
        if (!res.headersSent) res.writeHead(502, { "content-type": "text/plain" });
        res.end("upstream unreachable");
      });
      up.end(Buffer.concat(chunks));
    });
  });
  server.on("connection", (s: Socket) => {
    sockets.add(s);
    s.on("close", () => sockets.delete(s));
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    stats,
    stop: () =>
      new Promise<void>((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}
