// The bench sync contract, shared by the tablet (lib/offline) and the server (app/api/sync, app/api/bench).
//
// POST /api/sync  (roles: machinist, lead)   body: PushBatch
//   200 { results: PushResult[], cursor }      every reading was stored (or already was: replay)
//   400 bad_json                               the body is not JSON
//   401 unauthorized / 403 forbidden           signed out / another role (inspector, admin)
//   409 conflict, no `results`                 header TAKEN_BY_HEADER names someone other than the
//                                              signed-in user (the browser was signed in as someone else
//                                              since): nothing written; sign in as that person to send
//   413 payload_too_large                      more than MAX_BATCH readings: split the batch and send again
//   422 invalid, no `results`                  the batch itself is malformed (not an object, no deviceId,
//                                              readings not an array): `error.fields` says where
//                                              (keys "_", "deviceId", "readings")
//   422 invalid + `results`                    one or more readings were refused. NOTHING was written.
//   409 job_locked + `results`                 same, and every refused reading is for a released/closed job
//     Error replies carry `{ error: { code, message, fields }, results, cursor }`; fields are keyed
//     "readings.<index>.<field>". Each result says what happened to its reading:
//       accepted  the server holds it (a replay of a stored reading is accepted again: `replay: true`)
//       rejected  fix it (`errors` by field, `reason` in words, `code`); keep it on the tablet, marked
//       held      it was fine but not written because another reading in the batch was refused:
//                 send it again (alone or with the others fixed) — the all-or-nothing rule below.
//   Rule: the server checks EVERY reading (shape, job of this shop, job not locked, station on the
//   engine's route, unit, physical range, lubricant on torque, gauge (named, of a suitable kind, its
//   range holding the value: code wrong_gauge when only that is wrong), dial arithmetic, id conflicts)
//   inside one transaction, and writes only when all pass; otherwise it rolls back and answers 422/409.
//   A reading for another shop's job gets code not_found ("Job 42 not found"), same as a missing job.
//   Verdicts are recomputed on the server with lib/domain; the tablet's preview is never trusted.
//   Same id + same payload = no-op (accepted, replay). Same id + different payload = rejected `conflict`
//   (a correction is a NEW reading with `supersedes: <old id>`; nothing is ever overwritten).
//   `cursor` in push replies is informational (the newest change-feed id of the batch's jobs after the
//   write); never replace your pull cursor with it, or you may skip other devices' changes.
//   Each result also carries `index` (its position in the batch); `id` is null only when the item had no
//   usable id string. A repeated id in one batch with the same figures is stored once (both accepted).
//   Dial mode: `value` is the diameter the tablet computed (dialDiameter in lib/domain) from dialSetting
//   and dialDeviation with the gauge's dialPlusMeansSmaller; the server recomputes it and refuses a mismatch.
//
// GET /api/sync?since=CURSOR&jobs=1,2,3  (roles: machinist, lead)  → SyncFeed
//   What changed for those jobs since CURSOR (omit `since` or use "0" for everything): readings from any
//   device (incl. your own echo; upsert by id), flags with their latest disposition, new limits when the
//   job's specRevision moved, and (on every call) the header of each job asked for (status, locked,
//   lockReason, specRevision), so a release reaches the tablet even without a change. Every entry is the entity's CURRENT
//   state, so applying one twice is harmless. Unknown ids and other shops' ids come back in `missing`.
//   Cursor: the id of the last change-feed row that is settled. A row is settled once it is older than
//   SETTLE_MS; changes newer than that are sent too but the cursor stops before them, so the next call
//   sends them again (dedupe by id). This is how a change whose transaction commits out of order (a lower
//   id committing after a higher one) is never skipped. `more: true` → call again at once with the cursor.
//   When you add a job pack to the device, set the device cursor to min(yours, pack.cursor).
//
// GET /api/bench/jobs  (machinist, lead) → { jobs: BenchJobSummary[] } open jobs (intake, measuring, review)
// GET /api/bench/jobs/:jobId  (machinist, lead) → JobPack, everything the tablet stores to work offline.
import { z } from "zod";
import { ENTRY_MODES, LUBRICANT_LABELS, MEASURE_UNITS, parseStationId } from "@/lib/domain";
import type { BenchRoute, EngineShape, JobStatus, Lubricant, SpecLimit, Verdict } from "@/lib/domain";
import type { Disposition, FlagReason, FlagState, UnitSystem } from "./enums";
import type { FieldErrors } from "./errors";
import type { StoredReading } from "@/lib/schemas/readings";
import { SKIP_REASON_MAX, skipReasonTooLong } from "./text-limits";

