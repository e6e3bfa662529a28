// The production server's resident memory through bench:scale (issue 15: under 512 MB). Starts
// `next start` on the production build (built first when the sources changed) against the scaled
// database, drives the office screens and their API routes over HTTP as a lead, a machinist's
// sync-feed catch-up and a record download, several at once, while sampling VmRSS of the server's
// process tree and reading each process's VmHWM (the kernel's own peak, so no spike between two
// samples is missed). Prints the peak against the goal with the load average.
import { spawn } from "node:child_process";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { loadavg } from "node:os";
import { BENCH_PASSWORD } from "./password";

type Lib = Record<string, (...a: never[]) => unknown>;
const lib = async (name: string) => (await import(`../../lib/${name}.mjs`)) as Lib;

export const GOAL_MB = 512;
const ROUNDS = Number(process.env.TW_SCALE_HTTP_ROUNDS ?? 3);
const AT_ONCE = 4; // office screens open at once in a busy shop
const SAMPLE_MS = 100;
const load = () => `load ${loadavg()[0].toFixed(1)}`;

export type MemorySubject = {
  shopId: number;
  jobId: number;
  heldJobs: number[];
  leadEmail: string;
  machinist: { email: string };
};

/** Kilobytes of one field (VmRSS, VmHWM) of /proc/<pid>/status, or 0 once the process is gone. */
function statusKb(pid: number, field: string): number {
  try {
    const m = readFileSync(`/proc/${pid}/status`, "utf8").match(new RegExp(`^${field}:\\s+(\\d+) kB`, "m"));
    return m ? Number(m[1]) : 0;
  } catch {
    return 0;
  }
}

/** The process and every descendant (a server may fork workers), from each process's parent id. */
function processTree(root: number): number[] {
  const parent = new Map<number, number>();
  for (const d of readdirSync("/proc")) {
    if (!/^\d+$/.test(d)) continue;
    try {
      // "pid (comm) state ppid …": comm may hold spaces, so read after its closing parenthesis.
      const stat = readFileSync(`/proc/${d}/stat`, "utf8");
      parent.set(Number(d), Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]));
    } catch {
      /* ended meanwhile */
    }
  }
  const tree = [root];
  for (let i = 0; i < tree.length; i++) for (const [pid, pp] of parent) if (pp === tree[i]) tree.push(pid);
  return tree;
}

function sampler(root: number) {
  let tree = processTree(root);
  let peakTreeKb = 0;
  const hwm = new Map<number, number>();
  let n = 0;
  const sample = () => {
    if (n++ % 10 === 0) tree = processTree(root);
    let sum = 0;
    for (const pid of tree) {
      sum += statusKb(pid, "VmRSS");
      hwm.set(pid, Math.max(hwm.get(pid) ?? 0, statusKb(pid, "VmHWM")));
    }
    peakTreeKb = Math.max(peakTreeKb, sum);
  };
  sample();
  const timer = setInterval(sample, SAMPLE_MS);
  return {
    stop() {
      sample();
      clearInterval(timer);
      const hwmKb = [...hwm.values()].reduce((a, b) => a + b, 0);
      return { processes: hwm.size, peakTreeKb, hwmKb, rootHwmKb: hwm.get(root) ?? 0 };
    },
  };
}

type Client = { get(path: string): Promise<number> };

