// @vitest-environment jsdom
// The spec editor says what a limit comes to: a clearance as a clearance window, a job-size limit
// as a tolerance around each job's finished size, and on a job's own limits page the figures it
// comes to with that job's size. Arithmetic is plain (4.06 − 0.0001 = 4.0599, 4.06 + 0.0004 = 4.0604);
// the ISO 286 figures: IT7 over 80 up to 120 mm = 35 µm, H lower deviation 0 (ISO 286-1:2010 Table 1).
import { cleanup, render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it } from "vitest";
import { JobSizesContext } from "@/components/desk/job-sizes-context";
import { SpecLimitPreview } from "@/components/desk/spec-limit-preview";
import type { LimitInput } from "@/lib/schemas/spec";

afterEach(cleanup);

const limit = (l: Partial<LimitInput>): LimitInput =>
  ({ characteristic: "bore_diameter", stationPattern: "*", unit: "in", required: true, ...l }) as LimitInput;
const onJob = (l: LimitInput, sizes = { bore: 4.06, mainJournal: null, rodJournal: null }, unit = "in" as const) =>
  render(
    <JobSizesContext.Provider value={{ sizes, unit }}>
      <SpecLimitPreview limit={l} />
    </JobSizesContext.Provider>,
  );

describe("SpecLimitPreview", () => {
  it("a job-size tolerance on a template names the size it follows", () => {
    render(<SpecLimitPreview limit={limit({ limitType: "job_size_tol", tolPlus: 0.0004, tolMinus: 0.0001 })} />);
    screen.getByText("Accepts each job's finished bore −0.0001 / +0.0004 in");
  });

  it("on a job's own limits it also gives the figures with that job's finished bore", () => {
    onJob(limit({ limitType: "job_size_tol", tolPlus: 0.0004, tolMinus: 0.0001 }));
    screen.getByText("On this job (finished bore 4.06 in): 4.0599 to 4.0604 in");
  });

  it("an ISO 286 class without a nominal comes to the class on the job's finished bore", () => {
    const sizes = { bore: 104.5, mainJournal: null, rodJournal: null };
    onJob(limit({ limitType: "iso286", unit: "mm", isoClass: "H7" }), sizes, "mm" as never);
    screen.getByText("On this job (finished bore 104.5 mm): 104.5 to 104.535 mm");
  });

  it("a minimum and maximum on a clearance reads as a clearance window", () => {
    render(
      <SpecLimitPreview
        limit={limit({ characteristic: "rod_side_clearance", limitType: "min_max", min: 0.01, max: 0.02 })}
      />,
    );
    screen.getByText("Clearance window: 0.01 to 0.02 in");
  });

  // 0.0045 in per inch of bore for a top ring: common practice; 0.0045 × 4.06 = 0.01827
  it("a per-inch ring gap on a job scales with that job's finished bore", () => {
    onJob(
      limit({
        characteristic: "ring_end_gap",
        stationPattern: "ring-gap/*/top",
        limitType: "per_inch",
        perInchMin: 0.0045,
      }),
    );
    expect(screen.getByText(/Clearance window: 0.0045 in per inch of the job's finished bore or more/)).toBeTruthy();
    screen.getByText("On this job (finished bore 4.06 in): 0.01827 in or more");
  });
});
