// `npm run soak:cluster`: five simulated tablets push 2,000 readings each through a proxy that loses
// 30 % of the exchanges, to two app instances behind HAProxy on a three-node Galera cluster; mid-run
// one database node is killed (SIGKILL) and restarted, then one app instance. Then it checks that the
// 10,000 readings are stored once each on every node, with the flags a one-node run of the same
// readings makes, and each mail sent once. Exits 1 on any loss or mismatch. Benchmark data only.
import { cpus, loadavg } from "node:os";
import { checkMail, checkReadings, compareFlags, flagsOf, waitForMail, type Finding } from "./checks";
import { startLossyProxy, seededRandom } from "./lossy-proxy";
import { forJobs, jobCodes, pushAllPlain, shopGauges, tabletPlan } from "./plan";
import { clusterStack, exitAfterStopping, oneNodeStack, stopAllOnExit, type Stack, type StackOptions } from "./stack";
import { lib } from "./lib-types";
import { runTablet, signIn, type TabletResult } from "./tablet";
import type { BenchInstrument } from "@/lib/schemas/sync";

const TABLETS = Number(process.env.TW_SOAK_TABLETS ?? 5);
const PER_TABLET = Number(process.env.TW_SOAK_READINGS ?? 2_000);
const DROP = Number(process.env.TW_SOAK_DROP ?? 0.3);
const SEED = Number(process.env.TW_SOAK_SEED ?? Math.floor(Math.random() * 2 ** 31));
// The machinists' pace: readings entered per burst and the pause between bursts.
const BURST = 20;
const PAUSE_MS = Number(process.env.TW_SOAK_PAUSE_MS ?? 400);
const DEMO = { email: "rosa@kestrelflats.example", password: "bench-demo-2026" };

const load = () => `load average ${loadavg()[0].toFixed(1)} on ${cpus().length} cores`;
const log = (msg: string) => console.log(`[soak ${new Date().toISOString().slice(11, 19)}] ${msg}`);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

type Chaos = { events: string[]; done: Promise<void> };

/** Kills and restarts a database node at 20 % of the readings acknowledged, an app instance at 55 %. */
function chaos(stack: Stack, progress: () => number, total: number, running: () => boolean): Chaos {
  const events: string[] = [];
  const at = async (share: number) => {
    while (progress() < share * total) await sleep(100);
  };
  const note = (what: string) => {
    events.push(
      `${what} at ${((100 * progress()) / total).toFixed(0)} % acknowledged${running() ? "" : " (AFTER the run)"}`,
    );
    log(what);
  };
  const done = (async () => {
    const { cluster, apps } = stack;
    await at(0.2);
    // Node n1 is the writer (every instance's connections go to it through the database HAProxy):
    // killing it is the hard case. Open transactions die with it, HAProxy moves the connections to
    // n2, the tablets resend what was not acknowledged, and when n1 is Synced again they move back.
    note("SIGKILL database node n1 (the writer)");
    await cluster!.kill(0);
    await sleep(3_000);
    note("restarting n1");
    await stack.restartNode!(0);
    note("n1 rejoined (Synced) and back as the writer");
    await at(0.55);
    note("SIGKILL app instance 1");
    await apps.kill(0);
    await sleep(2_000);
    await stack.restartApp!(0);
    note("app instance 1 restarted and back in HAProxy");
  })();
  return { events, done };
}