/** Signs in over HTTP and keeps the session cookie, as a browser would. */
async function signIn(base: string, origin: string, email: string): Promise<Client> {
  const res = await fetch(`${base}/api/session`, {
    method: "POST",
    headers: { "content-type": "application/json", origin },
    body: JSON.stringify({ email, password: BENCH_PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`Sign-in of ${email} answered ${res.status}: ${await res.text()}`);
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  return {
    async get(path) {
      const r = await fetch(`${base}${path}`, { headers: { cookie } });
      // Read to the end: a streamed CSV or PDF counts while it is written.
      let bytes = 0;
      const reader = r.body?.getReader();
      for (let c = await reader?.read(); c && !c.done; c = await reader!.read()) bytes += c.value.byteLength;
      if (r.status !== 200) throw new Error(`GET ${path} answered ${r.status}`);
      return bytes;
    },
  };
}

/** What one office user and one tablet open: the screens, their API routes, the feed, the downloads. */
function paths(s: MemorySubject): { lead: string[]; machinist: string[] } {
  const j = s.jobId;
  return {
    lead: [
      "/desk/flags",
      "/api/flags",
      "/api/flags?state=all&sort=job",
      `/api/flags?job=${j}&state=all`,
      "/desk",
      "/api/jobs",
      "/api/jobs?status=all&sort=progress",
      `/desk/jobs/${j}`,
      `/api/jobs/${j}`,
      `/desk/jobs/${j}/maps`,
      `/api/jobs/${j}/maps`,
      "/audit",
      "/api/audit",
      `/api/audit?job=${j}`,
      `/api/jobs/${j}/readings.csv`,
      `/api/record/${j}/pdf`,
    ],
    machinist: ["/api/bench/jobs", `/api/sync?since=0&jobs=${s.heldJobs.join(",")}`],
  };
}

/** `next start` on the production build (built first when the sources changed) against `env`'s database. */
export async function startServer(env: NodeJS.ProcessEnv) {
  const { ensureBuild } = await lib("build");
  const { freePort } = await lib("ports");
  const { waitForHttp } = await lib("app-instances");
  const { withoutOwnerAccount } = await lib("db-accounts");
  const distDir = (ensureBuild as () => string)();
  const port = (await (freePort as () => Promise<number>)()) as number;
  const base = `http://127.0.0.1:${port}`;
  const serverEnv = (withoutOwnerAccount as (e: NodeJS.ProcessEnv) => NodeJS.ProcessEnv)(env);
  const child = spawn("node", ["node_modules/next/dist/bin/next", "start", "-p", String(port), "-H", "127.0.0.1"], {
    stdio: ["ignore", "ignore", "inherit"],
    env: { ...serverEnv, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1", TW_DIST_DIR: distDir, APP_URL: base },
  });
  await (waitForHttp as (u: string, ms: number) => Promise<void>)(`${base}/api/health`, 120_000);
  const stop = async () => {
    if (child.exitCode !== null) return;
    const exited = new Promise((r) => child.once("exit", r));
    child.kill("SIGTERM");
    await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
    if (child.exitCode === null) child.kill("SIGKILL");
  };
  return { base, pid: child.pid!, stop };
}

/** Runs the HTTP part; true when the peak stays under the goal. */
export async function measureServerMemory(env: NodeJS.ProcessEnv, subjectFile: string): Promise<boolean> {
  if (!existsSync(subjectFile)) throw new Error(`No ${subjectFile}: the measuring half did not finish`);
  const s = JSON.parse(readFileSync(subjectFile, "utf8")) as MemorySubject;
  console.log(`bench:scale  the production server's memory over HTTP (next start) [${load()}]`);
  const server = await startServer(env);
  try {
    const idleKb = statusKb(server.pid, "VmRSS");
    const watch = sampler(server.pid);
    const t0 = performance.now();
    const lead = await signIn(server.base, server.base, s.leadEmail);
    const machinist = await signIn(server.base, server.base, s.machinist.email);
    const p = paths(s);
    const work = [...p.lead.map((x) => () => lead.get(x)), ...p.machinist.map((x) => () => machinist.get(x))];
    let requests = 0;
    let bytes = 0;
    for (let round = 0; round < ROUNDS; round++) {
      // One after another, then the same AT_ONCE at a time (several people in the office).
      for (const w of work) {
        bytes += await w();
        requests++;
      }
      for (let i = 0; i < work.length; i += AT_ONCE) {
        const got = await Promise.all(work.slice(i, i + AT_ONCE).map((w) => w()));
        bytes += got.reduce((a, b) => a + b, 0);
        requests += got.length;
      }
    }
    const m = watch.stop();
    const mb = (kb: number) => (kb / 1024).toFixed(0);
    const peakKb = Math.max(m.peakTreeKb, m.hwmKb);
    const ok = peakKb / 1024 < GOAL_MB;
    const seconds = ((performance.now() - t0) / 1000).toFixed(0);
    console.log(
      `  ${requests} requests (${(bytes / 1e6).toFixed(1)} MB sent) in ${seconds} s` +
        ` over ${m.processes} server process(es): resident at start ${mb(idleKb)} MB, peak ${mb(peakKb)} MB` +
        ` (VmHWM ${mb(m.hwmKb)} MB, sampled VmRSS ${mb(m.peakTreeKb)} MB) | goal < ${GOAL_MB} MB | ` +
        `${ok ? "ok" : "MISS"} [${load()}]`,
    );
    return ok;
  } finally {
    await server.stop();
  }
}
