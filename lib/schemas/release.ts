// The release contract, shared by the inspector's page (components/release) and the handlers
// (app/api/release). Roles and replies:
//
// GET  /api/release                    (inspector, lead)  → { jobs: ReleaseJobSummary[] }
// GET  /api/release/:jobId             (inspector, lead)  → ReleaseView
// POST /api/release/:jobId             (inspector)        body SignInput → 201 { release: ReleaseRecord }
//   409 conflict   the checklist is not empty (`fields.checklist` lists what blocks), or already released
//   422 invalid    the typed name does not match the account name (`fields.fullName`)
//   403 forbidden  the password is wrong (`fields.password`); 429 after repeated wrong passwords
// POST /api/release/:jobId/reopen      (lead)             body ReopenInput → { release: ReleaseRecord }
// GET  /api/release/:jobId/verify      (inspector, lead, admin) → Verification (the latest release)
// GET  /api/release/verify?hash=…&job=… (public)          → PublicVerification (status, job code, date only)
import { z } from "zod";
import type { Verdict } from "@/lib/domain";
import type { Disposition, FlagReason, FlagState } from "./enums";
import { storedText } from "./stored-text";

export const signSchema = z.object({
  fullName: storedText("Your name", "Type your full name")
    .trim()
    .min(1, "Type your full name as it is on your account")
    .max(160, "That name is too long"),
  password: z
    .string("Enter your password")
    .min(1, "Enter your password again to sign")
    .max(200, "That password is too long"),
});
export type SignInput = z.infer<typeof signSchema>;

export const reopenSchema = z.object({
  reason: storedText("The reason", "Say why the job is reopened")
    .trim()
    .min(10, "Say why the job is reopened, in a sentence (10 characters or more)")
    .max(2000, "Keep the reason to 2000 characters"),
});
export type ReopenInput = z.infer<typeof reopenSchema>;

export const HASH_PATTERN = /^[0-9a-f]{64}$/;
export const publicVerifySchema = z.object({
  hash: z
    .string("Give the record's fingerprint (hash)")
    .trim()
    .toLowerCase()
    .regex(HASH_PATTERN, "The fingerprint is 64 characters, 0-9 and a-f, as printed on the build record"),
  job: storedText("The job code").trim().max(24, "A job code is at most 24 characters").optional(),
});

export type CheckId = "readings" | "flags" | "gauges" | "torque" | "plan";
export type ChecklistLink = { label: string; href: string };
export type ChecklistItem = { check: CheckId; key: string; text: string; links: ChecklistLink[] };
export type ChecklistCheck = {
  id: CheckId;
  title: string;
  ok: boolean;
  /** What is complete (or how far), in words. */
  summary: string;
  /** The readings check only: required stations done (lib/domain/progress.ts), as the desk counts them. */
  progress?: { done: number; required: number };
  items: ChecklistItem[];
};
export type ReleaseChecklist = { jobId: number; complete: boolean; checks: ChecklistCheck[]; unmet: ChecklistItem[] };

/** A release stands until a lead reopens the job, which voids it (kept, marked VOID). */
export const RELEASE_STATUSES = ["standing", "void"] as const;
export type ReleaseStatus = (typeof RELEASE_STATUSES)[number];
export type ReleaseRecord = {
  id: number;
  jobId: number;
  status: ReleaseStatus;
  /**
   * The signer's registered name (the users table), which every screen and the record print; the
   * name as typed for the e-signature is kept in the release's audit event.
   */
  inspectorName: string;
  signedAt: string;
  hash: string;
  canonicalVersion: number;
  voidedAt: string | null;
  voidedByName: string | null;
  voidReason: string | null;
};

export type ReadingCounts = { current: number; superseded: number; skipped: number } & Record<
  Verdict | "unjudged",
  number
>;

export type FlagSummary = {
  id: number;
  station: string;
  what: string;
  verdict: Verdict;
  reason: FlagReason;
  state: FlagState;
  disposition: Disposition | null;
  operation: string | null;
  dispositionReason: string | null;
  disposedByName: string | null;
  disposedAt: string | null;
  closedAt: string | null;
  value: string;
};

export type ReleaseView = {
  job: {
    id: number;
    code: string;
    title: string;
    status: string;
    lockedAt: string | null;
    customer: string;
    engine: string;
    unitSystem: string;
  };
  checklist: ReleaseChecklist;
  counts: ReadingCounts;
  flags: FlagSummary[];
  releases: ReleaseRecord[];
  can: { sign: boolean; reopen: boolean };
  links: { pdf: string; verify: string | null };
};

export type ReleaseJobSummary = {
  id: number;
  code: string;
  title: string;
  status: string;
  customer: string;
  engine: string;
  dueDate: string | null;
  complete: boolean;
  unmet: number;
  release: { signedAt: string; hash: string } | null;
};

export const RECORD_CHANGES = ["changed", "added", "removed"] as const;
export type Difference = { section: string; id: string; label: string; change: (typeof RECORD_CHANGES)[number] };
/** What checking a release against the database now finds. */
export const VERIFICATION_STATUSES = ["match", "changed", "void"] as const;
export type VerificationStatus = (typeof VERIFICATION_STATUSES)[number];
export type Verification = {
  status: VerificationStatus;
  words: string;
  release: ReleaseRecord;
  recomputedHash: string | null;
  differences: Difference[];
};
export type PublicVerification = {
  status: VerificationStatus;
  words: string;
  jobCode: string;
  signedAt: string;
  voidedAt: string | null;
};