export { TAKEN_BY_HEADER } from "./sync-headers";
export const MAX_BATCH = 500;
/** Feed rows younger than this are re-sent on the next pull (see the cursor above). */
export const SETTLE_MS = 15_000;
export const LUBRICANTS = Object.keys(LUBRICANT_LABELS) as [Lubricant, ...Lubricant[]];

const temperature = (what: string) =>
  z
    .number(`${what} must be a number in °C`)
    .min(-30, `${what} below -30 °C cannot be right; check it`)
    .max(150, `${what} above 150 °C cannot be right; let the part cool and measure again`);

const stationId = z
  .string("Pick a station")
  .min(1, "Pick a station")
  .max(64, "Station id is too long")
  .superRefine((id, ctx) => {
    try {
      const p = parseStationId(id);
      if (!p.characteristic)
        ctx.addIssue({
          code: "custom",
          message: `'${id}' names a part; readings are taken at stations such as 'bore/1/top/A'`,
        });
    } catch (err) {
      ctx.addIssue({ code: "custom", message: err instanceof Error ? err.message : String(err) });
    }
  });

/** One reading as the tablet queues it. `value` is in `unit`, exactly as entered (or the dial's diameter). */
export const pushReadingSchema = z
  .object({
    id: z.uuidv4("The reading id must be a UUID v4 made on the tablet"),
    jobId: z
      .number("Job id must be a number")
      .int("Job id must be a whole number")
      .positive("Job id must be a whole number"),
    stationId,
    value: z.number("Enter the value as a number").finite("Enter the value as a number").nullable().optional(),
    unit: z.enum(MEASURE_UNITS, "Unit must be in, mm, lbf_ft or nm"),
    entryMode: z.enum(ENTRY_MODES, "Entry mode must be direct or dial").default("direct"),
    dialSetting: z.number("Dial setting must be a number").positive("The setting size must be above zero").optional(),
    dialDeviation: z.number("Dial reading must be a number").finite().optional(),
    instrumentId: z.number("Gauge id must be a number").int().positive().optional(),
    partTempC: temperature("Part temperature").optional(),
    gaugeTempC: temperature("Gauge temperature").optional(),
    lubricant: z.enum(LUBRICANTS, `Lubricant must be one of ${LUBRICANTS.join(", ")}`).optional(),
    skipped: z.boolean().optional(),
    skipReason: z
      .string()
      .trim()
      .max(SKIP_REASON_MAX, { error: (iss) => skipReasonTooLong(String(iss.input ?? "").trim().length) })
      .optional(),
    supersedes: z.uuid("supersedes must be the id of the reading this one corrects").optional(),
    note: z.string().max(500, "Keep the note under 500 characters").optional(),
    takenAt: z.iso.datetime({ offset: true, message: "takenAt must be an ISO date-time such as 2026-12-01T09:30:00Z" }),
  })
  .superRefine((r, ctx) => {
    const add = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (r.skipped) {
      if (!r.skipReason) add("skipReason", "Say why the station was skipped");
      if (r.value !== undefined && r.value !== null)
        add("value", "A skipped station has no value; clear it or un-skip");
    } else if (r.value === undefined || r.value === null)
      add("value", "Enter a value, or skip the station with a reason");
    if (r.entryMode === "dial") {
      if (r.dialSetting === undefined) add("dialSetting", "Dial mode needs the setting size the gauge was zeroed on");
      if (r.dialDeviation === undefined) add("dialDeviation", "Dial mode needs the dial's reading");
      if (r.instrumentId === undefined)
        add("instrumentId", "Dial mode needs the gauge, because its sign convention decides the diameter");
    }
    if (r.supersedes && r.supersedes === r.id) add("supersedes", "A reading cannot correct itself");
  });
export type PushReading = z.output<typeof pushReadingSchema>;
export type PushReadingInput = z.input<typeof pushReadingSchema>;

/** The batch envelope: items are checked one by one (pushReadingSchema) so each gets its own result. */
export const pushBatchSchema = z.object({
  deviceId: z
    .string("deviceId is needed (the tablet's id)")
    .trim()
    .min(1, "deviceId is needed (the tablet's id)")
    .max(64, "deviceId is too long (64 characters at most)"),
  // The MAX_BATCH limit is checked by the server (413), so an oversize batch is told to split.
  readings: z.array(z.unknown(), "readings must be a list"),
});
export type PushBatch = { deviceId: string; readings: PushReadingInput[] };

/** wrong_gauge: only the gauge is refused (none named, a kind that cannot measure the station, or its
 * range does not hold the value); the reason says which gauge to pick. */
export type RejectCode = "invalid" | "not_found" | "job_locked" | "conflict" | "wrong_gauge";

