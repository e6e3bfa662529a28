import "server-only";
import {
  CHARACTERISTICS,
  LUBRICANT_LABELS,
  READING_PRECISION,
  columnFigure,
  dialDiameter,
  evaluateReading,
  gaugeRefusal,
  implausibleReason,
  parseStationId,
  quantityOfUnit,
  unitWords,
} from "@/lib/domain";
import type { FieldErrors } from "@/lib/schemas/errors";
import type { PushReading, ReadingEvaluation, RejectCode } from "@/lib/schemas/sync";
import {
  canonicalValue,
  gaugePastDue,
  round6,
  storedEvaluation,
  toRaw,
  type InstrumentInfo,
} from "@/lib/server/sync/ingest-evaluate";
import type { JobContext } from "@/lib/server/jobs/context";
import type { StoredReading } from "@/lib/schemas/readings";

// The per-reading checks of POST /api/sync, run inside the batch's transaction with the jobs
// locked, so what is checked is what gets written. Each check says what to fix, by field.

export type BatchJob = JobContext & { routeIds: Set<string>; lockReason: string | null };
export type BatchContext = {
  shopId: number;
  userId: number;
  deviceId: string;
  now: Date;
  jobs: Map<number, BatchJob>;
  instruments: Map<number, InstrumentInfo>;
  /** Readings already stored under the batch's ids (any shop). */
  existing: Map<string, StoredReading>;
  /** Readings the batch's `supersedes` point at, stored or earlier/later in this batch. */
  targets: Map<string, Pick<StoredReading, "shopId" | "jobId" | "stationId">>;
};
export type Checked =
  | { kind: "new"; row: StoredReading; evaluation: ReadingEvaluation }
  | { kind: "replay"; stored: StoredReading }
  | { kind: "rejected"; code: RejectCode; reason: string; errors?: FieldErrors };

/** The row this item would be stored as (verdict fields filled in later). */
export function rowOf(item: PushReading, bc: BatchContext, characteristic: string): StoredReading {
  const skipped = !!item.skipped;
  const value = skipped ? null : (item.value ?? null);
  return {
    id: item.id,
    shopId: bc.shopId,
    jobId: item.jobId,
    stationId: item.stationId,
    characteristic,
    value,
    unit: item.unit,
    valueCanonical: value === null ? null : canonicalValue(value, item.unit),
    entryMode: item.entryMode,
    dialSetting: item.dialSetting ?? null,
    dialDeviation: item.dialDeviation ?? null,
    instrumentId: item.instrumentId ?? null,
    partTempC: item.partTempC ?? null,
    gaugeTempC: item.gaugeTempC ?? null,
    lubricant: item.lubricant ?? null,
    skipped,
    skipReason: skipped ? (item.skipReason ?? null) : null,
    note: item.note ?? null,
    takenBy: bc.userId,
    takenAt: new Date(item.takenAt),
    receivedAt: bc.now,
    deviceId: bc.deviceId,
    supersedes: item.supersedes ?? null,
    verdict: null,
    verdictNote: null,
    limitMin: null,
    limitMax: null,
    deviation: null,
  };
}

const PAYLOAD = [
  "jobId",
  "stationId",
  "unit",
  "entryMode",
  "instrumentId",
  "lubricant",
  "skipped",
  "skipReason",
  "supersedes",
  "note",
] as const;
const NUMBERS = ["value", "dialSetting", "dialDeviation", "partTempC", "gaugeTempC"] as const;

const sameFigure = (k: (typeof NUMBERS)[number], a: number | null, b: number | null) =>
  a === null || b === null ? a === b : columnFigure(a, READING_PRECISION[k]) === columnFigure(b, READING_PRECISION[k]);

/**
 * True when a resent reading carries the same figures as the stored one (who sent it does not
 * matter), compared in the stored form: text is canonical already (the schema made it so), figures
 * as their columns keep them, times to the millisecond.
 */
export function samePayload(
  a: Pick<StoredReading, (typeof PAYLOAD)[number] | (typeof NUMBERS)[number] | "takenAt">,
  b: typeof a,
): boolean {
  return (
    PAYLOAD.every((k) => (a[k] ?? null) === (b[k] ?? null)) &&
    NUMBERS.every((k) => sameFigure(k, a[k] ?? null, b[k] ?? null)) &&
    a.takenAt.getTime() === b.takenAt.getTime()
  );
}

/**
 * The gauge a reading names: of this shop, of a kind that measures the station, its range holding
 * the value (the core's gaugeRefusal, the tablet's words). A skip names none and needs none.
 */
function checkGauge(item: PushReading, bc: BatchContext, add: (f: string, m: string) => void) {
  const inst = item.instrumentId === undefined ? undefined : bc.instruments.get(item.instrumentId);
  if (item.instrumentId !== undefined && !inst) {
    add("instrumentId", `No gauge with id ${item.instrumentId} in this shop; pick one from the gauge list`);
    return undefined;
  }
  if (item.skipped || typeof item.value !== "number") return inst;
  const use = { stationId: item.stationId, value: item.value, unit: item.unit };
  const why = gaugeRefusal(use, inst, [...bc.instruments.values()]);
  if (why) add("instrumentId", why);
  return why ? undefined : inst;
}

