// A set's wall thickness per half, in the unit the selection works in, with its standard uncertainty.
// A clearance-adjusting or undersize set whose walls were not entered takes the series' standard
// set's walls moved by half the stated amount: makers state the full set's change in diametral
// clearance (or the journal's undersize), and a set is two halves (common practice).
import Decimal from "decimal.js-light";
import type { LengthUnit } from "../enums";
import { cleanDecimal, convertLength } from "../units";
import type { ShellSet, ShellPosition } from "./types";

export const D = Decimal.clone({ precision: 40 });
export type Dec = InstanceType<typeof D>;

/** A length in `from` restated in `to` as the exact decimal it stands for (12 significant digits). */
export function exactLength(value: number, from: LengthUnit, to: LengthUnit, name: string): Dec {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new Error(`${name} must be a number; got ${String(value)}`);
  }
  return new D(cleanDecimal(convertLength(value, from, to)).toPrecision(12));
}

/** One half's wall and its standard uncertainty u (not U), both in the working unit. */
export interface HalfWall {
  wall: Dec;
  u: number;
}

export type SetWalls = Record<ShellPosition, HalfWall>;

/** The signed change of wall per half a set's step stands for, in the set's own unit. */
function stepWallChange(set: ShellSet): number {
  if (set.step.kind === "standard" || set.step.kind === "graded") return 0;
  const amount = set.step.amount;
  if (typeof amount !== "number" || !(amount > 0)) {
    throw new Error(
      `Set ${set.id}: a ${set.step.kind} set needs its amount (greater than zero); got ${String(amount)}`,
    );
  }
  if (set.step.kind === "thinner") return -amount / 2;
  return amount / 2;
}

function ownWalls(set: ShellSet, unit: LengthUnit): SetWalls | undefined {
  const w = set.wall;
  if (!w) return undefined;
  const at = (x: number, what: string) => exactLength(x, set.unit, unit, `Set ${set.id}: ${what}`);
  if (w.source === "nominal") {
    const half = { wall: at(w.thickness, "wall thickness"), u: 0 };
    return { upper: half, lower: half };
  }
  if (w.source === "range") {
    if (w.min > w.max) throw new Error(`Set ${set.id}: the wall range's min is above its max; swap them`);
    // GUM 4.3.7: a quantity known only to lie within a range, rectangular distribution: u = half-width / √3.
    const u = convertLength((w.max - w.min) / 2, set.unit, unit) / Math.sqrt(3);
    const half = { wall: at(w.min, "wall min").plus(at(w.max, "wall max")).div(2), u };
    return { upper: half, lower: half };
  }
  const u = convertLength(w.gaugeU, set.unit, unit) / 2;
  return { upper: { wall: at(w.upper, "upper wall"), u }, lower: { wall: at(w.lower, "lower wall"), u } };
}

/** The standard set of the same series and role with walls entered, that a stepped set is derived from. */
function baseSet(set: ShellSet, sets: readonly ShellSet[]): ShellSet | undefined {
  return sets.find(
    (s) => s.series === set.series && s.role === set.role && s.step.kind === "standard" && s.wall !== undefined,
  );
}

/**
 * The walls of each half of `set` in `unit`. Throws, naming the set, when a set has no walls and
 * none can be derived (no standard set of its series and role with walls entered).
 */
export function shellWalls(set: ShellSet, sets: readonly ShellSet[], unit: LengthUnit): SetWalls {
  const own = ownWalls(set, unit);
  if (own) return own;
  const base = set.step.kind === "standard" || set.step.kind === "graded" ? undefined : baseSet(set, sets);
  const baseWalls = base && ownWalls(base, unit);
  if (!baseWalls) {
    throw new Error(
      `Set ${set.id} (${set.series}) has no wall thickness: enter it from the maker's sheet or a ball ` +
        "micrometer, or enter the series' standard set with its walls so it can be derived",
    );
  }
  const change = exactLength(stepWallChange(set), set.unit, unit, `Set ${set.id}: step amount`);
  const moved = (h: HalfWall): HalfWall => ({ wall: h.wall.plus(change), u: h.u });
  return { upper: moved(baseWalls.upper), lower: moved(baseWalls.lower) };
}

/** How far under standard the set's journal is ground, in mm as a decimal string (0 for all but undersize). */
export function undersizeKey(set: ShellSet): string {
  if (set.step.kind !== "undersize") return "0";
  return exactLength(set.step.amount ?? 0, set.unit, "mm", `Set ${set.id}: undersize`).toString();
}
