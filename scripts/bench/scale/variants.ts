// The kinds of job a busy shop's history holds (benchmark data only, invented figures): each
// variant is one job's life on the bench, sent through the real ingest once (templates.ts) and
// copied to many jobs by the bulk loader (load.ts). Figures come from scripts/bench/sync-readings.ts.
import { randomUUID } from "node:crypto";
import { benchRoute } from "@/lib/domain";
import type { JobStatus } from "@/lib/domain";
import type { PushReadingInput } from "@/lib/schemas/sync";
import { V8, lcg, valueFor } from "../sync-readings";

export type Variant = {
  id: number;
  /** The status the job ends in; the readings are taken while it is "measuring". */
  status: JobStatus;
  /** Share of the route measured in the first pass (0 for a job still at intake). */
  fill: number;
  /** The machined sections measured again after machining (finished sizes). */
  secondPass: boolean;
  /** Share of the open flags the lead decides after the first pass; the rest wait. */
  decideShare: number;
  /** Whether the lead accepts whatever is still open at the end (a job ready for release). */
  settle: boolean;
  seed: number;
};

// Sections a shop machines and measures again to the finished size.
const MACHINED = /^(bore|main|rod|deck)\//;
const STEP_MS = 20_000; // a reading every 20 s on the bench

const variant = (id: number, status: JobStatus, fill: number, more: Partial<Variant> = {}): Variant => ({
  id,
  status,
  fill,
  secondPass: false,
  decideShare: 0,
  settle: false,
  seed: 7919 * (id + 1),
  ...more,
});

/**
 * Finished jobs (released, closed, in review) have every flag decided; released and closed ones
 * are signed by the inspector. Four closed jobs in ten had their bores, journals and deck machined
 * and measured again (second pass); the rest were measured once. Work in hand is partly measured.
 */
export const VARIANTS: Variant[] = [
  ...Array.from({ length: 10 }, (_, i) => variant(i, "closed", 1, { secondPass: i < 4, decideShare: 1, settle: true })),
  ...Array.from({ length: 3 }, (_, i) => variant(10 + i, "review", 1, { secondPass: true, decideShare: 0.6 })),
  ...[0.15, 0.35, 0.55, 0.8, 1].map((fill, i) => variant(13 + i, "measuring", fill, { decideShare: 0.5 })),
  variant(18, "intake", 0),
  ...[true, false].map((secondPass, i) => variant(19 + i, "released", 1, { secondPass, decideShare: 1, settle: true })),
];

/** Whether a variant's job is signed (released, then perhaps closed). */
export const isSigned = (v: Variant) => v.status === "released" || v.status === "closed";

/**
 * The status of the k-th job (oldest first) of a shop of n jobs: old work is closed, the last few
 * signed jobs wait to be collected (released), new work is in hand.
 */
export function statusAt(k: number, n: number): JobStatus {
  const age = 1 - k / n; // 1 = oldest
  if (age > 0.16) return "closed";
  if (age > 0.12) return "released";
  if (age > 0.08) return "review";
  if (age > 0.02) return "measuring";
  return "intake";
}

const ROUTE = benchRoute(V8).sections.flatMap((s) => s.stations);

/** The gauge a reading names (of the job's shop, suited to the station and value). */
export type GaugePick = (stationId: string, value: number, unit: string) => number;

function input(
  jobId: number,
  stationId: string,
  unit: string,
  value: number,
  torque: boolean,
  at: number,
  gauge: GaugePick,
) {
  return {
    id: randomUUID(),
    jobId,
    stationId,
    value,
    unit: unit as PushReadingInput["unit"],
    entryMode: "direct" as const,
    instrumentId: gauge(stationId, value, unit),
    takenAt: new Date(at).toISOString(),
    ...(torque ? { lubricant: "engine-oil" as const } : {}),
  };
}

/**
 * The readings of a variant for a job, in bench order, taken every 20 s ending at `endAt`: the
 * first pass over `fill` of the route, then (secondPass) the machined sections again.
 */
export function passes(
  v: Variant,
  jobId: number,
  endAt: number,
  gauge: GaugePick,
): { first: PushReadingInput[]; second: PushReadingInput[] } {
  const rnd = lcg(v.seed);
  const firstStations = ROUTE.slice(0, Math.round(v.fill * ROUTE.length));
  const secondStations = v.secondPass ? ROUTE.filter((s) => MACHINED.test(s.id)) : [];
  let at = endAt - (firstStations.length + secondStations.length + 1) * STEP_MS;
  const take = (st: (typeof ROUTE)[number]) =>
    input(jobId, st.id, st.unit, valueFor(st.id, rnd), st.torque, (at += STEP_MS), gauge);
  return { first: firstStations.map(take), second: secondStations.map(take) };
}

/** Whether a station is machined (its flag asks to machine again) or only measured again. */
export const isMachined = (stationId: string) => MACHINED.test(stationId);
