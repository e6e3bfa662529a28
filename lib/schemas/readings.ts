import type { EntryMode, LengthUnit, Verdict } from "@/lib/domain";

// A reading as the readings table stores it, under one set of field names used everywhere on the
// server: the Sequelize model (models/reading.ts), the raw SQL of the sync hot path
// (lib/server/readings/repo.ts) and every view built from a stored reading (the sync feed's
// ServerReading, the release hash, the build record). READING_COLUMNS is the only place that
// says which column holds which field, so the model and the raw SQL cannot drift apart.

export type StoredReading = {
  /** The tablet's UUID: a resent batch is an upsert. */
  id: string;
  shopId: number;
  jobId: number;
  stationId: string;
  characteristic: string;
  /** mm for lengths, N·m for torque; null only when skipped. */
  valueCanonical: number | null;
  /** The figure as entered, in `unit`. */
  value: number | null;
  unit: string;
  entryMode: EntryMode;
  /** Dial mode: the size the gauge was zeroed on, and the dial's reading, in `unit`. */
  dialSetting: number | null;
  dialDeviation: number | null;
  instrumentId: number | null;
  partTempC: number | null;
  gaugeTempC: number | null;
  lubricant: string | null;
  skipped: boolean;
  skipReason: string | null;
  note: string | null;
  takenBy: number;
  /** The tablet's clock. */
  takenAt: Date;
  /** The server's clock. */
  receivedAt: Date;
  deviceId: string;
  /** The reading this one corrects. */
  supersedes: string | null;
  /** Null when skipped. */
  verdict: Verdict | null;
  /** e.g. 'gauge_past_due'. */
  verdictNote: string | null;
  /** The limits as evaluated, and the deviation from nominal, in `unit`. */
  limitMin: number | null;
  limitMax: number | null;
  deviation: number | null;
};

/** The readings column of each field, in the table's column order. */
export const READING_COLUMNS = {
  id: "id",
  shopId: "shop_id",
  jobId: "job_id",
  stationId: "station_id",
  characteristic: "characteristic",
  valueCanonical: "value_canonical",
  value: "value_entered",
  unit: "unit_entered",
  entryMode: "entry_mode",
  dialSetting: "dial_setting",
  dialDeviation: "dial_deviation",
  instrumentId: "instrument_id",
  partTempC: "part_temp_c",
  gaugeTempC: "gauge_temp_c",
  lubricant: "lubricant",
  skipped: "skipped",
  skipReason: "skip_reason",
  note: "note",
  takenBy: "taken_by",
  takenAt: "taken_at",
  receivedAt: "received_at",
  deviceId: "device_id",
  supersedes: "supersedes",
  verdict: "verdict",
  verdictNote: "verdict_note",
  limitMin: "limit_min",
  limitMax: "limit_max",
  deviation: "deviation",
} as const satisfies { [K in keyof StoredReading]-?: string };

export type ReadingField = keyof typeof READING_COLUMNS;
export const READING_FIELDS = Object.keys(READING_COLUMNS) as ReadingField[];

// GET /api/jobs/:id/maps: bore, journal and deck maps of a job, every figure in the job's length unit.
export type MapPoint = { value: number | null; min: number | null; max: number | null; verdict: Verdict | null };
export type ProfileRow = { at: string; A: MapPoint; B: MapPoint };
export type Figure = { value: number | null; max: number | null; verdict: Verdict | null; missing: number };
export type Profile = { n: number; label: string; rows: ProfileRow[]; taper: Figure; outOfRound: Figure };
export type DeckCorner = { bank: string; corner: string; point: MapPoint };
export type JobMaps = {
  job: { id: number; code: string; title: string };
  unit: LengthUnit;
  corrected: boolean;
  bores: Profile[];
  mains: Profile[];
  rods: Profile[];
  deck: DeckCorner[];
};
