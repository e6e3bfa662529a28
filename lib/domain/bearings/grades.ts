// Factory grade tables: some makers stamp a code on each housing (block or rod) and each journal
// (crank) and print a table of the shell grade for every pair of codes, with each grade's wall
// thickness. The table is entered or imported in our own JSON (docs/bearing-grades.md); here it is
// checked, looked up and turned into graded sets the selection can use like any other.
import type { BearingJournal, FactoryGrade, GradeTable, ShellGrade, ShellSet } from "./types";

/** What is wrong with a table, each in words saying what to fix; empty when it can be used. */
export function gradeTableProblems(table: GradeTable): string[] {
  const problems: string[] = [];
  const names = new Set<string>();
  for (const g of table.grades) {
    if (names.has(g.grade)) problems.push(`Grade ${g.grade} is listed twice; keep one line for it`);
    names.add(g.grade);
    if (!(g.wallMin > 0) || !(g.wallMax >= g.wallMin)) {
      problems.push(`Grade ${g.grade}: the wall range needs 0 < min ≤ max`);
    }
  }
  const pairs = new Set<string>();
  for (const c of table.cells) {
    const pair = JSON.stringify([c.housingCode, c.journalCode]);
    if (pairs.has(pair)) problems.push(`Housing ${c.housingCode} × journal ${c.journalCode} appears twice; keep one`);
    pairs.add(pair);
    for (const g of [c.grade, c.lowerGrade]) {
      if (g !== undefined && !names.has(g)) {
        problems.push(
          `Housing ${c.housingCode} × journal ${c.journalCode} names grade ${g}, which the table does not list`,
        );
      }
    }
  }
  return problems;
}

function gradeNamed(table: GradeTable, name: string): ShellGrade | undefined {
  return table.grades.find((g) => g.grade === name);
}

/** The grade for each half of a housing code × journal code; undefined when the table has no such cell. */
export function gradeFor(
  table: GradeTable,
  housingCode: string,
  journalCode: string,
): { upper: ShellGrade; lower: ShellGrade } | undefined {
  const cell = table.cells.find((c) => c.housingCode === housingCode && c.journalCode === journalCode);
  const upper = cell && gradeNamed(table, cell.grade);
  const lower = cell && gradeNamed(table, cell.lowerGrade ?? cell.grade);
  return upper && lower ? { upper, lower } : undefined;
}

/** The factory's grades for each journal of the table's role, from its stamped codes. */
export function factoryGrades(journals: readonly BearingJournal[], table: GradeTable): FactoryGrade[] {
  return journals
    .filter((j) => j.role === table.role)
    .map((j) => {
      if (!j.housingCode || !j.journalCode) {
        return { key: j.key, problem: `${j.key}: enter the housing and journal codes stamped on the parts` };
      }
      const found = gradeFor(table, j.housingCode, j.journalCode);
      if (!found) {
        return {
          key: j.key,
          problem:
            `${j.key}: the table has no grade for housing ${j.housingCode} × journal ${j.journalCode}; ` +
            "check the codes",
        };
      }
      return { key: j.key, ...found };
    });
}

/** A graded set of one grade of the table, ready for the selection (its walls are the grade's range). */
export function gradedShellSet(
  table: GradeTable,
  grade: string,
  set: { id: string; series: string; onHand: ShellSet["onHand"] },
): ShellSet {
  const g = gradeNamed(table, grade);
  if (!g)
    throw new Error(
      `Grade ${grade} is not in the table ${table.name}; pick one of ${table.grades.map((x) => x.grade).join(", ")}`,
    );
  return {
    id: set.id,
    series: set.series,
    role: table.role,
    step: { kind: "graded", grade },
    wall: { source: "range", min: g.wallMin, max: g.wallMax },
    onHand: set.onHand,
    unit: table.unit,
  };
}
