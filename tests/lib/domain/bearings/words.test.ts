import { describe, expect, it } from "vitest";
import { bearingAdviceWords, halfPlaceWords, lengthWords, shellSetWords, shellStepWords } from "@/lib/domain";

describe("bearing words", () => {
  it("names sizes and places", () => {
    expect(shellStepWords({ kind: "thinner", amount: 0.001 }, "in")).toBe("0.001 in thinner (extra clearance)");
    expect(shellStepWords({ kind: "undersize", amount: 0.25 }, "mm")).toBe("0.25 mm undersize");
    expect(shellStepWords({ kind: "graded", grade: "4" }, "mm")).toBe("grade 4");
    expect(shellSetWords({ series: "A", role: "thrust", step: { kind: "standard" }, unit: "in" })).toBe(
      "A, thrust main, standard",
    );
    expect(halfPlaceWords("rod", "upper")).toBe("rod side (upper)");
    expect(halfPlaceWords("main", "lower")).toBe("cap side (lower)");
    expect(lengthWords(0.00305, "in")).toBe("0.0031 in");
    expect(lengthWords(0.0559, "mm")).toBe("0.056 mm");
  });

  it("says what to do about a journal outside its window", () => {
    const base = { key: "rod 1", unit: "in" as const };
    expect(bearingAdviceWords({ ...base, kind: "order_thicker", nearest: 0.003, miss: 0.0005, amount: 0.0008 })).toBe(
      "rod 1: the nearest the shelf allows is 0.0030 in, 0.0005 in loose of the window. " +
        "Order a set about 0.0008 in thicker than the halves chosen",
    );
    expect(bearingAdviceWords({ ...base, kind: "grind_undersize", nearest: 0.0005, miss: -0.0013 })).toMatch(
      /0.0013 in tight of the window, beyond .* Check the housing bore and journal again; if they stand, grind/,
    );
    const sets = [
      { id: "p", series: "A", role: "rod" as const, step: { kind: "standard" as const }, unit: "in" as const },
    ];
    expect(bearingAdviceWords({ ...base, kind: "more_stock", setId: "p" }, sets)).toBe(
      "rod 1: the window is reachable, but the halves ran out; add halves of A, rod, standard",
    );
    expect(bearingAdviceWords({ ...base, kind: "no_shells" })).toMatch(/enter the sets for it/);
  });
});
