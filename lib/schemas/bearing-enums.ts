// The value sets of bearing shell selection. Roles and step kinds are the core's
// (lib/domain/bearings/types.ts); where a wall comes from is how a set is stored and entered.
import { BEARING_ROLES, SHELL_STEP_KINDS, type BearingRole, type ShellStepKind } from "@/lib/domain";

export { BEARING_ROLES, SHELL_STEP_KINDS, type BearingRole, type ShellStepKind };

/**
 * Where a wall thickness comes from: the maker's sheet, a graded shell's range from the maker's table,
 * or a ball micrometer on each half (the core's ShellWall sources).
 */
export const WALL_SOURCES = ["nominal", "range", "measured"] as const;
export type WallSource = (typeof WALL_SOURCES)[number];

/** The form's names for each step kind (the core's shellStepWords says a set's size with its amount). */
export const STEP_KIND_WORDS: Record<ShellStepKind, string> = {
  standard: "Standard",
  thicker: "Thicker wall",
  thinner: "Thinner wall (extra clearance)",
  undersize: "Undersize",
  graded: "Graded",
};

export const WALL_SOURCE_WORDS: Record<WallSource, string> = {
  nominal: "Maker's nominal",
  range: "Grade range",
  measured: "Ball micrometer, each half",
};
