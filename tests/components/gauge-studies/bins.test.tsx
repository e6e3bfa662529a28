import { errorFunction } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { expectedCount, histogramBins, tightest } from "@/components/gauge-studies/bins";

// Invented readings on a 0.0001 in gauge's grid around a 1.0000 in reference (demo data).
const grid = (steps: number[]) => steps.map((k) => Number((1 + k * 0.0001).toFixed(4)));
const run = grid([0, 1, -1, 0, 2, 0, -1, 1, 0, 0, -2, 1, 0, 1, -1, 0, 3, 0, -1, 0, 1, 0, -1, 2, 0]);

describe("histogramBins", () => {
  it("counts every reading once, in a bin a whole number of gauge steps wide", () => {
    const bins = histogramBins(run, { resolution: 0.0001, reference: 1 });
    expect(bins.reduce((a, b) => a + b.count, 0)).toBe(run.length);
    for (const b of bins) {
      const steps = (b.to - b.from) / 0.0001;
      expect(Math.abs(steps - Math.round(steps))).toBeLessThan(1e-6);
    }
  });

  it("puts no reading on an edge: edges sit half a step off the grid", () => {
    const bins = histogramBins(run, { resolution: 0.0001, reference: 1 });
    for (const b of bins) for (const x of run) expect(Math.abs(x - b.from)).toBeGreaterThan(0.00004);
  });

  it("keeps one step per bin for a narrow run and counts each step exactly", () => {
    const bins = histogramBins(run, { resolution: 0.0001, reference: 1 });
    expect(bins.map((b) => b.count)).toEqual([1, 5, 11, 5, 2, 1]);
    expect(bins.find((b) => b.from < 1 && b.to > 1)?.count).toBe(11);
  });

  it("widens bins (1, 2 or 5 steps) for a wide run so there are at most 12", () => {
    const wide = Array.from({ length: 50 }, (_, i) => Number((1 + (i - 25) * 0.0001).toFixed(4)));
    const bins = histogramBins(wide, { resolution: 0.0001, reference: 1 });
    expect(bins.length).toBeLessThanOrEqual(12);
    expect(bins.reduce((a, b) => a + b.count, 0)).toBe(50);
    expect(bins.length).toBeGreaterThanOrEqual(5);
    expect(Math.round((bins[0].to - bins[0].from) / 0.0001)).toBe(10);
  });

  it("cuts the span evenly without a resolution, and holds one bin when every reading is equal", () => {
    expect(histogramBins([2, 2, 2], { resolution: null, reference: 2 })).toHaveLength(1);
    const even = histogramBins([0, 1, 2, 3, 4, 5, 6, 7, 8, 9], { resolution: null, reference: 5 });
    expect(even.reduce((a, b) => a + b.count, 0)).toBe(10);
  });

  it("gives nothing for no readings", () => {
    expect(histogramBins([], { resolution: 0.001, reference: 1 })).toEqual([]);
  });
});

describe("expectedCount", () => {
  it("matches n × (Φ(b) − Φ(a)) from a reference library", () => {
    // simple-statistics' error function as the outside reference: Φ(x) = (1 + erf((x − μ)/(σ√2)))/2.
    const phi = (x: number, mu: number, sd: number) => (1 + errorFunction((x - mu) / (sd * Math.SQRT2))) / 2;
    const bin = { from: 0.99985, to: 1.00005, centre: 0.99995, count: 0 };
    const want = 25 * (phi(1.00005, 1.00002, 0.0001) - phi(0.99985, 1.00002, 0.0001));
    expect(expectedCount(bin, 25, 1.00002, 0.0001)).toBeCloseTo(want, 5);
  });

  it("is zero when s is zero (no curve to draw)", () => {
    expect(expectedCount({ from: 0, to: 1, centre: 0.5, count: 3 }, 3, 0.5, 0)).toBe(0);
  });
});

describe("tightest", () => {
  it("picks the smallest positive tolerance and skips none or nonsense", () => {
    const list = [
      { characteristic: "main_bore", tolerance: 0.001 },
      { characteristic: "cyl_bore", tolerance: 0.0005 },
      { characteristic: "x", tolerance: 0 },
    ];
    expect(tightest(list)?.characteristic).toBe("cyl_bore");
    expect(tightest([])).toBeUndefined();
  });
});
