import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { gradeFile, gradeFileSchema, gradeTableSchema } from "@/lib/schemas/bearing-grades";

// The example printed in docs/bearing-grades.md must be a file the import reads.
const docs = readFileSync("docs/bearing-grades.md", "utf8");
const example = JSON.parse(/```json\n([\s\S]*?)```/.exec(docs)![1]);

const messages = (r: { success: boolean; error?: { issues: { message: string }[] } }) =>
  r.error?.issues.map((i) => i.message) ?? [];

describe("grade table files (tenthwise.bearing-grades, version 1)", () => {
  it("reads the documented example", () => {
    const parsed = gradeFileSchema.parse(example);
    expect(parsed.tables[0].cells).toHaveLength(3);
    expect(parsed.tables[0].grades[1]).toEqual({ grade: "3", wallMin: 1.487, wallMax: 1.49 });
  });

  it("writes what it reads", () => {
    const file = gradeFile(example.tables, new Date("2026-12-01T09:30:00Z"));
    expect(gradeFileSchema.parse(JSON.parse(JSON.stringify(file)))).toEqual({
      ...example,
      exportedAt: "2026-12-01T09:30:00.000Z",
    });
  });

  it("refuses another format, another version and unknown fields, saying what is wrong", () => {
    expect(messages(gradeFileSchema.safeParse({ ...example, format: "x" }))).toEqual([
      "Not a grade table file (format must be tenthwise.bearing-grades)",
    ]);
    expect(messages(gradeFileSchema.safeParse({ ...example, version: 2 }))).toEqual([
      "This file's version is not one we read; version 1 is",
    ]);
    const extra = { ...example.tables[0], colour: "blue" };
    expect(gradeTableSchema.safeParse(extra).success).toBe(false);
  });

  it("refuses a wall that is a typing slip, a figure the column cannot keep and a cell naming no grade", () => {
    const t = example.tables[0];
    const slip = { ...t, grades: [{ grade: "2", wallMin: 14.84, wallMax: 14.87 }, t.grades[1]] };
    expect(messages(gradeTableSchema.safeParse(slip))).toContain(
      "A shell wall in mm lies between 0.5 and 6; check the figure",
    );
    const places = { ...t, grades: [{ grade: "2", wallMin: 1.4841234, wallMax: 1.487 }, t.grades[1]] };
    expect(gradeTableSchema.safeParse(places).success).toBe(false);
    const cells = [...t.cells, { housingCode: "3", journalCode: "1", grade: "9" }];
    expect(messages(gradeTableSchema.safeParse({ ...t, cells }))).toEqual([
      "Housing 3 × journal 1 names grade 9, which the table does not list",
    ]);
    expect(messages(gradeTableSchema.safeParse({ ...t, role: "cam" }))).toEqual(["Pick main, thrust or rod"]);
  });
});
