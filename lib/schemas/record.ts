// The build record as the PDF and the customer's page print it: plain data, every figure
// already written out with its unit, so both layouts show the same words.
import type { ReleaseRecord, VerificationStatus } from "@/lib/schemas/release";
import type { Verdict } from "@/lib/domain";

export type Line = { label: string; value: string };

export type ReadingLine = {
  stationId: string;
  station: string;
  value: string;
  limits: string;
  deviation: string;
  verdict: Verdict | null;
  /** "Skipped", "No limit", when there is no verdict. */
  verdictWords: string;
  gauge: string;
  takenBy: string;
  takenAt: string;
  /** Part temperature, gauge past due, a correction, the machinist's note. */
  notes: string;
  photos: string[];
};

export type ReadingSection = { id: string; label: string; what: string; rows: ReadingLine[] };

export type DerivedLine = {
  key: string;
  what: string;
  station: string;
  value: string;
  limits: string;
  deviation: string;
  verdict: Verdict | null;
  verdictWords: string;
  from: string;
};

export type TorqueLine = {
  station: string;
  value: string;
  limits: string;
  verdict: Verdict | null;
  verdictWords: string;
  lubricant: string;
  gauge: string;
  takenBy: string;
  takenAt: string;
};

export type DecisionLine = { when: string; who: string; words: string };

export type FlagLine = {
  id: number;
  station: string;
  what: string;
  value: string;
  limits: string;
  verdict: Verdict;
  reason: string;
  state: string;
  decisions: DecisionLine[];
};

export type GaugeLine = {
  label: string;
  serial: string;
  kind: string;
  uncertainty: string;
  calibration: string;
  pastDue: boolean;
  /** The gauge's latest study in words (kind, date, spread, due) and whether it stood behind every reading. */
  study: string;
  studyProblem: boolean;
};

export type PhotoLine = { id: string; caption: string; thumb: Buffer | null; note: string };

/** A release as the record prints it: the release page's view plus the live check. */
export type ReleaseStamp = Omit<ReleaseRecord, "jobId"> & {
  /** Whether the database still gives the signed fingerprint, in words, when this copy was made. */
  check: { status: VerificationStatus; words: string };
  verifyUrl: string;
};

export type Tally = {
  measured: number;
  inSpec: number;
  marginal: number;
  outOfSpec: number;
  skipped: number;
  unjudged: number;
};

export type BuildRecord = {
  generatedAt: string;
  pageSize: "LETTER" | "A4";
  shop: { name: string; contact: string[] };
  customer: { name: string; contact: string[] };
  job: {
    id: number;
    code: string;
    title: string;
    status: string;
    units: string;
    specRevision: number;
  };
  engine: Line[];
  /** The bearing halves chosen per point, predicted against measured (absent where none were chosen). */
  bearings?: BearingRecordLine[];
  plan: { entered: Line[]; figures: Line[]; problems: string[]; notes: string | null } | null;
  sections: ReadingSection[];
  derived: DerivedLine[];
  torque: TorqueLine[];
  flags: FlagLine[];
  gauges: GaugeLine[];
  photos: PhotoLine[];
  tally: Tally;
  /** The release this record is for; null for a draft printed before any release. */
  release: ReleaseStamp | null;
  earlierReleases: ReleaseStamp[];
  safety: string[];
  /** The job's limits still at a starter sheet's typical figures, in words (COMMON_PRACTICE_WORDS). */
  commonPractice: string[];
};

/** One bearing point of the build record: its halves, predicted and measured installed clearance. */
export type BearingRecordLine = {
  point: string;
  upper: string;
  lower: string;
  predicted: string;
  measured: string;
  difference: string;
};
