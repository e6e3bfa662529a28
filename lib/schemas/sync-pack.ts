// What the tablet holds of the server's data: the job pack (GET /api/bench/jobs/:jobId), the sync
// feed (GET /api/sync) and their parts. The routes are described in lib/schemas/sync.ts, which
// re-exports these types.
import type { BenchRoute, EngineShape, GaugeStudySummary, JobStatus, SpecLimit, Verdict } from "@/lib/domain";
import type { Disposition, FlagReason, FlagState, UnitSystem } from "./enums";
import type { StoredReading } from "./readings";

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
  /**
   * The gauge's latest capability study (its repeatability joins the verdict's uncertainty, its
   * due date and pass marks decide the gauge's flags); null or absent: none on file.
   */
  study?: GaugeStudySummary | null;
};

/** The halves the lead chose for one bearing point, as the tablet shows them at its installed-bore stations. */
export type BenchBearing = {
  /** "main/3" or "rod/5" (lib/domain/bearing-points.ts). */
  point: string;
  upper: { shellId: number; words: string; place: string };
  lower: { shellId: number; words: string; place: string };
  /** Predicted installed clearance and its U (k = 2), in `unit`. */
  predicted: number | null;
  uncertainty: number | null;
  unit: UnitSystem;
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
  /** The saved bearing choice (absent in a pack stored before bearings travelled). */
  bearings?: BenchBearing[];
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
