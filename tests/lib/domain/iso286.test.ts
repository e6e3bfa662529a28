import { describe, expect, it } from "vitest";
import { iso286Deviations, iso286Fit, iso286Limits, itGrade } from "../../../lib/domain/iso286";

describe("itGrade", () => {
  it("gives the ISO 286-1:2010 Table 1 values for 30–50 mm", () => {
    // ISO 286-1:2010 Table 1, row "over 30 up to and including 50": IT5..IT9 = 11, 16, 25, 39, 62 µm
    expect([5, 6, 7, 8, 9].map((g) => itGrade(40, g))).toEqual([11, 16, 25, 39, 62]);
  });
  it("gives the table's first and last rows", () => {
    // ISO 286-1:2010 Table 1: up to 3 mm IT7 = 10 µm; 400–500 mm IT5..IT9 = 27, 40, 63, 97, 155 µm
    expect(itGrade(3, 7)).toBe(10);
    expect([5, 6, 7, 8, 9].map((g) => itGrade(450, g))).toEqual([27, 40, 63, 97, 155]);
  });
  it("puts a size exactly on a boundary in the lower range", () => {
    // ISO 286-1:2010 Table 1 ranges are "over … up to and including"
    expect(itGrade(50, 7)).toBe(25); // 30–50 row, not 50–80 (30 µm)
    expect(itGrade(50.001, 7)).toBe(30);
    expect(itGrade(6, 6)).toBe(8); // 3–6 row
    expect(itGrade(6.01, 6)).toBe(9);
  });
  it("accepts 'IT7' as well as 7", () => {
    expect(itGrade(25, "IT7")).toBe(21); // ISO 286-1:2010 Table 1, 18–30 mm
  });
  it("rejects grades and sizes outside the table with a message saying what to use", () => {
    expect(() => itGrade(40, 10)).toThrow(/use 5–9/);
    expect(() => itGrade(40, 4)).toThrow(/use 5–9/);
    expect(() => itGrade(2.5, 7)).toThrow(/outside the supported 3–500 mm/);
    expect(() => itGrade(500.5, 7)).toThrow(/outside the supported 3–500 mm/);
    expect(() => itGrade(Number.NaN, 7)).toThrow(/must be a number/);
  });
});

describe("iso286Limits", () => {
  it("50 H7 and 50 g6 match ISO 286-2 limit-deviation tables", () => {
    // ISO 286-2:2010 tables (also JIS B 0401): H7 30–50 = 0/+25 µm; g6 30–50 = −9/−25 µm
    expect(iso286Limits(50, "H7")).toEqual({ min: 50, max: 50.025 });
    expect(iso286Limits(50, "g6")).toEqual({ min: 49.975, max: 49.991 });
  });
  it("covers each shaft letter at 50 mm (ISO 286-2:2010 tables, from memory)", () => {
    // ISO 286-2:2010 shaft tables, 30–50 mm row (values from memory, each is es/ei ± IT)
    expect(iso286Deviations(50, "f7")).toEqual({ upper: -25, lower: -50 });
    expect(iso286Deviations(50, "h6")).toEqual({ upper: 0, lower: -16 });
    expect(iso286Deviations(50, "js6")).toEqual({ upper: 8, lower: -8 });
    expect(iso286Deviations(50, "k6")).toEqual({ upper: 18, lower: 2 });
    expect(iso286Deviations(50, "m6")).toEqual({ upper: 25, lower: 9 });
    expect(iso286Deviations(50, "n6")).toEqual({ upper: 33, lower: 17 });
    expect(iso286Deviations(50, "p6")).toEqual({ upper: 42, lower: 26 });
  });
  it("handles other sizes and grades", () => {
    // ISO 286-2:2010: 25 f7 = −20/−41; 100 H8 = 0/+54; 10 k5 = +1/+7; 200 p6 = +50/+79 (from memory)
    expect(iso286Limits(25, "f7")).toEqual({ min: 24.959, max: 24.98 });
    expect(iso286Limits(100, "H8")).toEqual({ min: 100, max: 100.054 });
    expect(iso286Limits(10, "k5")).toEqual({ min: 10.001, max: 10.007 });
    expect(iso286Limits(200, "p6")).toEqual({ min: 200.05, max: 200.079 });
  });
  it("js keeps the exact half for grades 5–6 and rounds odd IT7+ down (ISO 286-2 tables)", () => {
    // ISO 286-2:2010 js tables: 25 js6 = ±6.5 µm; 25 js7 = ±10 µm (IT7 = 21, odd); from memory
    expect(iso286Limits(25, "js6")).toEqual({ min: 24.9935, max: 25.0065 });
    expect(iso286Limits(25, "js7")).toEqual({ min: 24.99, max: 25.01 });
    expect(iso286Limits(40, "js8")).toEqual({ min: 39.981, max: 40.019 }); // IT8 = 39 → ±19
  });
  it("k in grades 8 and 9 has ei = 0 (ISO 286-1:2010 Table 3 note)", () => {
    expect(iso286Deviations(50, "k8")).toEqual({ upper: 39, lower: 0 });
  });
  it("puts a size on a range boundary in the lower range", () => {
    // 18 mm belongs to 10–18 (g6: −6/−17), 18.5 mm to 18–30 (g6: −7/−20)
    expect(iso286Deviations(18, "g6")).toEqual({ upper: -6, lower: -17 });
    expect(iso286Deviations(18.5, "g6")).toEqual({ upper: -7, lower: -20 });
  });
  it("forms limits without float noise", () => {
    expect(iso286Limits(12.345, "H7").max).toBe(12.363);
    expect(iso286Limits(500, "p6")).toEqual({ min: 500.068, max: 500.108 });
  });
  it("rejects classes it does not cover, naming what it does", () => {
    for (const bad of ["G7", "JS7", "h10", "e8", "H", "7", "", "r6"]) {
      expect(() => iso286Limits(50, bad)).toThrow(/supported: holes H; shafts f, g, h, js, k, m, n, p; grades 5–9/);
    }
    expect(() => iso286Limits(600, "H7")).toThrow(/outside the supported/);
    expect(() => iso286Limits(1, "H7")).toThrow(/outside the supported/);
  });
});

describe("iso286Fit", () => {
  it("50 H7/g6 clears 0.009 to 0.050 mm", () => {
    // ISO 286-2:2010 worked limits; 50 H7/g6 clearance 9..50 µm
    expect(iso286Fit(50, "H7", "g6")).toEqual({ minClearance: 0.009, maxClearance: 0.05 });
  });
  it("a press fit shows as negative clearance (interference)", () => {
    // 50 H7/p6: hole 0/+25, shaft +26/+42 → clearance −0.042 … −0.001 mm
    expect(iso286Fit(50, "H7", "p6")).toEqual({ minClearance: -0.042, maxClearance: -0.001 });
  });
  it("wants the hole first", () => {
    expect(() => iso286Fit(50, "g6", "H7")).toThrow(/hole class/);
  });
});
