import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { boreGeometry, journalGeometry } from "../../../lib/domain/geometry";

describe("boreGeometry", () => {
  it("reports per-axis taper, the worst taper and out-of-round by depth", () => {
    // definitional, as engine service manuals use two-point readings (same data as check value P06)
    const g = boreGeometry({ axisA: [4.0312, 4.0305, 4.0302], axisB: [4.0304, 4.0302, 4.0301] });
    expect(g.taperA).toBe(0.001);
    expect(g.taperB).toBe(0.0003);
    expect(g.taper).toBe(0.001);
    expect(g.outOfRoundByDepth).toEqual([0.0008, 0.0003, 0.0001]);
    expect(g.outOfRound).toBe(0.0008);
    expect(g.max).toBe(4.0312);
    expect(g.min).toBe(4.0301);
    expect(g.mean).toBeCloseTo(24.1826 / 6, 12);
  });
  it("returns exact decimal differences in millimetres too", () => {
    const g = boreGeometry({ axisA: [102.362, 102.345, 102.337], axisB: [102.342, 102.337, 102.335] });
    expect(g.taperA).toBe(0.025);
    expect(g.taperB).toBe(0.007);
    expect(g.outOfRoundByDepth).toEqual([0.02, 0.008, 0.002]);
  });
  it("works with one depth and with dial readings relative to a master (negative numbers)", () => {
    expect(boreGeometry({ axisA: [4.03], axisB: [4.0305] }).taper).toBe(0);
    const g = boreGeometry({ axisA: [-0.0002, 0.0003], axisB: [0.0001, -0.0001] });
    expect(g.taperA).toBe(0.0005);
    expect(g.outOfRoundByDepth).toEqual([0.0003, 0.0004]);
  });
  it("explains what to fix for bad input", () => {
    expect(() => boreGeometry({ axisA: [4.03, 4.03], axisB: [4.03] })).toThrow(
      /same number of readings on both axes; axis A has 2, axis B has 1/,
    );
    expect(() => boreGeometry({ axisA: [], axisB: [] })).toThrow(/at least one reading/);
    expect(() => boreGeometry({ axisA: [4.03, Number.NaN], axisB: [4.03, 4.03] })).toThrow(
      /Bore reading 2 on axis A is not a number/,
    );
    expect(() => boreGeometry({ axisA: [4.03], axisB: ["4.03" as unknown as number] })).toThrow(/axis B/);
    expect(() => boreGeometry(null as unknown as { axisA: number[]; axisB: number[] })).toThrow(/axisA/);
  });
});

describe("journalGeometry", () => {
  it("has the bore's shape and definitions", () => {
    // same definitions as check value P07 (crank journal, front and rear)
    const g = journalGeometry({ axisA: [2.099, 2.0987], axisB: [2.0988, 2.0986] });
    expect(g.taper).toBe(0.0003);
    expect(g.outOfRound).toBe(0.0002);
    expect(g.min).toBe(2.0986);
    expect(g.max).toBe(2.099);
    expect(() => journalGeometry({ axisA: [2.1], axisB: [] })).toThrow(/Journal geometry/);
  });
});

describe("invariants (property)", () => {
  const reading = fc.integer({ min: 20000, max: 60000 }).map((n) => n / 10000); // 2.0000–6.0000 in
  const axes = fc
    .integer({ min: 1, max: 6 })
    .chain((n) =>
      fc.tuple(fc.array(reading, { minLength: n, maxLength: n }), fc.array(reading, { minLength: n, maxLength: n })),
    );

  it("taper and out-of-round are never negative", () => {
    fc.assert(
      fc.property(axes, ([axisA, axisB]) => {
        const g = boreGeometry({ axisA, axisB });
        for (const v of [g.taperA, g.taperB, g.taper, g.outOfRound, ...g.outOfRoundByDepth]) {
          expect(v).toBeGreaterThanOrEqual(0);
        }
        expect(g.taper).toBe(Math.max(g.taperA, g.taperB));
        expect(g.min).toBeLessThanOrEqual(g.mean);
        expect(g.mean).toBeLessThanOrEqual(g.max);
      }),
    );
  });
  it("swapping the axes leaves out-of-round unchanged and swaps the tapers", () => {
    fc.assert(
      fc.property(axes, ([axisA, axisB]) => {
        const g = boreGeometry({ axisA, axisB });
        const s = boreGeometry({ axisA: axisB, axisB: axisA });
        expect(s.outOfRoundByDepth).toEqual(g.outOfRoundByDepth);
        expect(s.outOfRound).toBe(g.outOfRound);
        expect([s.taperA, s.taperB]).toEqual([g.taperB, g.taperA]);
      }),
    );
  });
  it("differences are the exact decimal figures (whole ten-thousandths stay whole)", () => {
    fc.assert(
      fc.property(axes, ([axisA, axisB]) => {
        const g = boreGeometry({ axisA, axisB });
        for (const v of [g.taperA, g.taperB, ...g.outOfRoundByDepth]) {
          expect(Number((v * 10000).toFixed(0)) / 10000).toBe(v);
        }
      }),
    );
  });
});
