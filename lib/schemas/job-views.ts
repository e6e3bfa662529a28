// What the desk's job routes answer, apart from the request schemas in job.ts (which re-exports these).
import type { Consequences, EngineLayout, JobStatus, Verdict } from "@/lib/domain";
import type { Fuel, UnitSystem } from "@/lib/schemas/enums";
import type { FinishedSizes } from "./job-sizes";
import type { LimitValues } from "./spec";

// What the desk's job routes answer (GET /api/jobs, /api/jobs/:id, /api/jobs/:id/limits, /api/customers).

export type CustomerRecord = { id: number; name: string; email: string | null; phone: string | null };

export type JobSummary = {
  id: number;
  code: string;
  title: string;
  status: JobStatus;
  unitSystem: UnitSystem;
  dueDate: string | null;
  customer: string;
  engine: string;
};

/** A row of the jobs board; progress is null for a closed job (its record is final). */
export type BoardJob = JobSummary & {
  progress: { done: number; required: number } | null;
  flags: { open: number; disposed: number };
  updatedAt: string;
};

export type VerdictCounts = Record<Verdict, number>;

export type SectionSummary = {
  id: string;
  label: string;
  stations: number;
  measured: number;
  required: number;
  requiredDone: number;
  verdicts: VerdictCounts;
};

/** What every job screen heads with. */
type JobHeading = Pick<JobSummary, "id" | "code" | "title" | "status" | "unitSystem">;

export type JobDetail = {
  job: JobHeading & {
    dueDate: string | null;
    notes: string | null;
    specRevision: number;
    locked: boolean;
    lockedAt: string | null;
    /** A release that is not void: what a lead's reopen would void (lib/domain/reopen.ts). */
    hasStandingRelease: boolean;
    templateId: number | null;
    templateName: string | null;
    limitCount: number;
    /** Limits still at a starter sheet's typical figures (COMMON_PRACTICE_WORDS). */
    commonPracticeCount: number;
    hasBuildPlan: boolean;
    finishedSizes: FinishedSizes;
    /** The build plan's bore in the job's units, when the plan gives one (the form offers it). */
    planBore: number | null;
    createdAt: string;
    updatedAt: string;
  };
  customer: CustomerRecord;
  engine: {
    description: string;
    cylinders: number;
    layout: EngineLayout;
    mains: number;
    valvesPerCylinder: number;
    ringsPerPiston: number;
    boltsPerRod: number;
    nominalBore: number;
    nominalStroke: number;
    nominalMainJournal: number | null;
    nominalRodJournal: number | null;
    blockMaterial: string;
    headMaterial: string | null;
    pistonMaterial: string | null;
    blockSerial: string | null;
    crankSerial: string | null;
    headSerials: string | null;
    fuel: Fuel | null;
  };
  flags: { open: number; disposed: number; closed: number };
  summary: {
    readingCount: number;
    currentCount: number;
    /** Empty, with routeError saying why, when the core cannot lay out the engine's route. */
    sections: SectionSummary[];
    derived: VerdictCounts & { pending: number };
    routeError: string | null;
  };
};

/** A job's own limit snapshot, as the limits page edits it. */
export type JobLimitsView = {
  job: JobHeading & {
    locked: boolean;
    specRevision: number;
    /** What limits that follow the job resolve from. */
    finishedSizes: FinishedSizes;
  };
  limits: LimitValues[];
};

export type LimitsSaved = JobLimitsView & {
  result: { reevaluated: number; opened: number; closed: number; updated: number };
  consequences: Consequences;
};

/**
 * POST /api/jobs/:id/limits/preview and /api/jobs/:id/preview: what saving would do, counted by
 * saving and rolling back; `wide` when saving asks for the number of flags it opens.
 */
export type ChangePreview = { consequences: Consequences; words: string; wide: boolean };
export type LimitsPreview = ChangePreview;
