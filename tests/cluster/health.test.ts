import mariadb from "mariadb";
import { describe, expect, it } from "vitest";
import { cluster, killApp, killNode, restartApp, restartNode, waitForStatus } from "../support/cluster";

// scripts/lib/cluster-stack.mjs: by default every instance's connections go through HAProxy (TCP)
// to one Synced node, the writer, the next node taking over when it fails ("one-node"); with
// TW_CLUSTER_WRITES=per-node instance i uses node i and leaves the HTTP rotation when it dies.
// HAProxy checks GET /api/health every second and takes an instance out after two failures.
const health = async (base: string) => {
  const res = await fetch(`${base}/api/health`);
  return { status: res.status, body: await res.json() };
};

/** The node a new connection through the database proxy reaches. */
async function writer(): Promise<string> {
  const info = cluster();
  const conn = await mariadb.createConnection({
    host: "127.0.0.1",
    port: info.dbProxy!.port,
    user: info.db.user,
    password: info.db.password,
  });
  try {
    const [row] = await conn.query("SELECT @@wsrep_node_name AS name");
    return row.name;
  } finally {
    await conn.end();
  }
}

async function pollUntil(what: string, check: () => Promise<boolean>, timeoutMs = 30_000) {
  const until = Date.now() + timeoutMs;
  while (!(await check().catch(() => false))) {
    if (Date.now() > until) throw new Error(`${what} did not happen in ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

describe("health across the cluster", () => {
  it("answers 200 on every instance, each on a Synced node, and through HAProxy", async () => {
    const info = cluster();
    for (const app of info.apps) {
      expect(await health(app.url)).toEqual({
        status: 200,
        body: { status: "ok", database: "reachable", node: "synced" },
      });
    }
    expect((await health(info.proxy)).status).toBe(200);
  });

  it.runIf(cluster().writes === "one-node")(
    "moves the writer to the next node when it is killed, and back once it rejoined",
    async () => {
      const info = cluster();
      expect(await writer()).toBe(info.nodes[0].name);
      await killNode(0);
      try {
        await pollUntil("the second node taking the writes", async () => (await writer()) === info.nodes[1].name);
        for (const app of info.apps) await waitForStatus(`${app.url}/api/health`, 200, 30_000);
        for (let i = 0; i < 6; i++) expect((await health(info.proxy)).status).toBe(200);
      } finally {
        await restartNode(0);
      }
      expect(await writer()).toBe(info.nodes[0].name);
      for (const app of info.apps) expect((await health(app.url)).status).toBe(200);
    },
  );

  it.runIf(cluster().writes === "per-node")(
    "takes the instance of a killed node out; HAProxy serves from the other; both back after the restart",
    async () => {
      const info = cluster();
      const victim = info.apps[0];
      await killNode(victim.node!);
      try {
        await waitForStatus(`${victim.url}/api/health`, 503, 30_000);
        expect((await health(victim.url)).body).toMatchObject({ status: "unavailable" });
        expect((await health(info.apps[1].url)).status).toBe(200);
        // HAProxy needs two failed checks (about two seconds) to take the instance out of the rotation.
        await new Promise((r) => setTimeout(r, 3000));
        for (let i = 0; i < 6; i++) expect((await health(info.proxy)).status).toBe(200);
      } finally {
        await restartNode(victim.node!);
      }
      await waitForStatus(`${victim.url}/api/health`, 200, 60_000);
    },
  );

  it("keeps answering through HAProxy while an instance is killed, and takes it back after its restart", async () => {
    const info = cluster();
    await killApp(1);
    try {
      for (let i = 0; i < 6; i++) expect((await health(info.proxy)).status).toBe(200);
    } finally {
      await restartApp(1);
    }
    await waitForStatus(`${info.apps[1].url}/api/health`, 200);
  });
});
