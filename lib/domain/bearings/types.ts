// The shapes of bearing shell selection: the shells on the shelf, the measured journals and housings,
// the clearance window, and what the selection answers. Every length is a plain number in the unit
// stated beside it (in or mm); the core converts to the window's unit and computes in exact decimals.
import type { LengthUnit, Verdict } from "../enums";

/** Which journals a set fits: mains, the thrust main (flanged, often another series) or rods. */
export const BEARING_ROLES = ["main", "thrust", "rod"] as const;
export type BearingRole = (typeof BEARING_ROLES)[number];

/**
 * A set's size against the maker's standard shell: standard; thicker or thinner by a stated amount
 * (a clearance-adjusting set); undersize for a reground journal; or a graded shell with its wall range.
 */
export const SHELL_STEP_KINDS = ["standard", "thicker", "thinner", "undersize", "graded"] as const;
export type ShellStepKind = (typeof SHELL_STEP_KINDS)[number];

/** Where a half goes: upper (block side; rod side on a rod) or lower (main cap; rod cap). */
export const SHELL_POSITIONS = ["upper", "lower"] as const;
export type ShellPosition = (typeof SHELL_POSITIONS)[number];

/** Which of a journal's measured diameters the prediction uses (see `journalFigure`). */
export const JOURNAL_FIGURES = ["largest", "smallest"] as const;
export type JournalFigure = (typeof JOURNAL_FIGURES)[number];

export interface ShellStep {
  kind: ShellStepKind;
  /**
   * thicker / thinner: how much a full set changes the diametral clearance, as makers state it
   * (a "0.001 in thicker" set tightens by 0.001 in, so one of its halves by 0.0005 in);
   * undersize: how far under standard the journal is ground (0.010 in, 0.25 mm). Not used otherwise.
   */
  amount?: number;
  /** graded: the maker's grade mark (stamped number, letter or colour), as printed on the shell. */
  grade?: string;
}

/**
 * A half's wall thickness. `nominal`: the maker's sheet, the same for both halves; `range`: a graded
 * shell's stated range (the middle is predicted, the range counts as uncertainty); `measured`: each
 * half position measured with a ball micrometer, with that gauge's U (k = 2).
 */
export type ShellWall =
  | { source: "nominal"; thickness: number }
  | { source: "range"; min: number; max: number }
  | { source: "measured"; upper: number; lower: number; gaugeU: number };

/** One kind of shell on the shelf for a job. */
export interface ShellSet {
  id: string;
  /** The maker's series in our own free text; halves mix only within one series. */
  series: string;
  role: BearingRole;
  step: ShellStep;
  /** Absent for a thicker, thinner or undersize set: derived from the series' standard set and the amount. */
  wall?: ShellWall;
  /** Halves on hand per position (a boxed set gives as many uppers as lowers). */
  onHand: { upper: number; lower: number };
  unit: LengthUnit;
}

/** One journal with its housing, as measured. */
export interface BearingJournal {
  /** The shop's name for it ("main 1", "rod 3"); never used to decide anything. */
  key: string;
  role: BearingRole;
  /** Every diameter measured: both positions (ends) and both axes; at least one. */
  diameters: number[];
  /** Expanded uncertainty U (k = 2) of the journal's gauge, in `unit`; 0 when unknown. */
  journalU: number;
  /** Housing bore (main saddle or rod big end) measured without shells, vertical to the parting line. */
  housingBore: number;
  /** Expanded uncertainty U (k = 2) of the bore gauge, in `unit`; 0 when unknown. */
  housingU: number;
  /** Factory codes stamped on the block or rod and on the crank, when a grade table is used. */
  housingCode?: string;
  journalCode?: string;
  /** This journal's own window, when its limits differ from its role's (a per-inch rule, one odd journal). */
  window?: ClearanceWindow;
  unit: LengthUnit;
}

/** The shop's oil clearance window for a role, and the figure it aims at inside it. */
export interface ClearanceWindow {
  min: number;
  max: number;
  target: number;
  unit: LengthUnit;
}

