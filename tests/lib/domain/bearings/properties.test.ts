// Properties of the selection (fast-check) over small inch shelves: a standard rod shell of 0.0745 in
// and clearance-adjusting sets from the same series (common practice sizes), journals a few tenths
// either side of a standard fit. The oracle is a brute force over every legal pairing per journal,
// judged one journal at a time by `evaluateChoices`, with the counts on hand tallied here.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { evaluateChoices, selectShells, type HandChoice, type SelectionInput, type ShellSet } from "@/lib/domain";
import { journal, shellSet, window } from "./shelf";

const VARIANTS = [
  { id: "plus1", step: { kind: "thicker", amount: 0.001 } },
  { id: "minus1", step: { kind: "thinner", amount: 0.001 } },
  { id: "plus2", step: { kind: "thicker", amount: 0.002 } },
] as const;

const shelfArb = fc
  .tuple(
    fc.integer({ min: 0, max: 3 }),
    fc.subarray([...VARIANTS]),
    fc.array(fc.integer({ min: 0, max: 3 }), { minLength: 3, maxLength: 3 }),
  )
  .map(([stdCount, variants, counts]): ShellSet[] => [
    shellSet("std", { kind: "standard" }, stdCount, { thickness: 0.0745 }),
    ...variants.map((v, i) => shellSet(v.id, { ...v.step }, counts[i])),
  ]);

const journalsArb = fc
  .array(fc.integer({ min: -12, max: 12 }), { minLength: 1, maxLength: 3 })
  .map((offsets) => offsets.map((o, i) => journal(`rod ${i + 1}`, Number((2.0988 + o / 10000).toFixed(4)), 2.25)));

const inputArb = fc
  .tuple(shelfArb, journalsArb, fc.integer({ min: 19, max: 25 }))
  .map(([sets, journals, target]): SelectionInput => ({
    sets,
    journals,
    windows: { rod: window(0.0018, 0.0026, target / 10000) },
  }));

interface Option {
  choice: HandChoice;
  clearance: number;
  inWindow: boolean;
}

/** Every legal pairing of each journal alone, with its prediction (stock ignored). */
function optionsPerJournal(input: SelectionInput): Option[][] {
  return input.journals.map((j) =>
    input.sets.flatMap((u) =>
      input.sets.flatMap((l) => {
        const choice = { key: j.key, upperSetId: u.id, lowerSetId: l.id };
        const roomy = input.sets.map((s) => ({ ...s, onHand: { upper: 9, lower: 9 } }));
        const e = evaluateChoices({ ...input, journals: [j], sets: roomy }, [choice]);
        const r = e.results[0];
        return e.problems.length === 0 ? [{ choice, clearance: r.clearance!, inWindow: r.inWindow }] : [];
      }),
    ),
  );
}

/** Brute force: the least total distance from the target over assignments all in window and within stock. */
function bestAllInWindow(input: SelectionInput, target: number): number | undefined {
  const options = optionsPerJournal(input).map((o) => o.filter((x) => x.inWindow));
  let best: number | undefined;
  const walk = (i: number, used: Map<string, number>, total: number) => {
    if (i === options.length) {
      best = best === undefined ? total : Math.min(best, total);
      return;
    }
    for (const o of options[i]) {
      const up = `${o.choice.upperSetId}/u`;
      const low = `${o.choice.lowerSetId}/l`;
      const set = (id: string) => input.sets.find((s) => s.id === id)!;
      if ((used.get(up) ?? 0) >= set(o.choice.upperSetId).onHand.upper) continue;
      used.set(up, (used.get(up) ?? 0) + 1);
      if ((used.get(low) ?? 0) < set(o.choice.lowerSetId).onHand.lower) {
        used.set(low, (used.get(low) ?? 0) + 1);
        walk(i + 1, used, total + Math.abs(o.clearance - target));
        used.set(low, used.get(low)! - 1);
      }
      used.set(up, used.get(up)! - 1);
    }
  };
  walk(0, new Map(), 0);
  return best;
}