function checkDial(item: PushReading, inst: InstrumentInfo | undefined, add: (f: string, m: string) => void) {
  if (item.entryMode !== "dial" || !inst || item.dialSetting === undefined || item.dialDeviation === undefined) return;
  let expected: number;
  try {
    expected = dialDiameter({
      setting: item.dialSetting,
      deviation: item.dialDeviation,
      plusMeansSmaller: inst.dialPlusMeansSmaller,
    });
  } catch (err) {
    return add("dialDeviation", (err as Error).message);
  }
  if (round6(expected) !== round6(item.value)) {
    const sign = inst.dialPlusMeansSmaller ? "plus means a smaller bore" : "plus means a larger bore";
    add(
      "value",
      `Setting ${item.dialSetting} with a dial reading of ${item.dialDeviation} gives ${expected} ${item.unit} ` +
        `on gauge '${inst.label}' (${sign}), not ${item.value}; ` +
        "check the gauge's sign setting and enter the reading again",
    );
  }
}

function checkCorrection(item: PushReading, bc: BatchContext, job: BatchJob, add: (f: string, m: string) => void) {
  if (!item.supersedes) return;
  const target = bc.targets.get(item.supersedes);
  if (!target || target.shopId !== bc.shopId || target.jobId !== item.jobId) {
    return add(
      "supersedes",
      `The reading this corrects (${item.supersedes}) is not on job ${job.job.code}; correct a reading of this job`,
    );
  }
  if (target.stationId !== item.stationId) {
    add(
      "supersedes",
      `It corrects a reading at ${target.stationId}, but this one is at ${item.stationId}; a correction is taken at the same station`,
    );
  }
}

function checkFigures(item: PushReading, bc: BatchContext, job: BatchJob, add: (f: string, m: string) => void) {
  const characteristic = parseStationId(item.stationId).characteristic!;
  const info = CHARACTERISTICS[characteristic];
  if (!job.routeIds.has(item.stationId)) {
    add(
      "stationId",
      `Station '${item.stationId}' is not on job ${job.job.code}'s engine ` +
        `(${job.shape.cylinders} cylinders, ${job.shape.mains} mains); pick a station from the route`,
    );
  }
  const unitKind = quantityOfUnit(item.unit);
  if (unitKind !== info.kind) {
    add(
      "unit",
      `${info.label} is a ${info.kind}: use ${info.kind === "length" ? "in or mm" : "lbf·ft or N·m"}, ` +
        `not ${unitWords(item.unit)}`,
    );
  }
  if (info.kind === "torque" && !item.lubricant && !item.skipped) {
    add(
      "lubricant",
      `Say which lubricant was on the threads and under the head (${Object.values(LUBRICANT_LABELS).join(", ")})`,
    );
  }
  let inst: InstrumentInfo | undefined;
  if (unitKind === info.kind) {
    // A figure that cannot be real is fixed first; which gauge holds it is asked after.
    const why = item.skipped
      ? undefined
      : implausibleReason(item.stationId, item.value as number, item.unit, job.shape);
    if (why) add("value", why);
    else inst = checkGauge(item, bc, add);
  }
  checkDial(item, inst, add);
  checkCorrection(item, bc, job, add);
  return { characteristic, inst };
}

/** Checks one parsed reading of the batch against its (locked) job, the gauges and what is stored. */
export function checkItem(item: PushReading, bc: BatchContext): Checked {
  const job = bc.jobs.get(item.jobId);
  if (!job)
    return {
      kind: "rejected",
      code: "not_found",
      reason: `Job ${item.jobId} not found`,
      errors: { jobId: [`Job ${item.jobId} not found`] },
    };
  const stored = bc.existing.get(item.id);
  if (stored) {
    const mine = stored.shopId === bc.shopId && samePayload(stored, rowOf(item, bc, stored.characteristic));
    if (mine) return { kind: "replay", stored };
    const reason =
      `Reading ${item.id} is already stored with other figures; nothing was overwritten. ` +
      "Send a correction as a new reading that supersedes it";
    return { kind: "rejected", code: "conflict", reason, errors: { id: [reason] } };
  }
  if (job.lockReason)
    return { kind: "rejected", code: "job_locked", reason: job.lockReason, errors: { jobId: [job.lockReason] } };
  const errors: FieldErrors = {};
  const add = (f: string, m: string) => void (errors[f] ??= []).push(m);
  const { characteristic, inst } = checkFigures(item, bc, job, add);
  const row = rowOf(item, bc, characteristic);
  let evaluation = storedEvaluation(null, item.unit, false);
  if (Object.keys(errors).length === 0 && !row.skipped) {
    try {
      const pastDue = gaugePastDue(inst, row.takenAt);
      const ev = evaluateReading(toRaw(row, inst), job.shape, job.spec);
      evaluation = storedEvaluation(ev, item.unit, pastDue, { inst, takenAt: row.takenAt });
    } catch (err) {
      add("value", (err as Error).message);
    }
  }
  if (Object.keys(errors).length) {
    // In words only: the tablet shows the reason as it is (field names stay in `errors`).
    const reason = Object.values(errors).flat().join("; ");
    // Only the gauge is wrong: its own code, so the tablet can say "pick another gauge".
    const code = Object.keys(errors).join() === "instrumentId" ? "wrong_gauge" : "invalid";
    return { kind: "rejected", code, reason, errors };
  }
  const { unit: _u, ...verdictFields } = evaluation;
  return { kind: "new", row: { ...row, ...verdictFields }, evaluation };
}
