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
//                                              (keys "_", "deviceId", "readings"), or the database refused
//                                              a value the schema let through (a field name, or "_"):
//                                              NOTHING was written; send the readings one at a time
//   503 unavailable + Retry-After (s)          the server cannot reach its database: nothing written; send
//                                              again no sooner than `error.retryAfter` seconds (429 likewise)
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
//   Canonical form (what is stored, and what a resend is compared in, so an exact resend is a replay):
//     text (deviceId, note, skipReason): line ends LF, Unicode NFC; refused (`invalid`, by field) when it
//       holds a lone surrogate or a control character other than tab and line feed;
//     figures: kept exactly, never rounded: refused when they carry more places than their column keeps
//       (value, dialSetting, dialDeviation 6; partTempC, gaugeTempC 2) or reach 10^8 (temperatures: the
//       -30..150 °C range), in every entry mode (READING_PRECISION in lib/domain/stored-figures.ts);
//     takenAt: to the millisecond, between the years 1970 and 9000.
//   `cursor` in push replies is informational (the shop's newest change number after the write); never
//   replace your pull cursor with it, or you may skip other devices' changes.
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
//   Cursor: the shop's change number of the last row sent. Numbers follow commit order on every
//   database node, so "after the cursor" never skips a change that commits late nor repeats one.
//   `more: true` → call again at once with the cursor. A cursor from before (a change-feed id) is still
//   accepted: it means the same point.
//   When you add a job pack to the device, set the device cursor to min(yours, pack.cursor).
//
// GET /api/bench/jobs  (machinist, lead) → { jobs: BenchJobSummary[] } open jobs (intake, measuring, review)
// GET /api/bench/jobs/:jobId  (machinist, lead) → JobPack, everything the tablet stores to work offline.
import { z } from "zod";
import { ENTRY_MODES, LUBRICANT_LABELS, MEASURE_UNITS, READING_PRECISION, parseStationId } from "@/lib/domain";
import type { Lubricant, Verdict } from "@/lib/domain";
import type { FieldErrors } from "./errors";
import { SKIP_REASON_MAX, skipReasonTooLong } from "./text-limits";
import { keptBy } from "./stored-figure";
import { storedText } from "./stored-text";

export { TAKEN_BY_HEADER } from "./sync-headers";
export type * from "./sync-pack";
export const MAX_BATCH = 500;
export const LUBRICANTS = Object.keys(LUBRICANT_LABELS) as [Lubricant, ...Lubricant[]];

/** A figure refused when its readings column cannot keep it exactly (lib/domain/stored-figures.ts). */
const kept = (field: keyof typeof READING_PRECISION, what: string) => keptBy(READING_PRECISION[field], what);

const temperature = (field: "partTempC" | "gaugeTempC", what: string) =>
  z
    .number(`${what} must be a number in °C`)
    .min(-30, { message: `${what} below -30 °C cannot be right; check it`, abort: true })
    .max(150, { message: `${what} above 150 °C cannot be right; let the part cool and measure again`, abort: true })
    .superRefine(kept(field, what));

// The earliest and latest takenAt the readings table keeps (DATETIME holds years 1000 to 9999).
const TAKEN_FROM = Date.UTC(1970, 0, 1);
const TAKEN_UNTIL = Date.UTC(9000, 0, 1);

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
    // Ids in their canonical (lower-case) spelling: the database compares them case-blind.
    id: z.uuidv4("The reading id must be a UUID v4 made on the tablet").toLowerCase(),
    jobId: z
      .number("Job id must be a number")
      .int("Job id must be a whole number")
      .positive("Job id must be a whole number"),
    stationId,
    value: z
      .number("Enter the value as a number")
      .finite("Enter the value as a number")
      .superRefine(kept("value", "The value"))
      .nullable()
      .optional(),
    unit: z.enum(MEASURE_UNITS, "Unit must be in, mm, lbf_ft or nm"),
    entryMode: z.enum(ENTRY_MODES, "Entry mode must be direct or dial").default("direct"),
    // Checked in every entry mode: a direct reading that carries them stores them too.
    dialSetting: z
      .number("Dial setting must be a number")
      .positive("The setting size must be above zero")
      .superRefine(kept("dialSetting", "The setting size"))
      .optional(),
    dialDeviation: z
      .number("Dial reading must be a number")
      .finite("Dial reading must be a number")
      .superRefine(kept("dialDeviation", "The dial reading"))
      .optional(),
    instrumentId: z.number("Gauge id must be a number").int().positive().optional(),
    partTempC: temperature("partTempC", "Part temperature").optional(),
    gaugeTempC: temperature("gaugeTempC", "Gauge temperature").optional(),
    lubricant: z.enum(LUBRICANTS, `Lubricant must be one of ${LUBRICANTS.join(", ")}`).optional(),
    skipped: z.boolean().optional(),
    skipReason: storedText("The skip reason")
      .trim()
      .max(SKIP_REASON_MAX, { error: (iss) => skipReasonTooLong(String(iss.input ?? "").trim().length) })
      .optional(),
    supersedes: z.uuid("supersedes must be the id of the reading this one corrects").toLowerCase().optional(),
    note: storedText("The note").max(500, "Keep the note under 500 characters").optional(),
    takenAt: z.iso
      .datetime({ offset: true, message: "takenAt must be an ISO date-time such as 2026-12-01T09:30:00Z" })
      .refine((at) => Date.parse(at) >= TAKEN_FROM && Date.parse(at) < TAKEN_UNTIL, {
        message: "takenAt must lie between the years 1970 and 9000; check the tablet's clock",
      }),
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
  deviceId: storedText("deviceId", "deviceId is needed (the tablet's id)")
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
