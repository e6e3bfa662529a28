// The words for bearing shells and the selection's advice. The lead's page, the pick list, the
// tablet's bearing stations and the build record all take them from here.
import type { LengthUnit } from "../enums";
import { DISPLAY_RESOLUTION, roundToResolution } from "../units";
import { UNIT_WORDS } from "../words";
import type { BearingAdvice, BearingRole, ShellPosition, ShellSet, ShellStep } from "./types";

export const BEARING_ROLE_WORDS: Readonly<Record<BearingRole, string>> = {
  main: "Main",
  thrust: "Thrust main",
  rod: "Rod",
};

/** A length at its unit's display step with the unit: 0.00305 in → "0.0031 in". */
export function lengthWords(x: number, unit: LengthUnit): string {
  const places = DISPLAY_RESOLUTION[unit].split(".")[1].length;
  return `${roundToResolution(x, unit).toFixed(places)} ${UNIT_WORDS[unit]}`;
}

/**
 * A set's size: "standard", "0.001 in thicker", "0.001 in thinner (extra clearance)", "0.25 mm undersize",
 * "grade 2".
 */
export function shellStepWords(step: ShellStep, unit: LengthUnit): string {
  const amount = step.amount !== undefined ? `${step.amount} ${UNIT_WORDS[unit]}` : "";
  switch (step.kind) {
    case "standard":
      return "standard";
    case "thicker":
      return `${amount} thicker`;
    case "thinner":
      return `${amount} thinner (extra clearance)`;
    case "undersize":
      return `${amount} undersize`;
    case "graded":
      return step.grade ? `grade ${step.grade}` : "graded";
  }
}

/** A set as the pick list names it: "Series X, rod, 0.001 in thicker". */
export function shellSetWords(set: Pick<ShellSet, "series" | "role" | "step" | "unit">): string {
  return `${set.series}, ${BEARING_ROLE_WORDS[set.role].toLowerCase()}, ${shellStepWords(set.step, set.unit)}`;
}

/** Where a half goes: on a main the block or cap side, on a rod the rod or cap side. */
export function halfPlaceWords(role: BearingRole, position: ShellPosition): string {
  if (role === "rod") return position === "upper" ? "rod side (upper)" : "cap side (lower)";
  return position === "upper" ? "block side (upper)" : "cap side (lower)";
}

/** The advice for a journal left outside its window, in one sentence the lead can act on. */
export function bearingAdviceWords(
  advice: BearingAdvice,
  sets: readonly Pick<ShellSet, "id" | "series" | "role" | "step" | "unit">[] = [],
): string {
  const at = (x: number | undefined) => (x === undefined ? "" : lengthWords(Math.abs(x), advice.unit));
  const nearest = advice.nearest !== undefined ? `the nearest the shelf allows is ${at(advice.nearest)}, ` : "";
  const side = (advice.miss ?? 0) > 0 ? "loose" : "tight";
  const misses = advice.miss !== undefined ? `${at(advice.miss)} ${side} of the window` : "";
  const amount = at(advice.amount);
  switch (advice.kind) {
    case "no_shells":
      return `${advice.key}: no shells on the shelf fit this journal; enter the sets for it`;
    case "more_stock": {
      const set = sets.find((s) => s.id === advice.setId);
      const which = set ? shellSetWords(set) : "the set used up";
      return `${advice.key}: the window is reachable, but the halves ran out; add halves of ${which}`;
    }
    case "order_thicker":
      return `${advice.key}: ${nearest}${misses}. Order a set about ${amount} thicker than the halves chosen`;
    case "order_thinner":
      return `${advice.key}: ${nearest}${misses}. Order an extra-clearance set about ${amount} thinner`;
    case "grind_undersize":
      return (
        `${advice.key}: ${nearest}${misses}, beyond what a clearance-adjusting set can make up. ` +
        (side === "tight" ? "Check the housing bore and journal again; if they stand, " : "") +
        "grind the journal undersize and fit undersize shells (the crank maker's limits govern)"
      );
  }
}
