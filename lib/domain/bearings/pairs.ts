// Which halves may go together in one journal (common practice): both halves of one maker's series
// and of the journal's role (a thrust main takes thrust shells, which may be another series), the
// same undersize, and never more than one step apart. A step is one place on the series' ladder:
// the sets of that series, role and undersize listed for the job, ordered by wall thickness (sets
// with none left still hold their place, so using up the middle size never lets the ends mix).
// Two more select-fit rules bearing makers publish for mixing: the walls of the two halves differ
// by no more than 0.0005 in, and the thicker half goes where the load is, on the rod side of a rod
// and in the cap of a main.
import type { LengthUnit } from "../enums";
import type { BearingRole, ShellSet } from "./types";
import { exactLength, shellWalls, undersizeKey, type Dec, type SetWalls } from "./walls";

/** The largest wall difference between the two halves of one journal (common practice: 0.0005 in). */
export const MIXED_WALL_LIMIT_IN = 0.0005;

/** A set with its walls in the working unit and its place on its series' ladder. */
export interface LadderSet {
  index: number;
  set: ShellSet;
  walls: SetWalls;
  ladder: string;
  rung: number;
  /** Both halves' walls together, to compare sets' sizes. */
  total: Dec;
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
  return placed.map((p) => {
    const below = new Set(
      placed.filter((o) => o.ladder === p.ladder && o.total.lt(p.total)).map((o) => o.total.toString()),
    );
    return { ...p, rung: below.size };
  });
}

/** Why two sets may not give the upper and lower halves of one journal of `role`; undefined when they may. */
export function pairRefusal(upper: LadderSet, lower: LadderSet, role: BearingRole, unit: LengthUnit) {
  if (upper.set.role !== role || lower.set.role !== role) return "role" as const;
  if (upper.set.series !== lower.set.series) return "series" as const;
  if (upper.ladder !== lower.ladder) return "undersize" as const;
  if (Math.abs(upper.rung - lower.rung) > 1) return "steps" as const;
  const upperWall = upper.walls.upper.wall;
  const lowerWall = lower.walls.lower.wall;
  const limit = exactLength(MIXED_WALL_LIMIT_IN, "in", unit, "Mixed wall limit");
  if (upperWall.minus(lowerWall).abs().gt(limit)) return "walls" as const;
  // The thicker half carries the load: the rod side (upper) of a rod, the cap (lower) of a main.
  const thickerUp = upper.total.gt(lower.total);
  const thickerDown = lower.total.gt(upper.total);
  if (role === "rod" ? thickerDown : thickerUp) return "placement" as const;
  return undefined;
}

export type PairRefusal = NonNullable<ReturnType<typeof pairRefusal>>;

/** Whether two sets may give the upper and lower halves of one journal of `role`. */
export function mayPair(upper: LadderSet, lower: LadderSet, role: BearingRole, unit: LengthUnit): boolean {
  return pairRefusal(upper, lower, role, unit) === undefined;
}

/** Every allowed pairing for a journal of `role`, uppers in the sets' order, then lowers. */
export function allowedPairs(ladder: readonly LadderSet[], role: BearingRole, unit: LengthUnit): ShellPair[] {
  const pairs: ShellPair[] = [];
  for (const upper of ladder) {
    for (const lower of ladder) if (mayPair(upper, lower, role, unit)) pairs.push({ upper, lower });
  }
  return pairs;
}
