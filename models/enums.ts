// The value sets of the ENUM columns, as plain constants with no imports so that schemas and UI
// code can share them without pulling in Sequelize. The migrations spell the same lists out
// literally, because a migration must keep creating what it created when it shipped.

export const UNIT_SYSTEMS = ["in", "mm"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export const GUARD_BAND_POLICIES = ["shrink_by_u", "none"] as const;
export type GuardBandPolicy = (typeof GUARD_BAND_POLICIES)[number];

export const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const ENGINE_LAYOUTS = ["inline", "v", "flat"] as const;
export type EngineLayout = (typeof ENGINE_LAYOUTS)[number];

export const FUELS = ["gasoline", "diesel", "other"] as const;
export type Fuel = (typeof FUELS)[number];

export const LIMIT_TYPES = ["min_max", "nominal_tol", "max_only", "min_only", "per_inch", "iso286"] as const;
export type LimitType = (typeof LIMIT_TYPES)[number];

export const JOB_STATUSES = ["intake", "measuring", "review", "released", "closed"] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

export const ENTRY_MODES = ["direct", "dial"] as const;
export type EntryMode = (typeof ENTRY_MODES)[number];

export const VERDICTS = ["in_spec", "marginal", "out_of_spec"] as const;
export type Verdict = (typeof VERDICTS)[number];

export const FLAG_REASONS = ["out_of_spec", "marginal", "gauge_past_due"] as const;
export type FlagReason = (typeof FLAG_REASONS)[number];

export const FLAG_STATES = ["open", "disposed", "closed"] as const;
export type FlagState = (typeof FLAG_STATES)[number];

export const DISPOSITIONS = ["measure_again", "machine_again", "accept"] as const;
export type Disposition = (typeof DISPOSITIONS)[number];

export const ATTACHMENT_OWNER_TYPES = ["job", "reading", "instrument"] as const;
export type AttachmentOwnerType = (typeof ATTACHMENT_OWNER_TYPES)[number];

export const SYNC_ENTITIES = ["reading", "flag", "job_limits", "job"] as const;
export type SyncEntity = (typeof SYNC_ENTITIES)[number];

/** What a JSON column holds. */
export type JsonValue = string | number | boolean | null | JsonValue[] | { [key: string]: JsonValue };
export type JsonObject = { [key: string]: JsonValue };
