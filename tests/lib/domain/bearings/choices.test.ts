// Hand choices judged by the select-fit rules bearing makers publish for mixing halves (common
// practice, as quoted in trade articles on engine bearings): halves of one series, walls no more
// than 0.0005 in apart, the thicker half on the rod side of a rod and in the cap of a main.
import { describe, expect, it } from "vitest";
import { evaluateChoices, movedJournals, selectShells, type SelectionInput } from "@/lib/domain";
import { journal, shellSet, window } from "./shelf";

const sets = [
  shellSet("std", { kind: "standard" }, 2, { thickness: 0.0745 }),
  shellSet("plus", { kind: "thicker", amount: 0.001 }, 1),
  shellSet("plus2", { kind: "thicker", amount: 0.002 }, 2),
  shellSet("other", { kind: "standard" }, 2, { thickness: 0.0745, series: "B" }),
  shellSet("main", { kind: "standard" }, 2, { thickness: 0.0985, role: "main" }),
];
const input: SelectionInput = {
  journals: [journal("rod 1", 2.0982, 2.25), journal("rod 2", 2.0988, 2.25)],
  sets,
  windows: { rod: window(0.002, 0.0025, 0.00225) },
};
const pick = (key: string, upperSetId: string, lowerSetId: string) => ({ key, upperSetId, lowerSetId });

describe("evaluateChoices", () => {
  it("predicts a legal hand choice like the selection does", () => {
    const e = evaluateChoices(input, [pick("rod 1", "plus", "std"), pick("rod 2", "std", "std")]);
    expect(e.problems).toEqual([]);
    expect(e.results.map((r) => r.clearance)).toEqual([0.0023, 0.0022]);
    expect(e.results).toEqual(selectShells(input).results);
  });

  it("refuses, in words, each rule a hand choice breaks", () => {
    const e = evaluateChoices(input, [pick("rod 1", "std", "plus"), pick("rod 2", "std", "other")]);
    expect(e.problems.map((p) => p.message)).toEqual([
      "rod 1 puts the thicker half on the wrong side; it goes on the rod side of a rod and in the cap of a main",
      "rod 2 mixes two series; halves mix only within one maker's series",
    ]);
    const far = evaluateChoices(input, [pick("rod 1", "plus2", "std")]).problems[0].message;
    expect(far).toBe("rod 1 puts halves more than one step apart; pick neighbouring sizes");
    const role = evaluateChoices(input, [pick("rod 1", "main", "main")]).problems[0].message;
    expect(role).toMatch(/needs shells entered for its kind of journal/);
    const gone = evaluateChoices(input, [pick("rod 1", "nope", "std"), pick("rod 9", "std", "std")]).problems;
    expect(gone.map((p) => p.message)).toEqual([
      "rod 1 names a shell set that is not on this job's shelf; pick one of the sets listed",
      "rod 9 is not one of this job's journals; remove that choice",
    ]);
  });

  it("refuses walls more than 0.0005 in apart even on neighbouring rungs", () => {
    const gap = [sets[0], sets[2]]; // standard and 0.002 in thicker: one rung apart, 0.001 in of wall
    const e = evaluateChoices({ ...input, sets: gap }, [pick("rod 1", "plus2", "std")]);
    expect(e.problems[0].message).toMatch(/walls differ by more than 0.0005 in/);
  });

  it("counts halves past those on hand", () => {
    const e = evaluateChoices(input, [pick("rod 1", "plus", "std"), pick("rod 2", "plus", "std")]);
    expect(e.problems).toEqual([
      {
        setId: "plus",
        message:
          "2 upper halves of A, rod, 0.001 in thicker are chosen but only 1 are on hand; " +
          "choose another set for some journals or add the halves to the shelf",
      },
    ]);
  });

  it("says which journals moved after a hand change", () => {
    const before = selectShells(input);
    const after = evaluateChoices(input, [pick("rod 1", "std", "std"), pick("rod 2", "std", "std")]);
    expect(movedJournals(before, after)).toEqual([
      {
        key: "rod 1",
        before: { upperSetId: "plus", lowerSetId: "std", clearance: 0.0023 },
        after: { upperSetId: "std", lowerSetId: "std", clearance: 0.0028 },
      },
    ]);
  });
});