describe("selection properties", () => {
  it("never leaves the window when a reachable choice exists, and is then as near the target as any", () => {
    fc.assert(
      fc.property(inputArb, (input) => {
        const target = input.windows.rod!.target;
        const brute = bestAllInWindow(input, target);
        const s = selectShells(input);
        if (brute === undefined) return;
        expect(s.allInWindow).toBe(true);
        const total = s.results.reduce((sum, r) => sum + Math.abs(r.clearance! - target), 0);
        expect(total).toBeLessThanOrEqual(brute + 1e-12);
      }),
      { numRuns: 150 },
    );
  });

  it("never uses more halves than on hand, and its choice passes the hand-choice rules", () => {
    fc.assert(
      fc.property(inputArb, (input) => {
        const s = selectShells(input);
        for (const line of s.stock) {
          expect(line.left.upper).toBeGreaterThanOrEqual(0);
          expect(line.left.lower).toBeGreaterThanOrEqual(0);
        }
        const hand = s.results.flatMap((r) =>
          r.upper && r.lower ? [{ key: r.key, upperSetId: r.upper.setId, lowerSetId: r.lower.setId }] : [],
        );
        expect(evaluateChoices(input, hand).problems).toEqual([]);
      }),
      { numRuns: 150 },
    );
  });

  it("swapping two identical journals swaps their choices", () => {
    fc.assert(
      fc.property(inputArb, fc.integer({ min: -12, max: 12 }), (input, offset) => {
        const twin = (key: string) => journal(key, Number((2.0988 + offset / 10000).toFixed(4)), 2.25);
        const journals = [twin("rod A"), ...input.journals, twin("rod B")];
        const swapped = [twin("rod B"), ...input.journals, twin("rod A")];
        const a = selectShells({ ...input, journals }).results;
        const b = selectShells({ ...input, journals: swapped }).results;
        const byKey = (rs: typeof a, key: string) => {
          const { key: _key, ...rest } = rs.find((r) => r.key === key)!;
          return rest;
        };
        expect(byKey(b, "rod B")).toEqual(byKey(a, "rod A"));
        expect(byKey(b, "rod A")).toEqual(byKey(a, "rod B"));
      }),
      { numRuns: 100 },
    );
  });

  it("a thicker shell never loosens a journal", () => {
    fc.assert(
      fc.property(
        journalsArb,
        fc.integer({ min: 0, max: 50 }),
        fc.integer({ min: 1, max: 20 }),
        fc.boolean(),
        (journals, wall, extra, inUpper) => {
          const thickness = Number((0.072 + wall / 10000).toFixed(4));
          const thicker = Number((thickness + extra / 100000).toFixed(5));
          const sets = [
            shellSet("base", { kind: "standard" }, 9, { thickness }),
            shellSet("thick", { kind: "standard" }, 9, { thickness: thicker, series: "B" }),
          ];
          const windows = { rod: window(0.0018, 0.0026, 0.0022) };
          const hand = (id: string) => journals.map((j) => ({ key: j.key, upperSetId: id, lowerSetId: id }));
          const before = evaluateChoices({ journals, sets, windows }, hand("base")).results;
          const moved = evaluateChoices({ journals, sets, windows }, hand("thick")).results;
          moved.forEach((r, i) => expect(r.clearance!).toBeLessThan(before[i].clearance!));
          // One half alone (where the select-fit rules allow the pair): the clearance falls by exactly
          // the wall added.
          const one = sets.map((s) => ({ ...s, series: "A" }));
          const mixedHand = journals.map((j) => ({
            key: j.key,
            upperSetId: inUpper ? "thick" : "base",
            lowerSetId: inUpper ? "base" : "thick",
          }));
          const mixed = evaluateChoices({ journals, sets: one, windows }, mixedHand);
          mixed.results.forEach((r, i) => {
            if (r.clearance === undefined) return;
            expect(r.clearance).toBeCloseTo(before[i].clearance! - extra / 100000, 12);
          });
        },
      ),
      { numRuns: 150 },
    );
  });
});
