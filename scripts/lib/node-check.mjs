// A Galera node's readiness over HTTP, for HAProxy's database checks: 200 when the node is Synced,
// 503 otherwise (joining, donor, cut off, down). One tiny responder per node on loopback; it asks the
// node over its socket as root, as a clustercheck service does on a real database host.
import { createServer } from "node:http";
import { wsrepState } from "./galera-node.mjs";
import { freePort } from "./ports.mjs";

export async function startNodeChecks(nodes) {
  const servers = [];
  const checks = [];
  for (const node of nodes) {
    const port = await freePort();
    const server = createServer(async (req, res) => {
      const state = await wsrepState(node);
      const synced = state?.state === "Synced";
      res.writeHead(synced ? 200 : 503, { "content-type": "text/plain" }).end(state?.state ?? "down");
    });
    await new Promise((resolve) => server.listen(port, "127.0.0.1", resolve));
    servers.push(server);
    checks.push({ name: node.name, port });
  }
  const stop = () => Promise.all(servers.map((s) => new Promise((r) => s.close(r))));
  return { checks, stop };
}
