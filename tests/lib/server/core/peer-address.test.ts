import { once } from "node:events";
import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { installPeerStamp, PEER_HEADER, peerAddress } from "@/lib/server/core/peer-address";

// A real Node HTTP server, as `next start` runs one: the stamp must carry the socket's address
// whatever the client wrote into the header itself.
describe("installPeerStamp", () => {
  let server: http.Server;
  let base: string;
  beforeAll(async () => {
    installPeerStamp();
    server = http.createServer((req, res) => {
      const web = new Request("http://localhost/", { headers: req.headers as Record<string, string> });
      res.end(JSON.stringify({ peer: peerAddress(web) }));
    });
    server.listen(0, "127.0.0.1");
    await once(server, "listening");
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

  it("stamps the socket's address and overwrites a stamp the client sent", async () => {
    const plain = await (await fetch(base)).json();
    const forged = await (await fetch(base, { headers: { [PEER_HEADER]: "x 203.0.113.5" } })).json();
    expect(plain.peer).toBe("127.0.0.1");
    expect(forged.peer).toBe("127.0.0.1");
  });
});
