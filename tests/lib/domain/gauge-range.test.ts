import { describe, expect, it } from "vitest";
import {
  gaugeRangeProblem,
  gaugeRangeWords,
  gaugeRefusal,
  gaugesHolding,
  rangeHolds,
  type RangedGauge,
} from "../../../lib/domain";

// Gauges and ranges below are invented test gauges (a 20–150 lbf·ft click wrench and a 4–5 in
// outside micrometer are common sizes, common practice). Conversions: 1 in = 25.4 mm exactly and
// 1 lbf·ft = 1.355818 N·m (NIST SP 811, B.8).
const wrench: RangedGauge = {
  kind: "torque_wrench",
  label: "Click wrench",
  serial: "TW-1",
  unit: "lbf_ft",
  rangeMin: 20,
  rangeMax: 150,
};
const bigWrench: RangedGauge = { ...wrench, label: "Big wrench", serial: "TW-2", rangeMin: 100, rangeMax: 600 };
const mic45: RangedGauge = {
  kind: "outside_mic",
  label: "Mic 4–5",
  serial: "M45",
  unit: "in",
  rangeMin: 4,
  rangeMax: 5,
};
const mic23: RangedGauge = { ...mic45, label: "Mic 2–3", serial: "M23", rangeMin: 2, rangeMax: 3 };
const dialBore: RangedGauge = { kind: "bore_gauge_dial", label: "Dial bore", serial: "DB", unit: "in" };
const torque = (value: number, unit = "lbf_ft") => ({ stationId: "torque/main-caps", value, unit });
const skirt = (value: number, unit = "in") => ({ stationId: "skirt/1", value, unit });

describe("a gauge's range", () => {
  it("holds values on both ends and refuses one past either end", () => {
    expect(rangeHolds(wrench, 20, "lbf_ft")).toBe(true);
    expect(rangeHolds(wrench, 150, "lbf_ft")).toBe(true);
    expect(rangeHolds(wrench, 150.5, "lbf_ft")).toBe(false);
    expect(rangeHolds(wrench, 19.9, "lbf_ft")).toBe(false);
    expect(gaugeRangeWords(wrench)).toBe("20–150 lbf·ft");
  });
  it("compares in the gauge's unit: 101.6 mm is exactly 4 in (NIST SP 811, B.8)", () => {
    expect(rangeHolds(mic45, 101.6, "mm")).toBe(true);
    expect(rangeHolds(mic45, 101.59, "mm")).toBe(false);
    // 203 N·m = 149.7 lbf·ft, 204 N·m = 150.5 lbf·ft (1 lbf·ft = 1.355818 N·m, NIST SP 811, B.8).
    expect(rangeHolds(wrench, 203, "nm")).toBe(true);
    expect(rangeHolds(wrench, 204, "nm")).toBe(false);
  });
  it("holds anything when no range is on file (a gauge registered before ranges were kept)", () => {
    expect(rangeHolds(dialBore, 4.03, "in")).toBe(true);
    expect(gaugeRangeWords(dialBore)).toBe("");
  });
});

describe("whether a reading may name a gauge", () => {
  const shop = [wrench, bigWrench, mic23, mic45, dialBore];
  it("lets a suitable gauge whose range holds the value through", () => {
    expect(gaugeRefusal(torque(72), wrench, shop)).toBeUndefined();
    expect(gaugeRefusal(skirt(4.0285), mic45, shop)).toBeUndefined();
  });
  it("refuses 210 lbf·ft on a 20–150 lbf·ft wrench and names the wrench that holds it", () => {
    expect(gaugeRefusal(torque(210), wrench, shop)).toBe(
      "'Click wrench' (TW-1) reads 20–150 lbf·ft; 210 lbf·ft is outside its range. " +
        "Pick a torque wrench whose range holds 210 lbf·ft: 'Big wrench' (TW-2) 100–600 lbf·ft",
    );
  });
  it("refuses a gauge of a kind that cannot measure the station", () => {
    expect(gaugeRefusal({ stationId: "bore/1/top/A", value: 4.03, unit: "in" }, mic45, shop)).toBe(
      "'Mic 4–5' (M45) is an outside micrometer; it cannot measure a cylinder bore diameter. " +
        "Pick a dial bore gauge or bore gauge whose range holds 4.03 in: 'Dial bore' (DB)",
    );
    expect(gaugeRefusal(torque(72), mic45, shop)).toMatch(/^'Mic 4–5' \(M45\) is an outside micrometer; it cannot/);
  });
  it("refuses a reading with no gauge and says which to pick, in the words a person writes units in", () => {
    const words = gaugeRefusal(torque(210), undefined, shop)!;
    expect(words).toMatch(/^No gauge is named for this reading\. Pick a torque wrench whose range holds 210 lbf·ft/);
    expect(words).not.toContain("lbf_ft");
    expect(gaugeRefusal(skirt(101.6, "mm"), undefined, shop)).toBe(
      "No gauge is named for this reading. Pick a micrometer whose range holds 101.6 mm: 'Mic 4–5' (M45) 4–5 in",
    );
  });
  it("says so when no gauge on file holds the value, and never offers a switched-off one", () => {
    const words = gaugeRefusal(torque(700), bigWrench, [wrench, { ...bigWrench, rangeMax: 800, active: false }]);
    expect(words).toMatch(/holds 700 lbf·ft: none on file holds it, so ask the admin to register one under Gauges$/);
    expect(gaugesHolding(torque(120), shop).map((g) => g.serial)).toEqual(["TW-1", "TW-2"]);
  });
});

describe("a gauge's range as the admin enters it", () => {
  it("accepts real ranges: a 20–150 lbf·ft wrench, a 0–1 in micrometer, a 1 in dial indicator", () => {
    expect(gaugeRangeProblem("torque_wrench", "lbf_ft", 20, 150)).toBeUndefined();
    expect(gaugeRangeProblem("outside_mic", "in", 0, 1)).toBeUndefined();
    expect(gaugeRangeProblem("dial_indicator", "in", 0, 1)).toBeUndefined();
    expect(gaugeRangeProblem("feeler", "mm", 0.05, 1)).toBeUndefined();
  });
  it("refuses a start below zero and a top not above the start", () => {
    expect(gaugeRangeProblem("outside_mic", "in", -1, 1)?.field).toBe("rangeMin");
    expect(gaugeRangeProblem("outside_mic", "in", 5, 4)).toEqual({
      field: "rangeMax",
      message: "The top of the range must be above its start (5 in)",
    });
    expect(gaugeRangeProblem("outside_mic", "in", 4, 4)?.field).toBe("rangeMax");
  });
  it("refuses a top larger than any engine station (the core's plausible ranges, common practice)", () => {
    // 3000 N·m is the core's largest plausible torque; 2500 lbf·ft is 3390 N·m.
    expect(gaugeRangeProblem("torque_wrench", "lbf_ft", 20, 2500)?.message).toMatch(
      /^2500 lbf·ft is more than any engine station measures \(3000 N·m \(2213 lbf·ft\) at most\)/,
    );
    expect(gaugeRangeProblem("deck_gauge", "in", 4, 60)?.field).toBe("rangeMax");
  });
  it("refuses a range that holds no real value of what its kind measures (a slipped decimal point)", () => {
    // Feelers measure gaps of 0–3 mm; 1.5–35 in is a feeler set typed without its decimal point.
    const p = gaugeRangeProblem("feeler", "in", 1.5, 35);
    expect(p?.field).toBe("rangeMin");
    expect(p?.message).toMatch(/^A feeler gauge measures ring end gap, .*holds none of them/);
  });
});
