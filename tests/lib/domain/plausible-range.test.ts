import { describe, expect, it } from "vitest";
import { implausibleReason } from "../../../lib/domain/plausible-range";
import type { EngineShape } from "../../../lib/domain/types";

// The ranges themselves are common practice, from memory (deliberately wide); these checks test
// the unit handling, which rests on exact definitions: 1 in = 25.4 mm (NIST SP 811, B.8) and
// 1 lbf·ft = 1.3558179483314004 N·m (NIST SP 811, B.8: lbf = 4.4482216152605 N, ft = 0.3048 m).
const v8: EngineShape = {
  cylinders: 8,
  layout: "v",
  mains: 5,
  valvesPerCylinder: 2,
  unitSystem: "inch",
  nominalSizes: { bore: 4.03 },
};
const diesel: EngineShape = {
  cylinders: 4,
  layout: "inline",
  mains: 5,
  valvesPerCylinder: 2,
  unitSystem: "metric",
  nominalSizes: { bore: 104 },
};

describe("implausibleReason", () => {
  it("accepts ordinary bench figures in either unit", () => {
    expect(implausibleReason("bore/1/top/A", 4.0302, "in", v8)).toBeUndefined();
    expect(implausibleReason("bore/1/top/A", 102.367, "mm", v8)).toBeUndefined(); // 4.0302 in × 25.4
    expect(implausibleReason("bore/1/top/A", 104.012, "mm", diesel)).toBeUndefined();
    expect(implausibleReason("ring-gap/1/top", 0, "in", v8)).toBeUndefined();
    expect(implausibleReason("torque/main-caps", 72, "lbf_ft", v8)).toBeUndefined();
  });
  it("refuses a bore of 40 in (a slipped decimal point), saying what to check", () => {
    const why = implausibleReason("bore/1/top/A", 40.3, "in", v8);
    expect(why).toMatch(/cannot be a cylinder bore diameter/);
    expect(why).toMatch(/decimal point and the unit/);
  });
  it("refuses millimetres typed as inches", () => {
    expect(implausibleReason("main/1/front/A", 62.2, "in", v8)).toMatch(/cannot be a main journal diameter/);
  });
  it("range edges are exact after conversion: 400 mm = 15.748031496 in (NIST SP 811, B.8)", () => {
    const engine = { ...v8, nominalSizes: {} };
    expect(implausibleReason("bore/1/top/A", 400, "mm", engine)).toBeUndefined();
    expect(implausibleReason("bore/1/top/A", 400.001, "mm", engine)).toBeDefined();
    expect(implausibleReason("bore/1/top/A", 15.748, "in", engine)).toBeUndefined();
    expect(implausibleReason("bore/1/top/A", 15.749, "in", engine)).toBeDefined();
  });
  it("torque: 3000 N·m is the ceiling; 2213 lbf·ft (3000.4 N·m) is over it (NIST SP 811, B.8)", () => {
    expect(implausibleReason("torque/damper", 2212, "lbf_ft", v8)).toBeUndefined(); // 2999.07 N·m
    expect(implausibleReason("torque/damper", 2213, "lbf_ft", v8)).toMatch(/fastener torque/);
  });
  it("a torque of 0 is no reading (common practice: even M5 screws take a few N·m)", () => {
    expect(implausibleReason("torque/main-caps", 0, "lbf_ft", v8)).toMatch(/fastener torque/);
    expect(implausibleReason("torque/main-caps", 1, "nm", v8)).toBeUndefined();
  });
  it("a bore more than 10% from the engine's nominal bore is a slip (4.53 in on a 4.03 in V8)", () => {
    expect(implausibleReason("bore/2/mid/B", 4.53, "in", v8)).toMatch(/10% away from this engine's 4.03 in bore/);
    expect(implausibleReason("skirt/2", 93.6, "mm", diesel)).toBeUndefined(); // 9.9% under 104 mm
    expect(implausibleReason("skirt/2", 93.5, "mm", diesel)).toMatch(/10% away/);
  });
});
