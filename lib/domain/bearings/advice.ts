// What to do about a journal left outside its window. When the journal on its own could reach the
// window with halves the shop lists but the counts ran out, more halves of that set. Otherwise the
// nearest result says which way it misses: loose wants thicker shells, tight wants thinner
// (extra-clearance) ones; beyond what a clearance-adjusting set offers (makers sell them about
// 0.001–0.002 in, 0.025–0.05 mm, from standard: common practice) the journal is ground undersize for
// undersize shells (a tight one after the housing bore has been checked again).
import type { LengthUnit } from "../enums";
import { roundToResolution } from "../units";
import type { Candidate, JournalContext } from "./candidates";
import type { BearingAdvice, StockLine } from "./types";
import { D } from "./walls";

/** The largest change in diametral clearance a clearance-adjusting set is taken to give (common practice). */
export const ADJUSTING_SET_REACH: Readonly<Record<LengthUnit, number>> = { in: 0.002, mm: 0.05 };

function ranOut(best: Candidate, stock: readonly StockLine[]): string {
  const upper = stock[best.pair.upper.index];
  return upper.left.upper <= 0 ? best.pair.upper.set.id : best.pair.lower.set.id;
}

/** Advice for one journal, or undefined when its chosen halves put it inside the window. */
export function adviceFor(
  ctx: JournalContext,
  chosen: Candidate | undefined,
  stock: readonly StockLine[],
): BearingAdvice | undefined {
  if (chosen?.inWindow) return undefined;
  const base = { key: ctx.journal.key, unit: ctx.unit };
  const best = ctx.candidates[0];
  if (!best) return { ...base, kind: "no_shells" };
  if (best.inWindow) return { ...base, kind: "more_stock", setId: ranOut(best, stock) };
  const nearest = (chosen ?? best).prediction.clearance;
  const { min, max, target } = ctx.window;
  const loose = nearest.gt(max);
  const miss = loose ? nearest.minus(max) : nearest.minus(min);
  const needed = nearest.minus(target).abs();
  const reach = new D(ADJUSTING_SET_REACH[ctx.unit]);
  const kind = needed.gt(reach) ? "grind_undersize" : loose ? "order_thicker" : "order_thinner";
  return {
    ...base,
    kind,
    nearest: nearest.toNumber(),
    miss: miss.toNumber(),
    ...(kind === "grind_undersize" ? {} : { amount: roundToResolution(needed.toNumber(), ctx.unit) }),
  };
}