async function clusterRun(opts: StackOptions, dist: string) {
  const stack = await clusterStack(opts, dist);
  try {
    log(`cluster up: HAProxy ${stack.url}, nodes ${stack.nodes.map((n) => n.name).join(", ")}; ${load()}`);
    const proxy = await startLossyProxy({
      target: stack.url,
      dropRate: DROP,
      seed: SEED,
      lossy: (path) => path.startsWith("/api/sync"),
    });
    const codes = jobCodes("SOAK", TABLETS, PER_TABLET);
    const synced = new Array<number>(TABLETS).fill(0);
    let running = true;
    const total = TABLETS * PER_TABLET;
    const trouble = chaos(
      stack,
      () => synced.reduce((a, b) => a + b, 0),
      total,
      () => running,
    );
    const random = seededRandom(SEED ^ 0x5eed);
    const t0 = performance.now();
    let clusterGauges: BenchInstrument[] = [];
    const results: TabletResult[] = await Promise.all(
      codes.map(async (mine, t) => {
        // Each tablet signs in and opens its jobs before the shift, on good Wi-Fi (HAProxy directly).
        const session = await signIn(stack.url, stack.origin, DEMO.email, DEMO.password);
        const jobIds = mine.map((c) => stack.jobs[c]);
        const gauges = await shopGauges(stack.url, session.cookie, jobIds[0]);
        clusterGauges = gauges;
        return runTablet({
          name: `tablet-${t + 1}`,
          base: proxy.url,
          origin: stack.origin,
          session,
          plan: tabletPlan(jobIds, PER_TABLET, gauges),
          burst: BURST,
          pauseMs: PAUSE_MS,
          random,
          onProgress: (n) => (synced[t] = n),
          deadlineMs: 10 * 60_000,
        });
      }),
    ).finally(() => (running = false));
    const ms = performance.now() - t0;
    await trouble.done;
    await proxy.stop();
    const all = results.flatMap((r) => r.readings);
    const pushes = results.reduce((a, r) => a + r.pushes, 0);
    const s = proxy.stats;
    log(
      `tablets done in ${(ms / 1000).toFixed(1)} s: ${pushes} pushes, ${s.droppedRequests} requests and ` +
        `${s.droppedResponses} responses dropped, ${s.upstreamErrors} upstream errors; ${load()}`,
    );
    const findings: Finding[] = await checkReadings(
      stack.nodes,
      Object.values(stack.jobs),
      all.map((r) => r.id),
      all.filter((r) => r.state === "synced").map((r) => r.id),
      all.filter((r) => r.state === "rejected").length,
    );
    const unsent = await waitForMail(stack.nodes[0], 90_000);
    findings.push(await checkMail(stack.nodes[0], stack.mailDir, unsent));
    const flags = await flagsOf(stack.nodes[0], stack.jobs);
    const chaosOk = trouble.events.length === 5 && !trouble.events.some((e) => e.includes("AFTER"));
    findings.push({ what: "faults mid-run", ok: chaosOk, detail: trouble.events.join("; ") });
    return { findings, flags, payloads: results.map((r) => r.payloads), jobs: stack.jobs, gauges: clusterGauges };
  } finally {
    await stack.stop();
  }
}

async function oneNodeFlags(opts: StackOptions, dist: string, run: Awaited<ReturnType<typeof clusterRun>>) {
  const stack = await oneNodeStack({ ...opts, notifySeconds: 0, label: "soak-one" }, dist);
  try {
    const session = await signIn(stack.url, stack.origin, DEMO.email, DEMO.password);
    const gauges = await shopGauges(stack.url, session.cookie, Object.values(stack.jobs)[0]);
    const perTablet = run.payloads.map((p) => forJobs(p, run, { jobs: stack.jobs, gauges }));
    await pushAllPlain(stack.url, stack.origin, session.cookie, perTablet);
    return await flagsOf(stack.nodes[0], stack.jobs);
  } finally {
    await stack.stop();
  }
}

async function main() {
  stopAllOnExit();
  log(`seed ${SEED} (TW_SOAK_SEED=${SEED} repeats the same losses); ${TABLETS} tablets × ${PER_TABLET} readings`);
  const dist = (await lib()).ensureBuild({ perVersion: true });
  const jobs = jobCodes("SOAK", TABLETS, PER_TABLET).flat().length;
  const opts: StackOptions = { jobs, jobPrefix: "SOAK", notifySeconds: 3, apps: 2, label: "soak" };
  const run = await clusterRun(opts, dist);
  log(`one-node run of the same readings for the flags; ${load()}`);
  const reference = await oneNodeFlags(opts, dist, run);
  run.findings.push(compareFlags(run.flags, reference));
  console.log(`\nsoak:cluster  seed ${SEED}, drop ${(DROP * 100).toFixed(0)} %, ${load()}`);
  for (const f of run.findings) console.log(`  ${f.ok ? "ok  " : "FAIL"} ${f.what.padEnd(26)} ${f.detail}`);
  const failed = run.findings.filter((f) => !f.ok).length;
  console.log(failed ? `\n${failed} check(s) failed` : "\nall checks passed");
  await exitAfterStopping(failed ? 1 : 0);
}

main().catch((err) => {
  console.error(err);
  void exitAfterStopping(1);
});
