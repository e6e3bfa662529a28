// A chosen pair per journal turned into the answer the screens show: the halves, the predicted
// clearance with its U and verdict, the halves used and left of every set, and advice for each
// journal left outside its window.
import { cleanDecimal } from "../units";
import { adviceFor } from "./advice";
import type { Candidate, Prepared } from "./candidates";
import { journalFigure, predictionVerdict } from "./predict";
import type { ChosenHalf, JournalFigure, JournalResult, Selection, ShellSet, StockLine } from "./types";
import type { LadderSet } from "./pairs";

function half(l: LadderSet, position: "upper" | "lower"): ChosenHalf {
  return { setId: l.set.id, series: l.set.series, step: l.set.step, wall: l.walls[position].wall.toNumber() };
}

/** Halves of each set the chosen pairs take, and what is left on the shelf. */
export function stockLines(chosen: readonly (Candidate | undefined)[], sets: readonly ShellSet[]): StockLine[] {
  return sets.map((set, i) => {
    const upper = chosen.filter((c) => c?.pair.upper.index === i).length;
    const lower = chosen.filter((c) => c?.pair.lower.index === i).length;
    return {
      setId: set.id,
      used: { upper, lower },
      left: { upper: set.onHand.upper - upper, lower: set.onHand.lower - lower },
    };
  });
}

export function buildSelection(
  prepared: Prepared,
  chosen: readonly (Candidate | undefined)[],
  sets: readonly ShellSet[],
  figure?: JournalFigure,
): Selection {
  const stock = stockLines(chosen, sets);
  const results: JournalResult[] = prepared.contexts.map((ctx, i) => {
    const c = chosen[i];
    const journalDiameter = journalFigure(ctx.journal, figure, ctx.unit).toNumber();
    const base = { key: ctx.journal.key, role: ctx.journal.role, unit: ctx.unit, journalDiameter };
    if (!c) return { ...base, mixed: false, inWindow: false };
    return {
      ...base,
      upper: half(c.pair.upper, "upper"),
      lower: half(c.pair.lower, "lower"),
      clearance: c.prediction.clearance.toNumber(),
      uncertainty: cleanDecimal(c.prediction.uncertainty),
      verdict: predictionVerdict(c.prediction, ctx.window),
      mixed: c.pair.upper.index !== c.pair.lower.index,
      inWindow: c.inWindow,
    };
  });
  const advice = prepared.contexts.flatMap((ctx, i) => adviceFor(ctx, chosen[i], stock) ?? []);
  return { results, stock, advice, allInWindow: results.every((r) => r.inWindow) };
}
