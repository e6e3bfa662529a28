import { describe, expect, it } from "vitest";
import { cluster, killApp, killNode, restartApp, restartNode, waitForStatus } from "../support/cluster";

// Each app instance uses its own Galera node (scripts/lib/cluster-stack.mjs); HAProxy checks
// GET /api/health every second and takes an instance out after two failures.
const health = async (base: string) => {
  const res = await fetch(`${base}/api/health`);
  return { status: res.status, body: await res.json() };
};

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

  it("takes the instance of a killed node out; HAProxy serves from the other; both back after the restart", async () => {
    const info = cluster();
    const victim = info.apps[0];
    await killNode(victim.node);
    try {
      await waitForStatus(`${victim.url}/api/health`, 503, 30_000);
      expect((await health(victim.url)).body).toMatchObject({ status: "unavailable" });
      expect((await health(info.apps[1].url)).status).toBe(200);
      // HAProxy needs two failed checks (about two seconds) to take the instance out of the rotation.
      await new Promise((r) => setTimeout(r, 3000));
      for (let i = 0; i < 6; i++) expect((await health(info.proxy)).status).toBe(200);
    } finally {
      await restartNode(victim.node);
    }
    await waitForStatus(`${victim.url}/api/health`, 200, 60_000);
  });

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
