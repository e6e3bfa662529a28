// Which halves may go together in one journal (common practice): both halves of one maker's series
// and of the journal's role (a thrust main takes thrust shells, which may be another series), the
// same undersize, and never more than one step apart. A step is one place on the series' ladder:
// the sets of that series, role and undersize listed for the job, ordered by wall thickness (sets
// with none left still hold their place, so using up the middle size never lets the ends mix).
import type { LengthUnit } from "../enums";
import type { BearingRole, ShellSet } from "./types";
import { shellWalls, undersizeKey, type SetWalls } from "./walls";

/** A set with its walls in the working unit and its place on its series' ladder. */
export interface LadderSet {
  index: number;
  set: ShellSet;
  walls: SetWalls;
  ladder: string;
  rung: number;
}

/** An allowed upper/lower pairing, as indexes into the sets list. */
export interface ShellPair {
  upper: LadderSet;
  lower: LadderSet;
}

/** Every set with its walls and rung; throws (naming the set) when a set's walls cannot be known. */
export function ladderSets(sets: readonly ShellSet[], unit: LengthUnit): LadderSet[] {
  const placed = sets.map((set, index) => {
    const walls = shellWalls(set, sets, unit);
    const ladder = JSON.stringify([set.series, set.role, undersizeKey(set)]);
    return { index, set, walls, ladder, total: walls.upper.wall.plus(walls.lower.wall) };
  });
  return placed.map(({ total, ...p }) => {
    const below = new Set(
      placed.filter((o) => o.ladder === p.ladder && o.total.lt(total)).map((o) => o.total.toString()),
    );
    return { ...p, rung: below.size };
  });
}

/** Whether two sets may give the upper and lower halves of one journal of `role`. */
export function mayPair(upper: LadderSet, lower: LadderSet, role: BearingRole): boolean {
  return (
    upper.set.role === role &&
    lower.set.role === role &&
    upper.ladder === lower.ladder &&
    Math.abs(upper.rung - lower.rung) <= 1
  );
}

/** Every allowed pairing for a journal of `role`, uppers in the sets' order, then lowers. */
export function allowedPairs(ladder: readonly LadderSet[], role: BearingRole): ShellPair[] {
  const pairs: ShellPair[] = [];
  for (const upper of ladder) {
    for (const lower of ladder) if (mayPair(upper, lower, role)) pairs.push({ upper, lower });
  }
  return pairs;
}
