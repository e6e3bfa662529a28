// `npm run test:cluster`: the cross-node tests (vitest project "cluster", tests/cluster/**) against
// a throwaway three-node Galera cluster, two app instances of the production build (the one npm
// test builds) and HAProxy, all on free loopback ports. Tests get the addresses in CLUSTER (JSON)
// and kill or restart a node or an instance through a small control server on loopback (the
// processes stay this script's, so everything is stopped here whatever the tests did).
import { spawn } from "node:child_process";
import { createServer } from "node:http";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { randomBytes } from "node:crypto";
import { ensureNodeModules } from "./lib/deps.mjs";
import { ensureSystemPackages } from "./lib/system.mjs";
import { freePort } from "./lib/ports.mjs";

// POST /nodes/1/kill, /nodes/1/restart, /apps/0/kill, /apps/0/restart: answers when done (a restart
// once the node is Synced and HAProxy has its instances back), with the addresses and pids then.
function startControl(stack) {
  const server = createServer(async (req, res) => {
    const m = /^\/(nodes|apps)\/(\d+)\/(kill|restart)$/.exec(req.url ?? "");
    if (req.method !== "POST" || !m) {
      res.writeHead(404).end();
      return;
    }
    const [, kind, index, action] = m;
    const act = {
      "nodes/kill": stack.galera.kill,
      "nodes/restart": stack.restartNode,
      "apps/kill": stack.apps.kill,
      "apps/restart": stack.restartApp,
    }[`${kind}/${action}`];
    try {
      await act(Number(index));
      res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(stack.info()));
    } catch (err) {
      res.writeHead(500, { "content-type": "application/json" }).end(JSON.stringify({ error: err.message }));
    }
  });
  return new Promise((resolve) => {
    server.listen(0, "127.0.0.1", () => {
      const url = `http://127.0.0.1:${server.address().port}`;
      resolve({ url, stop: () => new Promise((r) => server.close(r)) });
    });
  });
}

async function main() {
  ensureNodeModules();
  ensureSystemPackages(["mariadbd", "galera", "rsync", "haproxy"]);
  const { ensureBuild } = await import("./lib/build.mjs");
  const { startClusterStack } = await import("./lib/cluster-stack.mjs");
  const dataRoot = mkdtempSync(join(tmpdir(), "tenthwise-cluster-"));
  const secrets = {
    SESSION_SECRET: randomBytes(32).toString("hex"),
    LINK_SECRET: randomBytes(32).toString("hex"),
    DB_APP_PASSWORD: randomBytes(12).toString("hex"),
    DB_OWNER_PASSWORD: randomBytes(12).toString("hex"),
  };
  let stack;
  let control;
  let vitest;
  let cleaning = null;
  const cleanup = () =>
    (cleaning ??= (async () => {
      if (vitest && vitest.exitCode === null) vitest.kill("SIGTERM");
      await control?.stop();
      await stack?.stop();
      rmSync(dataRoot, { recursive: true, force: true });
    })());
  const onSignal = async () => {
    await cleanup();
    process.exit(130);
  };
  process.on("SIGINT", onSignal);
  process.on("SIGTERM", onSignal);

  let code = 1;
  try {
    // The same per-version build folder as npm test, so CI builds once for both.
    const distDir = ensureBuild({ perVersion: true });
    stack = await startClusterStack({ dataRoot, secrets, proxyPort: await freePort(), distDir, mode: "test" });
    control = await startControl(stack);
    const cluster = { ...stack.info(), control: control.url };
    console.log(`[tenthwise] cluster up: proxy ${cluster.proxy}, apps ${cluster.apps.map((a) => a.url).join(" ")}`);
    vitest = spawn(
      "node",
      ["node_modules/vitest/vitest.mjs", "run", "--project", "cluster", ...process.argv.slice(2)],
      {
        stdio: "inherit",
        env: {
          ...stack.env,
          NODE_ENV: "test",
          CLUSTER: JSON.stringify(cluster),
          TW_BASE_URL: cluster.proxy,
          TW_TEST_DATA_ROOT: dataRoot,
        },
      },
    );
    code = await new Promise((r) => vitest.on("exit", (c) => r(c ?? 1)));
  } catch (err) {
    console.error(`[tenthwise] ${err.message}`);
  } finally {
    await cleanup();
  }
  process.exit(code);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
