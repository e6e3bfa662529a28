// The installed oil clearance a pair of halves will give, before the shells go in:
//   clearance = housing bore − (upper wall + lower wall) − journal diameter
// in exact decimals, with its uncertainty after JCGM 100:2008 (the GUM): the four inputs are
// uncorrelated and each enters with sensitivity coefficient ±1 (eq. 10), so
//   u_c² = u(bore)² + u(upper wall)² + u(lower wall)² + u(journal)²,  U = 2·u_c (k = 2, 6.2.1),
// each gauge's u being its certificate's U at k = 2 divided by 2 (4.3.3).
import type { LengthUnit, Verdict } from "../enums";
import { cleanDecimal } from "../units";
import { verdict } from "../verdict";
import type { BearingJournal, ClearanceWindow, JournalFigure } from "./types";
import { exactLength, type Dec, type HalfWall } from "./walls";

/**
 * The journal diameter the prediction uses. "largest" (the default) gives the tightest clearance:
 * the bore is measured vertical to the parting line, where the shells' walls are thickest and the
 * installed bore smallest, so with the largest journal diameter the figure is the journal's minimum
 * clearance, the one that guards against a seizure. "smallest" gives the loosest.
 */
export function journalFigure(journal: BearingJournal, figure: JournalFigure = "largest", unit?: LengthUnit): Dec {
  const to = unit ?? journal.unit;
  if (!Array.isArray(journal.diameters) || journal.diameters.length === 0) {
    throw new Error(`Journal ${journal.key}: enter at least one measured diameter`);
  }
  const all = journal.diameters.map((d, i) =>
    exactLength(d, journal.unit, to, `Journal ${journal.key} diameter ${i + 1}`),
  );
  return all.reduce((pick, d) => ((figure === "largest" ? d.gt(pick) : d.lt(pick)) ? d : pick));
}

/** The prediction for one journal and one pair of halves, in the working unit. */
export interface ClearancePrediction {
  clearance: Dec;
  /** Expanded uncertainty U (k = 2). */
  uncertainty: number;
}

function gaugeU(value: number, journal: BearingJournal, unit: LengthUnit, name: string): number {
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0) {
    throw new Error(`Journal ${journal.key}: the ${name} gauge's U must be zero or more; got ${String(value)}`);
  }
  return exactLength(value, journal.unit, unit, `Journal ${journal.key}: ${name} U`).toNumber();
}

/** Each figure of the stack in one unit, with the expanded uncertainty U (k = 2) of each (0 when unknown). */
export interface ClearanceStack {
  housingBore: number;
  upperWall: number;
  lowerWall: number;
  journal: number;
  housingU?: number;
  upperWallU?: number;
  lowerWallU?: number;
  journalU?: number;
}

/** The installed clearance of one stack of figures, exact, with its U (k = 2): the formula on its own. */
export function installedClearance(stack: ClearanceStack): { clearance: number; uncertainty: number } {
  const fig = (x: number, name: string) => exactLength(x, "in", "in", name);
  const u = (x: number | undefined, name: string) => {
    if (x === undefined) return 0;
    if (!(x >= 0)) throw new Error(`The ${name} U must be zero or more; got ${String(x)}`);
    return x / 2;
  };
  const clearance = fig(stack.housingBore, "Housing bore")
    .minus(fig(stack.upperWall, "Upper wall"))
    .minus(fig(stack.lowerWall, "Lower wall"))
    .minus(fig(stack.journal, "Journal diameter"));
  const parts = [
    u(stack.housingU, "housing bore"),
    u(stack.upperWallU, "upper wall"),
    u(stack.lowerWallU, "lower wall"),
    u(stack.journalU, "journal"),
  ];
  const uc = Math.sqrt(parts.reduce((sum, x) => sum + x * x, 0));
  return { clearance: clearance.toNumber(), uncertainty: cleanDecimal(2 * uc) };
}

/** Predicted installed clearance of `journal` with these halves, and its expanded uncertainty. */
export function predictClearance(
  journal: BearingJournal,
  upper: HalfWall,
  lower: HalfWall,
  unit: LengthUnit,
  figure: JournalFigure = "largest",
): ClearancePrediction {
  const bore = exactLength(journal.housingBore, journal.unit, unit, `Journal ${journal.key}: housing bore`);
  const clearance = bore
    .minus(upper.wall)
    .minus(lower.wall)
    .minus(journalFigure(journal, figure, unit));
  const uBore = gaugeU(journal.housingU, journal, unit, "housing bore") / 2;
  const uJournal = gaugeU(journal.journalU, journal, unit, "journal") / 2;
  const uc = Math.sqrt(uBore ** 2 + upper.u ** 2 + lower.u ** 2 + uJournal ** 2);
  return { clearance, uncertainty: 2 * uc };
}

/** The window restated in `unit`, checked: min ≤ target ≤ max. */
export function exactWindow(
  window: ClearanceWindow,
  unit: LengthUnit,
  role: string,
): { min: Dec; max: Dec; target: Dec } {
  const at = (x: number, name: string) => exactLength(x, window.unit, unit, `The ${role} window's ${name}`);
  const w = { min: at(window.min, "min"), max: at(window.max, "max"), target: at(window.target, "target") };
  if (w.min.gt(w.max)) throw new Error(`The ${role} window's min is above its max; swap them`);
  if (w.target.lt(w.min) || w.target.gt(w.max)) {
    throw new Error(`The ${role} window's target must lie between its min and max`);
  }
  return w;
}

/** The verdict of a predicted clearance against the window, with its U as guard band (ISO 14253-1). */
export function predictionVerdict(p: ClearancePrediction, w: { min: Dec; max: Dec }): Verdict {
  return verdict({
    value: p.clearance.toNumber(),
    min: w.min.toNumber(),
    max: w.max.toNumber(),
    uncertainty: p.uncertainty,
  });
}
