// Every allowed pair of halves for every journal, with its prediction and its cost. The cost ranks
// choices in the order the shop asks for them: every journal in its window first (how many miss,
// then by how much), then as near the target as the stock allows, then as few mixed journals as
// possible. Its parts are whole numbers (nanometre-scale steps of the unit), so sums are exact.
import type { LengthUnit } from "../enums";
import { allowedPairs, ladderSets, type LadderSet, type ShellPair } from "./pairs";
import { exactWindow, predictClearance, type ClearancePrediction } from "./predict";
import type { BearingJournal, BearingRole, ClearanceWindow, SelectionInput } from "./types";
import type { Dec } from "./walls";

/** [journals without shells, journals outside the window, distance outside, distance from target, mixed]. */
export type Cost = readonly number[];
export const ZERO_COST: Cost = [0, 0, 0, 0, 0];
export const NO_SHELLS_COST: Cost = [1, 0, 0, 0, 0];

export interface Candidate {
  pair: ShellPair;
  prediction: ClearancePrediction;
  inWindow: boolean;
  cost: Cost;
}

export interface JournalContext {
  journal: BearingJournal;
  unit: LengthUnit;
  window: { min: Dec; max: Dec; target: Dec };
  /** Allowed pairs, best first (ties keep the sets' order). */
  candidates: Candidate[];
}

export interface Prepared {
  contexts: JournalContext[];
  /** The sets in each role's working unit (sets listed once per unit used). */
  ladders: Map<LengthUnit, LadderSet[]>;
}

const SCALE = 1e9;
const whole = (x: Dec): number => x.times(SCALE).toDecimalPlaces(0).toNumber();

export function addCost(a: Cost, b: Cost): Cost {
  return a.map((x, i) => x + b[i]);
}

export function compareCost(a: Cost, b: Cost): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] < b[i] ? -1 : 1;
  return 0;
}

function windowFor(windows: SelectionInput["windows"], role: BearingRole): ClearanceWindow {
  const w = windows[role] ?? (role === "thrust" ? windows.main : undefined);
  if (!w) throw new Error(`Enter the ${role === "rod" ? "rod" : "main"} bearing clearance window (min, max, target)`);
  return w;
}

function candidate(
  journal: BearingJournal,
  pair: ShellPair,
  ctx: Omit<JournalContext, "candidates">,
  input: SelectionInput,
): Candidate {
  const prediction = predictClearance(
    journal,
    pair.upper.walls.upper,
    pair.lower.walls.lower,
    ctx.unit,
    input.journalFigure,
  );
  const c = prediction.clearance;
  const { min, max, target } = ctx.window;
  const outside = c.lt(min) ? min.minus(c) : c.gt(max) ? c.minus(max) : undefined;
  const mixed = pair.upper.index !== pair.lower.index ? 1 : 0;
  const cost = [0, outside ? 1 : 0, outside ? whole(outside) : 0, whole(c.minus(target).abs()), mixed];
  return { pair, prediction, inWindow: !outside, cost };
}

/** Checks the input and works out every journal's candidates; throws with words saying what to fix. */
export function prepare(input: SelectionInput): Prepared {
  if (!input || !Array.isArray(input.journals) || !Array.isArray(input.sets)) {
    throw new Error("Bearing selection needs the journals and the shell sets on the shelf");
  }
  const keys = new Set<string>();
  for (const j of input.journals) {
    if (keys.has(j.key)) throw new Error(`Two journals are named ${j.key}; give each its own name`);
    keys.add(j.key);
  }
  const ids = new Set(input.sets.map((s) => s.id));
  if (ids.size !== input.sets.length) throw new Error("Two shell sets share an id; each set needs its own");
  const ladders = new Map<LengthUnit, LadderSet[]>();
  const contexts = input.journals.map((journal) => {
    const raw = journal.window ?? windowFor(input.windows, journal.role);
    const unit = raw.unit;
    if (!ladders.has(unit)) ladders.set(unit, ladderSets(input.sets, unit));
    const base = { journal, unit, window: exactWindow(raw, unit, journal.role) };
    const pairs = allowedPairs(ladders.get(unit)!, journal.role, unit);
    const candidates = pairs.map((p) => candidate(journal, p, base, input));
    // Stable sort: equal costs keep the sets' order, so the answer never depends on a journal's name.
    candidates.sort((a, b) => compareCost(a.cost, b.cost));
    return { ...base, candidates };
  });
  return { contexts, ladders };
}
