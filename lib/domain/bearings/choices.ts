// A choice made or changed by hand, judged by the same rules and predictions as the selection, and
// what moved between two answers (the lead's page shows it after a hand change).
import { prepare, type Candidate } from "./candidates";
import { buildSelection } from "./outcome";
import type { ChoiceProblem, HandChoice, Selection, SelectionInput } from "./types";
import type { JournalContext } from "./candidates";
import { pairRefusal, type LadderSet, type PairRefusal } from "./pairs";
import { shellSetWords } from "./words";

const REFUSAL_WORDS: Readonly<Record<PairRefusal, string>> = {
  role: "needs shells entered for its kind of journal (main, thrust main or rod)",
  series: "mixes two series; halves mix only within one maker's series",
  undersize: "mixes two undersizes; both halves must suit the journal's size",
  steps: "puts halves more than one step apart; pick neighbouring sizes",
  walls: "mixes halves whose walls differ by more than 0.0005 in (0.013 mm); pick neighbouring sizes",
  placement: "puts the thicker half on the wrong side; it goes on the rod side of a rod and in the cap of a main",
};

function refusal(ctx: JournalContext, hand: HandChoice, ladder: readonly LadderSet[]): string {
  const upper = ladder.find((l) => l.set.id === hand.upperSetId);
  const lower = ladder.find((l) => l.set.id === hand.lowerSetId);
  if (!upper || !lower) return "names a shell set that is not on this job's shelf; pick one of the sets listed";
  const why = pairRefusal(upper, lower, ctx.journal.role, ctx.unit);
  return why ? REFUSAL_WORDS[why] : "cannot take these halves";
}

/**
 * Judges a hand choice: each journal's halves as named (a journal left out gets none), with the same
 * prediction, verdict, stock and advice as `selectShells`, and the problems the rules find: a pair
 * that may not go together, or more halves of a set than on hand.
 */
export function evaluateChoices(
  input: SelectionInput,
  hand: readonly HandChoice[],
): Selection & { problems: ChoiceProblem[] } {
  const prepared = prepare(input);
  const problems: ChoiceProblem[] = [];
  const chosen: (Candidate | undefined)[] = prepared.contexts.map((ctx) => {
    const h = hand.find((c) => c.key === ctx.journal.key);
    if (!h) return undefined;
    const found = ctx.candidates.find(
      (c) => c.pair.upper.set.id === h.upperSetId && c.pair.lower.set.id === h.lowerSetId,
    );
    if (!found) {
      const why = refusal(ctx, h, prepared.ladders.get(ctx.unit) ?? []);
      problems.push({ key: ctx.journal.key, message: `${ctx.journal.key} ${why}` });
    }
    return found;
  });
  for (const h of hand) {
    if (!prepared.contexts.some((c) => c.journal.key === h.key)) {
      problems.push({ key: h.key, message: `${h.key} is not one of this job's journals; remove that choice` });
    }
  }
  const selection = buildSelection(prepared, chosen, input.sets, input.journalFigure);
  for (const line of selection.stock) {
    const set = input.sets.find((s) => s.id === line.setId)!;
    for (const position of ["upper", "lower"] as const) {
      if (line.left[position] < 0) {
        problems.push({
          setId: line.setId,
          message:
            `${line.used[position]} ${position} halves of ${shellSetWords(set)} are chosen but only ` +
            `${set.onHand[position]} are on hand; choose another set for some journals or add the halves to the shelf`,
        });
      }
    }
  }
  return { ...selection, problems };
}

/** A journal whose halves or predicted clearance differ between two answers. */
export interface MovedJournal {
  key: string;
  before?: { upperSetId?: string; lowerSetId?: string; clearance?: number };
  after?: { upperSetId?: string; lowerSetId?: string; clearance?: number };
}

/** The journals that moved from `before` to `after` (by key; a journal in only one of them moved too). */
export function movedJournals(before: Selection, after: Selection): MovedJournal[] {
  const view = (s: Selection, key: string) => {
    const r = s.results.find((x) => x.key === key);
    return r && { upperSetId: r.upper?.setId, lowerSetId: r.lower?.setId, clearance: r.clearance };
  };
  const keys = [...new Set([...before.results, ...after.results].map((r) => r.key))];
  return keys.flatMap((key) => {
    const b = view(before, key);
    const a = view(after, key);
    return JSON.stringify(a) === JSON.stringify(b) ? [] : [{ key, before: b, after: a }];
  });
}
