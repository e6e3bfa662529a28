// The whole cluster on one machine, for `npm run cluster` and `npm run test:cluster`: three Galera
// nodes, the local fakes (mail, S3), the schema migrated and the demo seeded once (on the first
// node; Galera copies it), N production app instances and HAProxy in front of them.
//
// Database side: each app instance talks to its own Galera node (instance i to node i). A node
// that dies or falls out of sync makes its instance's /api/health answer 503, and HAProxy stops
// sending requests there until the node is Synced again; the other instance, on a healthy node,
// serves everyone meanwhile. The README's production section gives the measurements behind this.
import { execFileSync } from "node:child_process";
import { join } from "node:path";
import { startGalera } from "./galera.mjs";
import { startApps } from "./app-instances.mjs";
import { startHaproxy } from "./haproxy.mjs";
import { startServices } from "./services.mjs";
import { accountStatements, APP_USER, OWNER_USER, withoutOwnerAccount } from "./db-accounts.mjs";
import { freePort } from "./ports.mjs";

export const CLUSTER_DATABASE = "tenthwise";

/**
 * `proxyPort`/`proxyHost`: where HAProxy listens. `distDir`: the build the instances serve.
 * Returns { galera, apps, proxy, env, info, stop } where env is the app's environment on node 1
 * (owner account included, for scripts and tests) and info what tests receive as CLUSTER.
 */
export async function startClusterStack({
  dataRoot,
  secrets,
  proxyPort,
  proxyHost = "127.0.0.1",
  instances = 2,
  distDir = ".next",
  mode = "start",
  extraEnv = {},
  log = (line) => console.log(`[tenthwise] ${line}`),
}) {
  const stops = [];
  const stopAll = async () => {
    for (const stop of stops.reverse()) await stop().catch((e) => console.error("[tenthwise] stop failed:", e.message));
    stops.length = 0;
  };
  try {
    const database = CLUSTER_DATABASE;
    const passwords = { ownerPassword: secrets.DB_OWNER_PASSWORD, appPassword: secrets.DB_APP_PASSWORD };
    log("starting three Galera nodes …");
    const started = Date.now();
    const galera = await startGalera({
      dir: join(dataRoot, "galera"),
      databases: [database],
      accountStatements: accountStatements({ databases: [database], ...passwords }),
    });
    stops.push(galera.stop);
    log(`Galera: ${galera.nodes.length} nodes Synced in ${((Date.now() - started) / 1000).toFixed(1)} s`);

    const [smtpPort, s3Port] = [await freePort(), await freePort()];
    const services = await startServices({ mode, dataRoot, smtpPort, s3Port, secrets, withDatabase: false });
    stops.push(services.stop);

    const app = { user: APP_USER, password: passwords.appPassword };
    const owner = { user: OWNER_USER, password: passwords.ownerPassword };
    const proxyUrl = `http://${proxyHost === "0.0.0.0" ? "localhost" : proxyHost}:${proxyPort}`;
    const env = {
      ...process.env,
      ...services.env,
      NEXT_TELEMETRY_DISABLED: "1",
      SESSION_SECRET: process.env.SESSION_SECRET ?? secrets.SESSION_SECRET,
      LINK_SECRET: process.env.LINK_SECRET ?? secrets.LINK_SECRET,
      APP_URL: process.env.APP_URL ?? proxyUrl,
      // HAProxy runs on this machine: its X-Forwarded-For names the client (sign-in throttling).
      TRUSTED_PROXIES: process.env.TRUSTED_PROXIES ?? "127.0.0.1",
      TW_DIST_DIR: distDir,
      DATABASE_URL: galera.urlFor(0, database, app),
      DB_OWNER_USER: OWNER_USER,
      DB_OWNER_PASSWORD: passwords.ownerPassword,
      ...extraEnv,
    };
    execFileSync(
      "node",
      ["node_modules/tsx/dist/cli.mjs", "--conditions=react-server", "scripts/db-setup.ts", "--seed"],
      { stdio: "inherit", env },
    );

    log(`starting ${instances} app instances …`);
    const nodeOf = (i) => i % galera.nodes.length;
    const apps = await startApps({
      count: instances,
      env: withoutOwnerAccount(env),
      dbFor: (i) => ({ DATABASE_URL: galera.urlFor(nodeOf(i), database, app) }),
    });
    stops.push(apps.stop);
    const proxy = await startHaproxy({ port: proxyPort, host: proxyHost, apps: apps.apps, dir: dataRoot });
    stops.push(proxy.stop);

    // Back in service, not merely started: the instance answers and HAProxy sends requests to it.
    const restartApp = async (i) => {
      await apps.restart(i);
      await proxy.waitServerUp(apps.apps[i].name);
    };
    const restartNode = async (i) => {
      await galera.restart(i);
      for (const [j, a] of apps.apps.entries()) if (nodeOf(j) === i) await proxy.waitServerUp(a.name);
    };
    const info = () => ({
      nodes: galera.nodes.map((n) => ({ name: n.name, port: n.port, socket: n.socket, pid: n.pid })),
      apps: apps.apps.map((a, i) => ({ name: a.name, url: a.url, port: a.port, pid: a.pid, node: nodeOf(i) })),
      proxy: proxy.url,
      proxyStats: proxy.statsUrl,
      db: { ...app, database },
      owner: { ...owner, database },
    });
    return { galera, apps, proxy, env, info, restartApp, restartNode, stop: stopAll };
  } catch (err) {
    await stopAll();
    throw err;
  }
}
