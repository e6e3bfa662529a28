// The cluster that `npm run test:cluster` started (scripts/test-cluster.mjs): addresses, accounts,
// and a way to kill or restart a database node or an app instance (its control server does it).
export type ClusterNode = { name: string; port: number; socket: string; pid: number };
/** `node`: the node this instance uses with per-node writes; null when all go through the database proxy. */
export type ClusterApp = { name: string; url: string; port: number; pid: number; node: number | null };
type Account = { user: string; password: string; database: string };
export type ClusterInfo = {
  nodes: ClusterNode[];
  apps: ClusterApp[];
  proxy: string;
  /** HAProxy's status page (append ";csv" for CSV). */
  proxyStats: string;
  /** "one-node": every connection through HAProxy (TCP, dbProxy.port) to one Synced node; "per-node". */
  writes: "one-node" | "per-node";
  dbProxy: { port: number } | null;
  db: Account;
  owner: Account;
  control: string;
};

export function cluster(): ClusterInfo {
  const raw = process.env.CLUSTER;
  if (!raw) throw new Error("No cluster: run these tests with `npm run test:cluster`");
  return JSON.parse(raw) as ClusterInfo;
}

async function control(path: string): Promise<ClusterInfo> {
  const info = cluster();
  const res = await fetch(`${info.control}${path}`, { method: "POST" });
  const body = await res.json();
  if (!res.ok) throw new Error(`cluster control ${path} failed: ${body.error}`);
  return { ...body, control: info.control } as ClusterInfo;
}

/** SIGKILL database node i (0-based); resolves once it is gone. */
export const killNode = (i: number) => control(`/nodes/${i}/kill`);
/** Starts node i again; resolves once it rejoined, is Synced and HAProxy has its instances back. */
export const restartNode = (i: number) => control(`/nodes/${i}/restart`);
/** SIGKILL app instance i; resolves once it is gone. */
export const killApp = (i: number) => control(`/apps/${i}/kill`);
/** Starts app instance i again on its port; resolves once HAProxy sends requests to it again. */
export const restartApp = (i: number) => control(`/apps/${i}/restart`);

/** Polls `url` until it answers with `status` (HAProxy checks each second; fall 2, rise 2). */
export async function waitForStatus(url: string, status: number, timeoutMs = 60_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  let last = "";
  while (Date.now() < until) {
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(5000) });
      if (res.status === status) return;
      last = String(res.status);
    } catch (err) {
      last = (err as Error).message;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not answer ${status} in ${timeoutMs / 1000} s (last: ${last})`);
}
