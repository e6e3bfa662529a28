import { describe, expect, it } from "vitest";
import { DISPLAY_RESOLUTION, roundToResolution } from "../../../lib/domain/units";
import { formatDeviation } from "../../../lib/domain/verdict";

// Figures shown and exported to the unit's display resolution: inch work to the tenth, metric to
// the micrometre, torque to the whole unit (common practice). The rounding is plain decimal
// rounding to the nearest step, a half away from zero (hand arithmetic on the decimal figures).
describe("roundToResolution", () => {
  it("uses the steps the bench and the desk show", () => {
    expect(DISPLAY_RESOLUTION).toEqual({ in: "0.0001", mm: "0.001", lbf_ft: "1", nm: "1" });
  });

  it.each([
    [0.004 * 4.0817, "in", 0.0163], // 0.0163268 (float: 0.016326800000000002)
    [0.0055 * 4.0817, "in", 0.0224], // 0.02244935
    [0.00045 * 4.0817, "in", 0.0018], // 0.001836765
    [0.00165, "in", 0.0017], // a half goes away from zero
    [-0.00165, "in", -0.0017],
    [0.0004999, "in", 0.0005],
    [0.41472, "mm", 0.415],
    [102.3493, "mm", 102.349],
    [0.0001 * 0.4, "in", 0], // never -0 or float dust
    [88.1308, "nm", 88],
    [64.5, "lbf_ft", 65],
  ] as const)("%s %s → %s", (x, unit, want) => {
    expect(roundToResolution(x, unit)).toBe(want);
  });

  it("keeps a figure already on a step as written (4.0305 in stays 4.0305, not 4.030499…)", () => {
    expect(roundToResolution(4.0305, "in")).toBe(4.0305);
    expect(roundToResolution(4.0295 + 0.001, "in")).toBe(4.0305);
  });

  it("refuses a unit it has no step for", () => {
    expect(() => roundToResolution(1, "furlong" as never)).toThrow(/Unknown unit 'furlong'/);
  });

  it("is the step the bench's deviation words count in", () => {
    expect(formatDeviation(0.0003, "in")).toBe("3 tenths over");
    expect(formatDeviation(-0.012, "mm")).toBe("12 µm under");
  });
});
