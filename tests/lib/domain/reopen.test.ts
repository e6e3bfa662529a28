import { describe, expect, it } from "vitest";
import { REOPEN_ROLES, canReopen, reopenRefusal } from "../../../lib/domain/reopen";

// Rules of this product: who may reopen a job and when. One case per clause.
const released = { code: "KF-1", status: "released", lockedAt: new Date("2026-11-24T09:30:00Z") };

describe("reopenRefusal (rule of this product)", () => {
  it("a lead reopens a released job with a standing release", () => {
    expect(REOPEN_ROLES).toEqual(["lead"]);
    expect(reopenRefusal("lead", { ...released, hasStandingRelease: true })).toBeNull();
    expect(canReopen("lead", { ...released, hasStandingRelease: true })).toBe(true);
  });

  it.each(["inspector", "machinist", "admin"])("%s may not reopen: forbidden", (role) => {
    expect(reopenRefusal(role, { ...released, hasStandingRelease: true })).toEqual({
      code: "forbidden",
      message: "Only a lead can reopen a released job.",
    });
  });

  it("a standing release that still locks a job whose status was edited can be reopened", () => {
    expect(canReopen("lead", { ...released, status: "review", hasStandingRelease: true })).toBe(true);
  });

  it("nothing to reopen without a standing release, or on an open job", () => {
    expect(reopenRefusal("lead", { ...released, hasStandingRelease: false })?.code).toBe("conflict");
    expect(
      reopenRefusal("lead", { code: "KF-1", status: "review", lockedAt: null, hasStandingRelease: false }),
    ).toEqual({
      code: "conflict",
      message: "Job KF-1 is not released (it is review), so there is nothing to reopen.",
    });
  });

  it("a closed job is final, even with a release standing", () => {
    expect(reopenRefusal("lead", { ...released, status: "closed", hasStandingRelease: true })).toEqual({
      code: "conflict",
      message: "Job KF-1 is closed. A closed job is final and is not reopened.",
    });
  });
});
