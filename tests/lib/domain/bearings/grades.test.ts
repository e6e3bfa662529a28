// A published factory selection table: Lexus SC 400 (1997, 1UZ-FE V8) repair manual, Connecting
// Rod Bearing, Service and Repair, "Bearing Selection": the bearing number is the sum of the number
// on the rod cap (big end inside diameter marks 1–4) and the number on the crank (pin diameter
// marks 1–3), with the standard bearing's centre wall thickness per mark 2–7.
import { describe, expect, it } from "vitest";
import {
  factoryGrades,
  gradedShellSet,
  gradeFor,
  gradeTableProblems,
  installedClearance,
  selectShells,
  type GradeTable,
} from "@/lib/domain";
import { journal, window } from "./shelf";

const BIG_END = { 1: [55.0, 55.006], 2: [55.006, 55.012], 3: [55.012, 55.018], 4: [55.018, 55.024] } as const;
const PIN = { 1: [51.994, 52.0], 2: [51.988, 51.994], 3: [51.982, 51.988] } as const;
const WALL: Record<number, [number, number]> = {
  2: [1.484, 1.487],
  3: [1.487, 1.49],
  4: [1.49, 1.493],
  5: [1.493, 1.496],
  6: [1.496, 1.499],
  7: [1.499, 1.502],
};
const CAPS = [1, 2, 3, 4] as const;
const PINS = [1, 2, 3] as const;

const table: GradeTable = {
  name: "V8 rods, sum of the marks",
  role: "rod",
  unit: "mm",
  grades: Object.entries(WALL).map(([grade, [wallMin, wallMax]]) => ({ grade, wallMin, wallMax })),
  cells: CAPS.flatMap((c) => PINS.map((p) => ({ housingCode: `${c}`, journalCode: `${p}`, grade: `${c + p}` }))),
};

describe("a factory grade table (1UZ-FE rods, Bearing Selection)", () => {
  it("is a table the core accepts", () => {
    expect(gradeTableProblems(table)).toEqual([]);
  });

  it("gives the summed grade for each pair of marks", () => {
    expect(gradeFor(table, "4", "3")?.upper).toEqual({ grade: "7", wallMin: 1.499, wallMax: 1.502 });
    expect(gradeFor(table, "1", "1")?.lower.grade).toBe("2");
    expect(gradeFor(table, "5", "1")).toBeUndefined();
  });

  it.each(CAPS.flatMap((c) => PINS.map((p) => [c, p] as const)))(
    "cap %i × pin %i: every part within its mark gives 0.026–0.044 mm, the same in every cell",
    (c, p) => {
      const [wallMin, wallMax] = WALL[c + p];
      const [boreMin, boreMax] = BIG_END[c];
      const [pinMin, pinMax] = PIN[p];
      const tightest = { housingBore: boreMin, upperWall: wallMax, lowerWall: wallMax, journal: pinMax };
      const loosest = { housingBore: boreMax, upperWall: wallMin, lowerWall: wallMin, journal: pinMin };
      expect(installedClearance(tightest).clearance).toBe(0.026);
      expect(installedClearance(loosest).clearance).toBe(0.044);
    },
  );

  it.each(CAPS.flatMap((c) => PINS.map((p) => [c, p] as const)))(
    "cap %i × pin %i measured at mid-mark: the selection picks the table's grade, unmixed, at the middle",
    (c, p) => {
      const mid = ([a, b]: readonly [number, number]) => Number(((a + b) / 2).toFixed(4));
      const j = journal("rod 1", mid(PIN[p]), mid(BIG_END[c]), {
        unit: "mm",
        housingCode: `${c}`,
        journalCode: `${p}`,
      });
      const sets = table.grades.map((g) =>
        gradedShellSet(table, g.grade, { id: g.grade, series: "factory", onHand: { upper: 1, lower: 1 } }),
      );
      const s = selectShells({ journals: [j], sets, windows: { rod: window(0.026, 0.044, 0.035, "mm") } });
      expect(s.results[0]).toMatchObject({ clearance: 0.035, mixed: false, upper: { setId: `${c + p}` } });
      expect(factoryGrades([j], table)[0].upper?.grade).toBe(`${c + p}`);
      // The 0.003 mm grade range is uncertainty: two walls of u = 0.0015/√3 each, U = 2·√2·0.0015/√3.
      expect(s.results[0].uncertainty).toBeCloseTo((2 * Math.SQRT2 * 0.0015) / Math.sqrt(3), 12);
    },
  );

  it("says what is wrong with a table or a journal's codes", () => {
    const bad: GradeTable = {
      ...table,
      grades: [...table.grades, { grade: "2", wallMin: 1.5, wallMax: 1.4 }],
      cells: [...table.cells, { housingCode: "1", journalCode: "1", grade: "9" }],
    };
    expect(gradeTableProblems(bad)).toEqual([
      "Grade 2 is listed twice; keep one line for it",
      "Grade 2: the wall range needs 0 < min ≤ max",
      "Housing 1 × journal 1 appears twice; keep one",
      "Housing 1 × journal 1 names grade 9, which the table does not list",
    ]);
    const codes = factoryGrades(
      [journal("rod 1", 52, 55, { housingCode: "9", journalCode: "1" }), journal("rod 2", 52, 55)],
      table,
    );
    expect(codes.map((g) => g.problem)).toEqual([
      "rod 1: the table has no grade for housing 9 × journal 1; check the codes",
      "rod 2: enter the housing and journal codes stamped on the parts",
    ]);
    expect(() => gradedShellSet(table, "9", { id: "x", series: "f", onHand: { upper: 1, lower: 1 } })).toThrow(
      /pick one of 2, 3/,
    );
  });

  it("takes a table that names the two halves apart", () => {
    const split: GradeTable = {
      ...table,
      cells: [{ housingCode: "1", journalCode: "1", grade: "2", lowerGrade: "3" }],
    };
    const found = gradeFor(split, "1", "1");
    expect([found?.upper.grade, found?.lower.grade]).toEqual(["2", "3"]);
  });
});
