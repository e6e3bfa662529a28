import { describe, expect, it } from "vitest";
import { uncertaintyAtK2 } from "../../../lib/domain/gauge-uncertainty";

describe("a certificate's U restated at k = 2", () => {
  it("keeps U stated at k = 2 as it is", () => {
    expect(uncertaintyAtK2(0.00015, 2)).toBe(0.00015);
    expect(uncertaintyAtK2(0.003)).toBe(0.003);
  });
  it("rescales through uc = U/k (JCGM 100:2008, 6.2.1: U = k·uc)", () => {
    // U = 0.003 mm at k = 3 is uc = 0.001 mm, so 0.002 mm at k = 2.
    expect(uncertaintyAtK2(0.003, 3)).toBeCloseTo(0.002, 15);
    // U = 0.0001 in at k = 1 (a standard uncertainty) is 0.0002 in at k = 2.
    expect(uncertaintyAtK2(0.0001, 1)).toBe(0.0002);
  });
  it("refuses what cannot be an uncertainty, saying what to fix", () => {
    expect(() => uncertaintyAtK2(-0.001, 2)).toThrow(/zero or more/);
    expect(() => uncertaintyAtK2(0.001, 0)).toThrow(/greater than zero/);
  });
});
