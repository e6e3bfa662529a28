// What the tablet accepts as a figure of a gauge study, and the words of each refusal.
import { describe, expect, it } from "vitest";
import { parseGaugeFigure, parseReference, parseReferenceReading } from "@/lib/offline/study-entry";
import type { DraftGauge } from "@/lib/offline/study-draft-shape";

const GAUGE: DraftGauge = {
  id: 3,
  kind: "bore_gauge_digital",
  dialPlusMeansSmaller: true,
  label: "Bore gauge",
  serial: "BG-1",
  unit: "in",
  resolution: 0.0001,
  rangeMin: 3,
  rangeMax: 6,
};
const REF = { value: 4.03, expandedU: 0.00005, coverageK: 2 };

describe("study entry", () => {
  it("takes a reading near the reference, with a comma as the decimal point", () => {
    expect(parseReferenceReading("4,0302", GAUGE, REF)).toEqual({ value: 4.0302 });
    expect(parseReferenceReading("4.0400", GAUGE, REF)).toEqual({ value: 4.04 }); // 100 steps: still taken
  });

  it("refuses a slipped decimal point, a figure outside the gauge's range and text", () => {
    expect(parseReferenceReading("4.0501", GAUGE, REF)).toEqual({ error: expect.stringContaining("201 steps") });
    expect(parseReferenceReading("40302", GAUGE, REF)).toEqual({ error: expect.stringContaining("(3–6 in)") });
    expect(parseGaugeFigure("4.0.3", GAUGE)).toEqual({ error: expect.stringContaining("is not a number") });
    expect(parseGaugeFigure("", GAUGE)).toEqual({ error: "Type the reading first" });
  });

  it("reads a dial bore gauge's dial as set on the reference (plus means smaller on this one)", () => {
    const dial = { ...GAUGE, kind: "bore_gauge_dial" };
    expect(parseReferenceReading("+0.0003", dial, REF)).toEqual({ value: 4.0297 });
    expect(parseReferenceReading("-0.0002", { ...dial, dialPlusMeansSmaller: false }, REF)).toEqual({ value: 4.0298 });
    expect(parseReferenceReading("0.5", dial, REF)).toEqual({ error: expect.stringContaining("5000 steps") });
  });

  it("reads the reference from its certificate and names each field to fix", () => {
    expect(parseReference({ value: "4.0300", expandedU: "0.00005", coverageK: "2" }, GAUGE)).toEqual({
      reference: REF,
    });
    const bad = parseReference({ value: "", expandedU: "0", coverageK: "9" }, GAUGE);
    expect(bad).toEqual({
      errors: {
        value: "Type the reference's size first",
        expandedU: expect.stringContaining("above 0"),
        coverageK: expect.stringContaining("between 1 and 4"),
      },
    });
  });
});
