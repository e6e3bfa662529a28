import "server-only";
import { probeNode, type NodeProbe } from "@/lib/server/health/repo";

// What a load balancer asks before sending requests here: the app answers, its database answers
// within a short time, and on a Galera node that node is Synced (a joining, donor or cut-off node
// may serve stale rows or refuse writes, so the instance steps out until its node catches up).
export type Health = {
  status: "ok" | "unavailable";
  database: "reachable" | "unreachable";
  node: "single" | "synced" | "not-synced";
};

/** Long enough for a loaded database, short enough for a check every second or two. */
export const PROBE_TIMEOUT_MS = 2500;

/** Pure: the answer for a probe's outcome (null: the database did not answer in time or refused). */
export function healthOf(probe: NodeProbe | null): Health {
  if (!probe) return { status: "unavailable", database: "unreachable", node: "not-synced" };
  if (!probe.wsrepOn) return { status: "ok", database: "reachable", node: "single" };
  const synced = probe.state === "Synced";
  return { status: synced ? "ok" : "unavailable", database: "reachable", node: synced ? "synced" : "not-synced" };
}

function withTimeout<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error("database did not answer in time")), ms);
  });
  return Promise.race([work, late]).finally(() => clearTimeout(timer));
}

export async function checkHealth(probe: () => Promise<NodeProbe> = probeNode): Promise<Health> {
  try {
    return healthOf(await withTimeout(probe(), PROBE_TIMEOUT_MS));
  } catch {
    return healthOf(null);
  }
}
