// Factory grade tables for bearing shells, and their file format (docs/bearing-grades.md says it
// all with an example). The same schemas check the table editor, the import screen and the routes.
//
// ── The grade table file, format "tenthwise.bearing-grades", version 1 ─────────────────────────
//   {
//     "format": "tenthwise.bearing-grades",   // always this string
//     "version": 1,                           // this layout; a later layout gets a new number
//     "exportedAt": "2026-12-01T09:30:00Z",   // optional, ISO 8601, informational
//     "tables": [                             // 1–20 tables (rods and mains are separate tables)
//       { "name": "V8 rods, factory grades",  // 1–120 characters, our own words
//         "role": "rod",                      // main | thrust | rod
//         "unit": "mm",                       // in | mm: every wall figure of this table
//         "grades": [                         // 1–40: each shell grade with its wall range per half
//           { "grade": "2", "wallMin": 1.484, "wallMax": 1.487 } ],
//         "cells": [                          // 1–400: housing code × journal code → grade
//           { "housingCode": "1", "journalCode": "1", "grade": "2" },
//           { "housingCode": "1", "journalCode": "2", "grade": "3", "lowerGrade": "2" } ] }
//     ]
//   }
// `lowerGrade` is for tables naming the two halves apart; without it both halves take `grade`.
// Codes and grades are text as stamped (numbers, letters, colours). Unknown fields are refused.
import { z } from "zod";
import { BEARING_ROLES, LENGTH_UNITS, gradeTableProblems, type GradeTable } from "@/lib/domain";
import { storedText } from "./stored-text";
import { keptBy } from "./stored-figure";
import type { ColumnPrecision } from "@/lib/domain";

export const BEARING_GRADES_FORMAT = "tenthwise.bearing-grades";

/** Shell wall figures (grade ranges, nominal and measured walls): kept as DECIMAL(10,6). */
export const BEARING_WALL_PRECISION: ColumnPrecision = { digits: 10, places: 6 };

/** A wall a shell can have, per unit: anything outside is a typing slip (a plausibility check, not a limit). */
export const PLAUSIBLE_WALL = { in: { min: 0.02, max: 0.25 }, mm: { min: 0.5, max: 6 } } as const;

const code = (what: string) =>
  storedText(what)
    .trim()
    .min(1, `Enter the ${what.toLowerCase()}`)
    .max(16, `Keep the ${what.toLowerCase()} to 16 characters, as stamped`);

const wall = (what: string) =>
  z.number({ error: `Enter the ${what} as a number` }).superRefine(keptBy(BEARING_WALL_PRECISION, `The ${what}`));

export const shellGradeSchema = z.strictObject({
  grade: code("Grade"),
  wallMin: wall("smallest wall"),
  wallMax: wall("largest wall"),
});

export const gradeCellSchema = z.strictObject({
  housingCode: code("Housing code"),
  journalCode: code("Journal code"),
  grade: code("Grade"),
  lowerGrade: code("Lower half's grade").optional(),
});

export const gradeTableSchema = z
  .strictObject({
    name: storedText("The table's name").trim().min(1, "Name the table").max(120, "Keep the name to 120 characters"),
    role: z.enum(BEARING_ROLES, { error: "Pick main, thrust or rod" }),
    unit: z.enum(LENGTH_UNITS, { error: "Pick the unit of the wall figures: in or mm" }),
    grades: z.array(shellGradeSchema).min(1, "List at least one grade").max(40, "A table has at most 40 grades"),
    cells: z.array(gradeCellSchema).min(1, "Enter at least one cell").max(400, "A table has at most 400 cells"),
  })
  .superRefine((table, ctx) => {
    const plausible = PLAUSIBLE_WALL[table.unit];
    table.grades.forEach((g, i) => {
      for (const k of ["wallMin", "wallMax"] as const) {
        if (g[k] < plausible.min || g[k] > plausible.max) {
          ctx.addIssue({
            code: "custom",
            path: ["grades", i, k],
            message:
              `A shell wall in ${table.unit} lies between ${plausible.min} and ${plausible.max}; ` + "check the figure",
          });
        }
      }
    });
    for (const message of gradeTableProblems(table)) ctx.addIssue({ code: "custom", path: [], message });
  }) satisfies z.ZodType<GradeTable>;

export const gradeFileSchema = z.strictObject({
  format: z.literal(BEARING_GRADES_FORMAT, {
    error: `Not a grade table file (format must be ${BEARING_GRADES_FORMAT})`,
  }),
  version: z.literal(1, { error: "This file's version is not one we read; version 1 is" }),
  exportedAt: z.iso.datetime({ error: "exportedAt must be an ISO 8601 time" }).optional(),
  tables: z.array(gradeTableSchema).min(1, "The file holds no tables").max(20, "A file holds at most 20 tables"),
});

export type GradeFile = z.infer<typeof gradeFileSchema>;

/** A grade table file as written by us: the same layout an import reads. */
export function gradeFile(tables: GradeTable[], exportedAt?: Date): GradeFile {
  return {
    format: BEARING_GRADES_FORMAT,
    version: 1,
    ...(exportedAt ? { exportedAt: exportedAt.toISOString() } : {}),
    tables,
  };
}
