import { z } from "zod";
import { storedText } from "./stored-text";
import { VERDICT_WORDS, VERDICTS, type Verdict } from "@/lib/domain";
import { FLAG_REASONS, type Disposition, type FlagReason, type FlagState } from "@/lib/schemas/enums";

// The lead's decisions about a flag, and the flag queue's query: one schema for the disposition
// form and POST /api/flags/[flagId]/disposition, one for the queue's URL and GET /api/flags.

/** Common machining operations offered as choices; the lead may also type another. */
export const MACHINE_OPERATIONS = [
  "hone",
  "bore oversize and hone",
  "grind undersize",
  "polish journal",
  "align-hone",
  "resurface deck",
  "resize rod big end",
] as const;

const note = storedText("The note", "The note must be text")
  .trim()
  .max(1000, "Keep the note under 1000 characters")
  .optional()
  .transform((s) => (s ? s : undefined));

export const dispositionSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("measure_again"), note }),
    z.object({
      kind: z.literal("machine_again"),
      operation: storedText("The operation", "Name the operation, e.g. hone, grind undersize or align-hone")
        .trim()
        .min(1, "Name the operation, e.g. hone, grind undersize or align-hone")
        .max(120, "Keep the operation under 120 characters"),
      note,
    }),
    z.object({
      kind: z.literal("accept"),
      reason: storedText("The reason", "Write why this value is accepted as it is")
        .trim()
        .min(1, "Write why this value is accepted as it is: an acceptance without a reason is not recorded")
        .max(2000, "Keep the reason under 2000 characters"),
    }),
  ],
  { error: "Choose what to do: measure_again, machine_again or accept" },
);

export type DispositionInput = z.output<typeof dispositionSchema>;

export const DISPOSITION_WORDS: Record<Disposition, string> = {
  measure_again: "Measure again",
  machine_again: "Machine again",
  accept: "Accepted as is",
};

/** Why a flag was raised, short (a tag, a list cell): a verdict's own words, or the gauge's state. */
export const REASON_TAG_WORDS: Record<FlagReason, string> = {
  out_of_spec: VERDICT_WORDS.out_of_spec,
  marginal: VERDICT_WORDS.marginal,
  gauge_past_due: "Gauge past calibration due",
  gauge_study_failed: "Gauge failed its study for this tolerance",
  gauge_study_due: "Gauge study past due",
};

/** Why a flag was raised, with what marginal means (filters, a tag's tooltip). */
export const REASON_WORDS: Record<FlagReason, string> = {
  ...REASON_TAG_WORDS,
  marginal: `${VERDICT_WORDS.marginal} (within U of a limit)`,
};

export const STATE_WORDS: Record<FlagState, string> = { open: "Open", disposed: "Decided", closed: "Closed" };

export const FLAG_SORTS = ["age", "job", "station", "value", "deviation", "verdict", "reason", "state"] as const;
export type FlagSort = (typeof FLAG_SORTS)[number];
export const FLAG_STATE_FILTERS = ["open", "disposed", "active", "closed", "all"] as const;
export type FlagStateFilter = (typeof FLAG_STATE_FILTERS)[number];

// An empty query parameter (?verdict=) means "no filter".
const blank = (v: unknown) => (v === "" || v === null ? undefined : v);

export const flagListQuerySchema = z.object({
  page: z.preprocess(
    blank,
    z.coerce
      .number({ error: "page must be a whole number from 1" })
      .int("page must be a whole number from 1")
      .min(1, "page must be a whole number from 1")
      .default(1),
  ),
  pageSize: z.preprocess(
    blank,
    z.coerce
      .number({ error: "pageSize must be 1 to 100" })
      .int("pageSize must be 1 to 100")
      .min(1, "pageSize must be 1 to 100")
      .max(100, "pageSize must be 1 to 100")
      .default(25),
  ),
  sort: z.preprocess(
    blank,
    z.enum(FLAG_SORTS, { error: `sort must be one of ${FLAG_SORTS.join(", ")}` }).default("age"),
  ),
  dir: z.preprocess(blank, z.enum(["asc", "desc"], { error: "dir must be asc or desc" }).default("desc")),
  state: z.preprocess(
    blank,
    z.enum(FLAG_STATE_FILTERS, { error: `state must be one of ${FLAG_STATE_FILTERS.join(", ")}` }).default("active"),
  ),
  job: z.preprocess(
    blank,
    z.coerce
      .number({ error: "job must be a job id" })
      .int("job must be a job id")
      .positive("job must be a job id")
      .optional(),
  ),
  verdict: z.preprocess(
    blank,
    z.enum(VERDICTS, { error: "verdict must be in_spec, marginal or out_of_spec" }).optional(),
  ),
  reason: z.preprocess(
    blank,
    z.enum(FLAG_REASONS, { error: `reason must be one of ${FLAG_REASONS.join(", ")}` }).optional(),
  ),
});
export type FlagListQuery = z.output<typeof flagListQuerySchema>;

export type GaugeRef = { id: number; label: string; serial: string; calibrationDue: string | null };

/** One row of the flag queue. Dates are ISO strings; value, limits and deviation are in `unit`. */
export type FlagListItem = {
  id: number;
  jobId: number;
  jobCode: string;
  jobTitle: string;
  stationId: string;
  station: string;
  characteristic: string;
  characteristicLabel: string;
  derived: boolean;
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
  disposedBy: string | null;
  disposedAt: string | null;
  closedAt: string | null;
  gauge: GaugeRef | null;
  takenBy: string | null;
  takenAt: string | null;
  createdAt: string;
  /**
   * What the flag's age counts from: when the reading it judges was taken (a computed value's
   * flag, which judges no one reading, counts from when it was raised). The queue sorts by it.
   */
  judgedAt: string;
};

export type FlagPage = { items: FlagListItem[]; total: number; page: number; pageSize: number; pageCount: number };

export type Photo = { id: string; name: string; contentType: string; url: string; thumbUrl: string | null };

export type HistoryReading = {
  id: string;
  value: number | null;
  unit: string;
  verdict: Verdict | null;
  verdictNote: string | null;
  skipped: boolean;
  skipReason: string | null;
  note: string | null;
  takenAt: string;
  takenBy: string | null;
  gauge: GaugeRef | null;
  supersedes: string | null;
  supersededBy: string | null;
  /** The station's figure now (latest, not corrected by another). */
  current: boolean;
  /** The reading this flag is about. */
  flagged: boolean;
  photos: Photo[];
};

export type DerivedFigure = {
  key: string;
  label: string;
  value: number | null;
  unit: string;
  min: number | null;
  max: number | null;
  verdict: Verdict | null;
  missing: string[];
};

export type DispositionEntry = {
  id: number;
  disposition: Disposition;
  operation: string | null;
  reason: string | null;
  by: string;
  at: string;
};

export type FlagDetail = {
  flag: FlagListItem & { closedByReadingId: string | null };
  job: { id: number; code: string; title: string; status: string; unitSystem: string; locked: boolean };
  stations: { stationId: string; words: string; readings: HistoryReading[] }[];
  derived: DerivedFigure[];
  dispositions: DispositionEntry[];
};
