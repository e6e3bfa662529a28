import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { READING_PRECISION, columnFigure, columnLimit, decimalPlaces, storedFigureProblem } from "@/lib/domain";

// A DECIMAL(M, D) column keeps D decimal places and M − D digits before the point, and rounds a
// decimal figure with more places a half away from zero (MariaDB Knowledge Base, "DECIMAL" and
// "Precision Math"), the way the issue saw 20.123 stored as 20.12 and 104.0180005 as 104.018001.
describe("figures the database keeps", () => {
  it("counts decimal places as the figure is written", () => {
    expect(decimalPlaces(20.12)).toBe(2);
    expect(decimalPlaces(20.123)).toBe(3);
    expect(decimalPlaces(1e-7)).toBe(7);
    expect(decimalPlaces(1.5e-7)).toBe(8);
    expect(decimalPlaces(104.0180005)).toBe(7);
    expect(decimalPlaces(100000000)).toBe(0);
  });

  it("knows each column's largest figure", () => {
    expect(columnLimit({ digits: 14, places: 6 })).toBe(99999999.999999);
    expect(columnLimit({ digits: 6, places: 2 })).toBe(9999.99);
  });

  it("rounds as the column does, a half away from zero", () => {
    expect(columnFigure(20.123, READING_PRECISION.partTempC)).toBe(20.12);
    expect(columnFigure(104.0180005, READING_PRECISION.value)).toBe(104.018001);
    expect(columnFigure(-104.0180005, READING_PRECISION.value)).toBe(-104.018001);
    expect(columnFigure(-0.000000001, READING_PRECISION.value)).toBe(0);
    expect(Object.is(columnFigure(-0.000000001, READING_PRECISION.value), 0)).toBe(true);
  });

  it("refuses more places or a larger figure than the column keeps, in words", () => {
    expect(storedFigureProblem(20.123, READING_PRECISION.partTempC, "Part temperature")).toBe(
      "Part temperature keeps 2 decimal places: 20.123 has 3; round it to 2 places",
    );
    expect(storedFigureProblem(-100000000, READING_PRECISION.dialDeviation, "The dial reading")).toBe(
      "The dial reading must lie between -99999999.999999 and 99999999.999999; -100000000 cannot be right, check it",
    );
    expect(storedFigureProblem(99999999.999999, READING_PRECISION.value, "The value")).toBeUndefined();
    expect(storedFigureProblem(104.018001, READING_PRECISION.value, "The value")).toBeUndefined();
    expect(storedFigureProblem(Number.NaN, READING_PRECISION.value, "The value")).toBe("The value must be a number");
  });

  it("keeps exactly every figure it accepts", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true }), (x) => {
        const p = READING_PRECISION.value;
        if (storedFigureProblem(x, p, "x") === undefined) expect(columnFigure(x, p)).toBe(x === 0 ? 0 : x);
      }),
      { seed: 7, numRuns: 1000 },
    );
  });
});
