// The selection: for each role (mains, thrust main, rods; they share no shells) the halves for every
// journal that give the least cost (candidates.ts) over all journals together, within the halves on
// hand. An exact search by dynamic programming over "journals done, halves used of each set": the
// best choice for the remaining journals depends only on that state, so each state is solved once.
// With n journals and k sets of a role the states are at most n · C(n+k−1, k−1)² (which multiset
// of uppers and of lowers is used), each trying at most k² pairs: for 9 journals and 5 sets, under
// 10⁷ steps in the worst case, and far fewer in practice (most states never arise).
import { buildSelection } from "./outcome";
import { addCost, compareCost, NO_SHELLS_COST, ZERO_COST, prepare, type Cost, type JournalContext } from "./candidates";
import type { BearingRole, Selection, SelectionInput, ShellSet } from "./types";

interface Solved {
  cost: Cost;
  /** The candidate index chosen for this journal; -1 for none (no halves left). */
  pick: number;
}

function solveRole(contexts: JournalContext[], sets: readonly ShellSet[]): number[] {
  const usedUpper = sets.map(() => 0);
  const usedLower = sets.map(() => 0);
  const memo = new Map<string, Solved>();
  const solve = (i: number): Cost => {
    if (i === contexts.length) return ZERO_COST;
    const key = `${i}|${usedUpper.join(",")}|${usedLower.join(",")}`;
    const known = memo.get(key);
    if (known) return known.cost;
    let best: Solved = { cost: addCost(NO_SHELLS_COST, solve(i + 1)), pick: -1 };
    contexts[i].candidates.forEach((c, at) => {
      const u = c.pair.upper.index;
      const l = c.pair.lower.index;
      if (usedUpper[u] >= sets[u].onHand.upper || usedLower[l] >= sets[l].onHand.lower) return;
      // A candidate alone already no better than the best whole answer cannot win (costs only add).
      if (compareCost(c.cost, best.cost) >= 0) return;
      usedUpper[u]++;
      usedLower[l]++;
      const total = addCost(c.cost, solve(i + 1));
      usedUpper[u]--;
      usedLower[l]--;
      if (compareCost(total, best.cost) < 0) best = { cost: total, pick: at };
    });
    memo.set(key, best);
    return best.cost;
  };
  solve(0);
  // Walk the chosen path again to read each journal's pick.
  const picks: number[] = [];
  for (let i = 0; i < contexts.length; i++) {
    const { pick } = memo.get(`${i}|${usedUpper.join(",")}|${usedLower.join(",")}`)!;
    picks.push(pick);
    if (pick >= 0) {
      usedUpper[contexts[i].candidates[pick].pair.upper.index]++;
      usedLower[contexts[i].candidates[pick].pair.lower.index]++;
    }
  }
  return picks;
}

function requireCounts(sets: readonly ShellSet[]): void {
  for (const s of sets) {
    for (const n of [s.onHand?.upper, s.onHand?.lower]) {
      if (!Number.isInteger(n) || (n as number) < 0) {
        throw new Error(`Set ${s.id} (${s.series}): halves on hand must be whole numbers of zero or more`);
      }
    }
  }
}

/**
 * Picks the upper and lower halves for every journal: every journal inside its window when the
 * stock allows it, then as near the target as it allows, then as few journals mixed as possible,
 * never more halves than on hand. Journals the stock cannot bring into the window get advice.
 * Throws, with words saying what to fix, on input it cannot judge (a missing window, a set without
 * walls, duplicate names).
 */
export function selectShells(input: SelectionInput): Selection {
  requireCounts(input?.sets ?? []);
  const prepared = prepare(input);
  const picks = new Array<number>(prepared.contexts.length).fill(-1);
  const roles = new Set<BearingRole>(prepared.contexts.map((c) => c.journal.role));
  for (const role of roles) {
    const at = prepared.contexts.map((c, i) => (c.journal.role === role ? i : -1)).filter((i) => i >= 0);
    const rolePicks = solveRole(
      at.map((i) => prepared.contexts[i]),
      input.sets,
    );
    at.forEach((i, n) => (picks[i] = rolePicks[n]));
  }
  const chosen = prepared.contexts.map((c, i) => (picks[i] >= 0 ? c.candidates[picks[i]] : undefined));
  return buildSelection(prepared, chosen, input.sets, input.journalFigure);
}
