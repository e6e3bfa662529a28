// The value sets the measurement core works with, each declared once as a const array with its
// union derived from it. Zod schemas, the Sequelize models and the screens reuse these arrays, so a
// new value is added in one place. Sets the core never looks at live in lib/schemas/enums.ts.

export const LENGTH_UNITS = ["in", "mm"] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

export const TORQUE_UNITS = ["lbf_ft", "nm"] as const;
export type TorqueUnit = (typeof TORQUE_UNITS)[number];

/** Any unit a reading or a limit can be written in. */
export const MEASURE_UNITS = [...LENGTH_UNITS, ...TORQUE_UNITS] as const;
export type MeasureUnit = (typeof MEASURE_UNITS)[number];

export const VERDICTS = ["in_spec", "marginal", "out_of_spec"] as const;
export type Verdict = (typeof VERDICTS)[number];
export const isVerdict = (s: string): s is Verdict => (VERDICTS as readonly string[]).includes(s);

export const LIMIT_TYPES = [
  "min_max",
  "nominal_tol",
  "max_only",
  "min_only",
  "per_inch",
  "iso286",
  "job_size_tol",
] as const;
export type LimitType = (typeof LIMIT_TYPES)[number];

export const ENGINE_LAYOUTS = ["inline", "v", "flat"] as const;
export type EngineLayout = (typeof ENGINE_LAYOUTS)[number];

/** How a reading was taken: the value itself, or a dial gauge's deviation from a set size. */
export const ENTRY_MODES = ["direct", "dial"] as const;
export type EntryMode = (typeof ENTRY_MODES)[number];

/** A job's life, in order: released and closed jobs are signed and take no more readings. */
export const JOB_STATUSES = ["intake", "measuring", "review", "released", "closed"] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];