export interface SelectionInput {
  journals: BearingJournal[];
  sets: ShellSet[];
  /** Windows per role (a journal's own `window` comes first); a thrust journal without one takes the main window. */
  windows: { main?: ClearanceWindow; rod?: ClearanceWindow; thrust?: ClearanceWindow };
  /** Default "largest": the tightest clearance, as the bore is measured at its tight (vertical) axis. */
  journalFigure?: JournalFigure;
}

/** A half as chosen, with its wall in the window's unit. */
export interface ChosenHalf {
  setId: string;
  series: string;
  step: ShellStep;
  wall: number;
}

/** The answer for one journal. */
export interface JournalResult {
  key: string;
  role: BearingRole;
  /** Undefined when no shells on the shelf fit this journal's role. */
  upper?: ChosenHalf;
  lower?: ChosenHalf;
  /** The journal diameter the prediction used (see `journalFigure` in SelectionInput), window's unit. */
  journalDiameter: number;
  /** Predicted installed clearance in the window's unit (undefined without shells). */
  clearance?: number;
  /** Its expanded uncertainty U (k = 2), GUM law of propagation, same unit. */
  uncertainty?: number;
  /** Against the window with a guard band of U (ISO 14253-1, as every other verdict). */
  verdict?: Verdict;
  /** Upper and lower halves come from different sets. */
  mixed: boolean;
  /** Inside the window's min and max (edges included), before any guard band. */
  inWindow: boolean;
  unit: LengthUnit;
}

/** Halves of one set taken and left. */
export interface StockLine {
  setId: string;
  used: { upper: number; lower: number };
  left: { upper: number; lower: number };
}

export const BEARING_ADVICE_KINDS = [
  "order_thicker",
  "order_thinner",
  "grind_undersize",
  "more_stock",
  "no_shells",
] as const;
export type BearingAdviceKind = (typeof BEARING_ADVICE_KINDS)[number];

/** What to do about a journal the stock cannot bring into its window. */
export interface BearingAdvice {
  kind: BearingAdviceKind;
  key: string;
  /** The nearest predicted clearance and how far it misses the window (positive: loose; negative: tight). */
  nearest?: number;
  miss?: number;
  /**
   * order_thicker / order_thinner: how much thicker or thinner than the chosen halves a set must be to
   * reach the target, stated as makers state sets (the full set's change in clearance).
   */
  amount?: number;
  /** more_stock: the set whose halves ran out. */
  setId?: string;
  unit: LengthUnit;
}

export interface Selection {
  /** In the order the journals were given. */
  results: JournalResult[];
  stock: StockLine[];
  /** Empty when every journal lands in its window. */
  advice: BearingAdvice[];
  /** True when every journal with shells is inside its window. */
  allInWindow: boolean;
}

/** A choice made by hand: which set each half of a journal comes from. */
export interface HandChoice {
  key: string;
  upperSetId: string;
  lowerSetId: string;
}

/** A hand choice the rules refuse: what is wrong, in words the lead can act on. */
export interface ChoiceProblem {
  /** The journal the problem is about, or the set (counts on hand). */
  key?: string;
  setId?: string;
  message: string;
}

/** A shell grade of a factory grade table and its wall thickness range (per half). */
export interface ShellGrade {
  grade: string;
  wallMin: number;
  wallMax: number;
}

/**
 * A factory grade table: the shell grade for each housing code × journal code, and each grade's wall
 * range. Imported or typed in our own JSON (docs/bearing-grades.md, lib/schemas/bearing-grades.ts).
 */
export interface GradeTable {
  name: string;
  role: BearingRole;
  unit: LengthUnit;
  grades: ShellGrade[];
  cells: GradeCell[];
}

/** One cell: the grade for both halves, or for the upper half when the table names the lower's apart. */
export interface GradeCell {
  housingCode: string;
  journalCode: string;
  grade: string;
  lowerGrade?: string;
}

/** What a grade table gives for one journal (a grade per half), or why it gives nothing. */
export interface FactoryGrade {
  key: string;
  upper?: ShellGrade;
  lower?: ShellGrade;
  problem?: string;
}
