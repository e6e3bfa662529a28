// The value sets of the ENUM columns and request fields that the measurement core does not need,
// each declared once as a const array with its union derived from it; the core's own sets
// (units, verdicts, limit types, layouts, entry modes, job statuses) live in lib/domain/enums.ts.
// No imports beyond the core, so forms, screens, the tablet and the models share them without
// pulling in Sequelize. The migrations spell the same lists out literally, because a migration
// must keep creating what it created when it shipped.
// The core's enums file alone, not the core's index: the tablet's first screen imports this file.
import { LENGTH_UNITS } from "@/lib/domain/enums";

/** A shop's or a job's unit system, named by its length unit (torque follows: lbf·ft or N·m). */
export const UNIT_SYSTEMS = LENGTH_UNITS;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export const GUARD_BAND_POLICIES = ["shrink_by_u", "none"] as const;
export type GuardBandPolicy = (typeof GUARD_BAND_POLICIES)[number];

export const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
export type Role = (typeof ROLES)[number];

/** The roles that work at the bench: the tablet's screens, its job packs and the sync endpoint. */
export const BENCH_ROLES = ["machinist", "lead"] as const satisfies readonly Role[];

/** The roles that read the audit trail: the lead and inspector for their work, the admin for accounts. */
export const AUDIT_ROLES = ["lead", "inspector", "admin"] as const satisfies readonly Role[];

/** Why a signed-in session ended (user_sessions.ended_reason). */
export const SESSION_END_REASONS = [
  "signed_out",
  "replaced",
  "password_reset",
  "role_changed",
  "deactivated",
  "password_changed",
  "signed_out_everywhere",
] as const;
export type SessionEndReason = (typeof SESSION_END_REASONS)[number];

/** What a one-time link sent by e-mail is for (link_tokens.purpose). */
export const LINK_PURPOSES = ["verify_email", "set_password", "reset_password"] as const;
export type LinkPurpose = (typeof LINK_PURPOSES)[number];

export const FUELS = ["gasoline", "diesel", "other"] as const;
export type Fuel = (typeof FUELS)[number];

export const FLAG_REASONS = [
  "out_of_spec",
  "marginal",
  "gauge_past_due",
  "gauge_study_failed",
  "gauge_study_due",
] as const;
export type FlagReason = (typeof FLAG_REASONS)[number];

export const FLAG_STATES = ["open", "disposed", "closed"] as const;
export type FlagState = (typeof FLAG_STATES)[number];

export const DISPOSITIONS = ["measure_again", "machine_again", "accept"] as const;
export type Disposition = (typeof DISPOSITIONS)[number];

export const ATTACHMENT_OWNER_TYPES = ["job", "reading", "instrument"] as const;
export type AttachmentOwnerType = (typeof ATTACHMENT_OWNER_TYPES)[number];

export const SYNC_ENTITIES = ["reading", "flag", "job_limits", "job"] as const;
export type SyncEntity = (typeof SYNC_ENTITIES)[number];

/** A gauge study's kind: a repeatability study on a reference ("type 1"), or an R&R study across people. */
export const STUDY_KINDS = ["type1", "grr"] as const;
export type StudyKind = (typeof STUDY_KINDS)[number];