/** The verdict as the server stored it; limits and deviation are in `unit` (the unit entered). */
export type ReadingEvaluation = {
  verdict: Verdict | null;
  /** 'gauge_past_due' when the gauge was past its calibration due date at takenAt. */
  verdictNote: string | null;
  unit: string;
  limitMin: number | null;
  limitMax: number | null;
  deviation: number | null;
};

export type PushResult =
  | {
      index: number;
      id: string;
      status: "accepted";
      replay: boolean;
      verdict: Verdict | null;
      evaluation: ReadingEvaluation;
    }
  | { index: number; id: string; status: "held" }
  | { index: number; id: string | null; status: "rejected"; code: RejectCode; reason: string; errors?: FieldErrors };

export type PushReply = { results: PushResult[]; cursor: string };
export type PushErrorReply = {
  error: { code: "invalid" | "job_locked"; message: string; fields: FieldErrors };
  results: PushResult[];
  cursor: string;
};

/** A stored reading, as the pack and the feed send it (no shop). Dates are ISO strings. */
export type ServerReading = Omit<StoredReading, "shopId" | "takenAt" | "receivedAt"> & {
  takenAt: string;
  receivedAt: string;
  /** The reading that corrects this one, if any: a superseded reading is history, not current. */
  supersededBy: string | null;
};

/** A flag that is not closed (or, in the feed, any flag's current state). */
export type BenchFlag = {
  id: number;
  jobId: number;
  readingId: string | null;
  /** `${characteristic}@${stationId}` of a derived value (e.g. main_oil_clearance@main-brg/2/front/A). */
  derivedKey: string | null;
  stationId: string;
  characteristic: string;
  value: number;
  unit: string;
  limitMin: number | null;
  limitMax: number | null;
  deviation: number | null;
  verdict: Verdict;
  reason: FlagReason;
  state: FlagState;
  disposition: Disposition | null;
  operation: string | null;
  dispositionReason: string | null;
  disposedAt: string | null;
  closedAt: string | null;
  createdAt: string;
  /** Stations to measure again for this flag (a derived value's inputs); mark them on the route. */
  stations: string[];
  /** True when the lead sent these stations back to the bench (measure again / machine again) and it is not closed. */
  revisit: boolean;
};

export type BenchJobHeader = {
  id: number;
  code: string;
  title: string;
  status: JobStatus;
  unitSystem: UnitSystem;
  locked: boolean;
  lockedAt: string | null;
  /** Why readings are refused, in words; null when open. */
  lockReason: string | null;
  specRevision: number;
  dueDate: string | null;
};

export type BenchJobSummary = BenchJobHeader & {
  customer: string;
  engine: string;
  /** Required stations done (lib/domain/progress.ts); null for a job with no engine. */
  progress: { done: number; required: number } | null;
  openFlags: number;
};

export type BenchInstrument = {
  id: number;
  kind: string;
  label: string;
  serial: string;
  unit: string;
  resolution: number;
  /** Expanded uncertainty U (k = coverageK, normally 2), in `unit`. */
  expandedU: number;
  coverageK: number;
  /** The measuring range in `unit`; null (or absent) on a gauge registered before ranges were kept. */
  rangeMin?: number | null;
  rangeMax?: number | null;
  calibrationDue: string | null;
  dialPlusMeansSmaller: boolean;
  active: boolean;
};

export type JobPack = {
  job: BenchJobHeader & { customer: string; engine: string };
  shape: EngineShape;
  spec: SpecLimit[];
  route: BenchRoute;
  instruments: BenchInstrument[];
  /** Every reading of the job, history included (supersededBy set on corrected ones). */
  readings: ServerReading[];
  /** Flags that are not closed, with their latest disposition. */
  flags: BenchFlag[];
  cursor: string;
};

export type SyncFeed = {
  cursor: string;
  more: boolean;
  jobs: BenchJobHeader[];
  limits: { jobId: number; specRevision: number; spec: SpecLimit[] }[];
  readings: ServerReading[];
  flags: BenchFlag[];
  /** Job ids asked for that this shop does not have (or no longer has). */
  missing: number[];
};

export const feedQuerySchema = z.object({
  since: z
    .string()
    .regex(/^\d{1,18}$/, "since must be a cursor from an earlier reply (digits)")
    .default("0"),
  jobs: z
    .string("jobs is needed: the job ids this device holds, e.g. jobs=1,2,3")
    .regex(/^\d{1,10}(,\d{1,10}){0,199}$/, "jobs must be job ids separated by commas (at most 200), e.g. jobs=1,2,3")
    .transform((s) => [...new Set(s.split(",").map(Number))]),
});
