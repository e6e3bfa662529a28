// What each simulated tablet measures (the bench figures of scripts/bench/sync-readings.ts: every
// station of a V8's route, a few percent out of spec), and a plain, loss-free push of the same
// readings to another set-up, for the one-node comparison and the burst bench.
import { randomUUID } from "node:crypto";
import { gaugesHolding } from "@/lib/domain";
import type { NewReading } from "@/lib/offline/readings";
import type { BenchInstrument, JobPack, PushReadingInput, PushResult } from "@/lib/schemas/sync";
import { benchReadings, stationsPerJob } from "../bench/sync-readings";

const TAKEN_AT = "2026-11-30T08:00:00.000Z";

/**
 * Job codes per tablet: each tablet works its own jobs, enough for `perTablet` readings (a quarter
 * more than a full route needs, for the stations the demo shop has no gauge for).
 */
export function jobCodes(prefix: string, tablets: number, perTablet: number): string[][] {
  const per = Math.ceil((1.25 * perTablet) / stationsPerJob());
  return Array.from({ length: tablets }, (_, t) =>
    Array.from({ length: per }, (_, j) => `${prefix}-${t * per + j + 1}`),
  );
}

/** The shop's gauges, as the tablet has them in a job pack. */
export async function shopGauges(base: string, cookie: string, jobId: number): Promise<BenchInstrument[]> {
  const res = await fetch(`${base}/api/bench/jobs/${jobId}`, { headers: { cookie } });
  if (!res.ok) throw new Error(`GET /api/bench/jobs/${jobId} answered ${res.status}`);
  return ((await res.json()) as JobPack).instruments;
}

/**
 * The `count` readings one tablet enters, in bench order, for its jobs (ids as the set-up numbered
 * them), each with the first of the shop's gauges that can take it, as the machinist would pick one;
 * a station no gauge of the shop can measure is passed over, as the machinist would have to.
 */
export function tabletPlan(jobIds: number[], count: number, gauges: BenchInstrument[]): NewReading[] {
  const plan: NewReading[] = [];
  for (const r of benchReadings(jobIds, jobIds.length * stationsPerJob(), TAKEN_AT)) {
    const gauge = gaugesHolding({ stationId: r.stationId, value: r.value!, unit: r.unit }, gauges)[0];
    if (!gauge) continue;
    plan.push({
      jobId: r.jobId,
      stationId: r.stationId,
      value: r.value ?? null,
      unit: r.unit,
      instrumentId: gauge.id,
      ...(r.lubricant ? { lubricant: r.lubricant } : {}),
    });
    if (plan.length === count) return plan;
  }
  throw new Error(`${jobIds.length} jobs hold only ${plan.length} readings the shop's gauges can take`);
}

/**
 * The same readings (ids and all) for another set-up's jobs and gauges, matched by job code and by
 * gauge serial (a Galera cluster numbers rows differently from one node).
 */
export function forJobs(
  payloads: PushReadingInput[],
  from: { jobs: Record<string, number>; gauges: BenchInstrument[] },
  to: { jobs: Record<string, number>; gauges: BenchInstrument[] },
): PushReadingInput[] {
  const codeOf = new Map(Object.entries(from.jobs).map(([code, id]) => [id, code]));
  const serialOf = new Map(from.gauges.map((g) => [g.id, g.serial]));
  const gaugeBySerial = new Map(to.gauges.map((g) => [g.serial, g.id]));
  return payloads.map((p) => ({
    ...p,
    jobId: to.jobs[codeOf.get(p.jobId)!],
    ...(p.instrumentId ? { instrumentId: gaugeBySerial.get(serialOf.get(p.instrumentId)!) } : {}),
  }));
}

/** Readings as a tablet sends them: its own ids, the time taken. */
export function asPush(plan: NewReading[], takenAt = TAKEN_AT): PushReadingInput[] {
  return plan.map((r) => ({ ...r, id: randomUUID(), entryMode: "direct", takenAt }));
}

export interface PushTiming {
  ms: number;
  status: number;
  accepted: number;
}

/** One POST /api/sync as the tablet sends it (cookie, its page's origin); no retry. */
export async function pushOnce(
  base: string,
  origin: string,
  cookie: string,
  deviceId: string,
  readings: PushReadingInput[],
): Promise<PushTiming> {
  const t0 = performance.now();
  const res = await fetch(`${base}/api/sync`, {
    method: "POST",
    headers: { "content-type": "application/json", cookie, origin },
    body: JSON.stringify({ deviceId, readings }),
  });
  const body = (await res.json().catch(() => ({}))) as { results?: PushResult[] };
  const accepted = (body.results ?? []).filter((r) => r.status === "accepted").length;
  return { ms: performance.now() - t0, status: res.status, accepted };
}

/** Sends each tablet's readings in batches of `batch`, tablets side by side; throws unless all accepted. */
export async function pushAllPlain(
  base: string,
  origin: string,
  cookie: string,
  perTablet: PushReadingInput[][],
  batch = 100,
): Promise<void> {
  await Promise.all(
    perTablet.map(async (readings, t) => {
      for (let i = 0; i < readings.length; i += batch) {
        const part = readings.slice(i, i + batch);
        const r = await pushOnce(base, origin, cookie, `reference-${t + 1}`, part);
        if (r.status !== 200 || r.accepted !== part.length)
          throw new Error(`reference push answered ${r.status}, ${r.accepted}/${part.length} accepted`);
      }
    }),
  );
}
