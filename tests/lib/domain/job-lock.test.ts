import { describe, expect, it } from "vitest";
import { OPEN_JOB_STATUSES, isJobLocked, jobLock, jobLockReason, lockedJobWords } from "../../../lib/domain/job-lock";

// Rules of this product: when a job stops taking readings. One case per clause, each chosen so
// that the clause alone decides it (removing any clause from jobLock fails a case here).
const at = new Date("2026-11-24T09:30:00Z");

describe("jobLock (rule of this product)", () => {
  it.each(OPEN_JOB_STATUSES)("an open job (%s) with no lock takes readings", (status) => {
    expect(jobLock({ status, lockedAt: null })).toEqual({ locked: false, reason: null });
  });

  it("closed: locked even with no lockedAt (closed by a status edit)", () => {
    expect(jobLock({ status: "closed", lockedAt: null })).toEqual({ locked: true, reason: "closed" });
  });

  it("released: locked even with no lockedAt", () => {
    expect(jobLock({ status: "released", lockedAt: null })).toEqual({ locked: true, reason: "released" });
  });

  it("lockedAt set: locked though the status still reads open", () => {
    for (const status of OPEN_JOB_STATUSES) {
      expect(jobLock({ status, lockedAt: at })).toEqual({ locked: true, reason: "locked" });
      expect(jobLock({ status, lockedAt: at.toISOString() })).toEqual({ locked: true, reason: "locked" });
    }
  });

  it("a status that is not an open one fails safe: locked", () => {
    expect(jobLock({ status: "scrapped", lockedAt: null })).toEqual({ locked: true, reason: "status" });
    expect(jobLock({ status: "", lockedAt: null })).toEqual({ locked: true, reason: "status" });
  });

  it("closed and released say so before the lock date does", () => {
    expect(jobLock({ status: "closed", lockedAt: at }).reason).toBe("closed");
    expect(jobLock({ status: "released", lockedAt: at }).reason).toBe("released");
  });

  it("isJobLocked is the same answer as a boolean", () => {
    expect(isJobLocked({ status: "measuring", lockedAt: null })).toBe(false);
    expect(isJobLocked({ status: "measuring", lockedAt: at })).toBe(true);
  });
});

const REOPEN =
  "Only a lead can reopen it, with a reason, from the job page or the release page; that voids the release.";

describe("jobLockReason: what the machinist reads", () => {
  const job = { code: "KF-1", updatedAt: new Date("2026-12-01T00:00:00Z") };
  it("null when the job takes readings", () => {
    expect(jobLockReason({ ...job, status: "review", lockedAt: null })).toBeNull();
  });
  it("names the job, what happened and when (the lock date first)", () => {
    expect(jobLockReason({ ...job, status: "released", lockedAt: at })).toBe(
      "Job KF-1 was released on 24 Nov 2026; readings are locked. " + REOPEN,
    );
    expect(jobLockReason({ ...job, status: "review", lockedAt: at })).toBe(
      "Job KF-1 was locked on 24 Nov 2026; readings are locked. " + REOPEN,
    );
  });
  it("falls back to the last change for a job closed by a status edit, and to no date at all", () => {
    expect(jobLockReason({ ...job, status: "closed", lockedAt: null })).toBe(
      "Job KF-1 was closed on 1 Dec 2026; readings are locked. A closed job is final and is not reopened.",
    );
    expect(jobLockReason({ code: "KF-2", status: "closed", lockedAt: null })).toBe(
      "Job KF-2 was closed; readings are locked. A closed job is final and is not reopened.",
    );
  });
  it("an unknown status says which statuses take readings", () => {
    expect(jobLockReason({ ...job, status: "scrapped", lockedAt: null })).toMatch(/intake, measuring, review/);
  });
});

describe("lockedJobWords: what a desk screen says about a locked job", () => {
  it("null for a job that is not locked", () => {
    expect(lockedJobWords({ status: "measuring", locked: false }, "its limits")).toBeNull();
  });
  it("a released job, or one locked by a standing release, is reopened by a lead", () => {
    expect(lockedJobWords({ status: "released", locked: true, code: "KF-1" }, "its limits")).toBe(
      "Job KF-1 is released: its limits cannot change. " + REOPEN,
    );
    expect(lockedJobWords({ status: "review", locked: true }, "its plan")).toBe(
      "This job is released: its plan cannot change. " + REOPEN,
    );
  });
  it("a closed job is never offered a reopen (only a standing release is undone)", () => {
    const words = lockedJobWords({ status: "closed", locked: true }, "its limits");
    expect(words).toBe("This job is closed: its limits cannot change. A closed job is final and is not reopened.");
    expect(words).not.toMatch(/lead can reopen/);
  });
});
