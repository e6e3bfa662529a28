import { describe, expect, it } from "vitest";
import { evaluate } from "mathjs";
import {
  compressionHeight,
  compressionRatio,
  deckClearanceFor,
  displacement,
  rodRatio,
  springRate,
  valveLift,
} from "../../../lib/domain/build-math";
import { cubicInToCc, decimalDifference, inToMm } from "../../../lib/domain/units";

describe("displacement", () => {
  it("a 4.25 in bore, 4.375 in stroke V8 is about 496.5 in³", () => {
    // common practice
    expect(displacement(4.25, 4.375, 8)).toBeCloseTo(496.5, 1);
  });
  it("is in the cube of the input unit", () => {
    // Heywood (1988) §2.2, Vd = π/4·B²·L; cross-checked with mathjs unit arithmetic
    const mm3 = displacement(inToMm(4), inToMm(3.48), 8);
    expect(mm3 / 1000).toBeCloseTo(evaluate("pi/4 * (4 in)^2 * 3.48 in * 8 to cc").toNumber("cc"), 6);
    expect(() => displacement(4, 3.48, 0)).toThrow(/Cylinder count/);
    expect(() => displacement(4, 3.48, 7.5)).toThrow(/whole number/);
  });
});

describe("compressionRatio", () => {
  const p19 = {
    bore: 4.03,
    stroke: 3.48,
    chamberCc: 64,
    pistonCc: 5,
    gasketBore: 4.1,
    gasketThickness: 0.039,
    deckClearance: 0.025,
  };
  it("gives the same result in millimetres as in inches", () => {
    const inch = compressionRatio({ lengthUnit: "in", ...p19 });
    const mm = compressionRatio({
      ...p19,
      lengthUnit: "mm",
      bore: inToMm(p19.bore),
      stroke: inToMm(p19.stroke),
      gasketBore: inToMm(p19.gasketBore),
      gasketThickness: inToMm(p19.gasketThickness),
      deckClearance: inToMm(p19.deckClearance),
    });
    expect(mm.ratio).toBeCloseTo(inch.ratio, 10);
    expect(mm.sweptCc).toBeCloseTo(inch.sweptCc, 9);
    expect(inch.sweptCc).toBeCloseTo(cubicInToCc(displacement(4.03, 3.48, 1)), 9);
  });
  it("a dome (negative cc) and a piston above the deck raise the ratio; mathjs cross-check", () => {
    // Heywood (1988) §2.2, rc = (Vd + Vc)/Vc; volumes computed independently with mathjs units
    const r = compressionRatio({
      lengthUnit: "mm",
      bore: 86,
      stroke: 86,
      gasketBore: 87,
      gasketThickness: 1.2,
      deckClearance: -0.2,
      chamberCc: 45,
      pistonCc: -3,
    });
    const vs = evaluate("pi/4 * (86 mm)^2 * 86 mm").toNumber("cc");
    const vg = evaluate("pi/4 * (87 mm)^2 * 1.2 mm").toNumber("cc");
    const vd = evaluate("pi/4 * (86 mm)^2 * -0.2 mm").toNumber("cc");
    const vc = 45 + vg + vd - 3;
    expect(r.deckCc).toBeCloseTo(vd, 10);
    expect(r.deckCc).toBeLessThan(0);
    expect(r.gasketCc).toBeCloseTo(vg, 10);
    expect(r.clearanceCc).toBeCloseTo(vc, 10);
    expect(r.ratio).toBeCloseTo((vs + vc) / vc, 10);
    const dished = compressionRatio({
      lengthUnit: "mm",
      bore: 86,
      stroke: 86,
      gasketBore: 87,
      gasketThickness: 1.2,
      deckClearance: -0.2,
      chamberCc: 45,
      pistonCc: 3,
    });
    expect(r.ratio).toBeGreaterThan(dished.ratio);
  });
  it("refuses a stack-up where the piston would hit the head, and a bad unit", () => {
    expect(() => compressionRatio({ lengthUnit: "in", ...p19, pistonCc: -90 })).toThrow(/piston would hit the head/);
    expect(() => compressionRatio({ ...p19, lengthUnit: "cm" as "mm" })).toThrow(/'in' or 'mm'/);
    expect(() => compressionRatio({ lengthUnit: "in", ...p19, gasketThickness: -0.01 })).toThrow(/Gasket thickness/);
  });
});

describe("rod ratio, compression height and deck clearance", () => {
  it("rod ratio is rod length over stroke", () => {
    expect(rodRatio(5.7, 3.48)).toBeCloseTo(1.6379, 4);
  });
  it("a stroke of 3.784 in lengthened to 4.375 in is 0.591 in longer; the piston needs half that less height", () => {
    // common practice
    expect(decimalDifference(4.375, 3.784)).toBe(0.591);
    const base = { deckHeight: 9.025, rodLength: 5.7, deckClearance: 0.025 };
    const short = compressionHeight({ ...base, stroke: 3.784 });
    const long = compressionHeight({ ...base, stroke: 4.375 });
    expect(short).toEqual({ compressionHeight: 1.408, fits: true });
    expect(long.compressionHeight).toBe(1.1125);
    expect(decimalDifference(short.compressionHeight, long.compressionHeight)).toBe(0.2955);
  });
  it("says why a stack does not fit", () => {
    const none = compressionHeight({ deckHeight: 9.0, stroke: 4.0, rodLength: 7.1, deckClearance: 0 });
    expect(none.fits).toBe(false);
    expect(none.compressionHeight).toBe(-0.1);
    expect(none.reason).toMatch(/shorter rod or stroke/);
    const thin = compressionHeight({
      deckHeight: 9.025,
      stroke: 4.0,
      rodLength: 6.125,
      deckClearance: 0.005,
      minCompressionHeight: 1.0,
    });
    expect(thin).toMatchObject({ compressionHeight: 0.895, fits: false });
    expect(thin.reason).toMatch(/below the 1 minimum/);
  });
  it("deckClearanceFor inverts compressionHeight", () => {
    const stack = { deckHeight: 9.025, stroke: 3.48, rodLength: 5.7 };
    expect(deckClearanceFor({ ...stack, compressionHeight: 1.56 })).toBe(0.025);
    const ch = compressionHeight({ ...stack, deckClearance: -0.005 }).compressionHeight;
    expect(deckClearanceFor({ ...stack, compressionHeight: ch })).toBe(-0.005);
  });
});

describe("valvetrain", () => {
  it("a 1.73:1 rocker turns 0.3353 in and 0.3462 in of lobe lift into 0.580 in and 0.599 in", () => {
    // common practice
    expect(valveLift(0.3353, 1.73).gross).toBeCloseTo(0.58, 3);
    expect(valveLift(0.3462, 1.73).gross).toBeCloseTo(0.599, 3);
  });
  it("solid-lifter lash of 0.018 in intake and 0.020 in exhaust subtracts from that lift", () => {
    // common practice
    const intake = valveLift(0.3353, 1.73, 0.018);
    const exhaust = valveLift(0.3462, 1.73, 0.02);
    expect(intake.net).toBe(decimalDifference(intake.gross, 0.018));
    expect(intake.net).toBeCloseTo(0.562, 3);
    expect(exhaust.net).toBeCloseTo(0.579, 3);
    expect(valveLift(0.32, 1.5).net).toBe(0.48);
    expect(() => valveLift(0.32, 1.5, -0.01)).toThrow(/Lash cannot be negative/);
  });
  it("a spring of 200 lbf on the seat and 480 lbf at 0.580 in lift has a rate of about 483 lbf/in", () => {
    // common practice
    expect(springRate(200, 480, 0.58)).toBeCloseTo(483, 0);
    expect(() => springRate(480, 200, 0.58)).toThrow(/swapped/);
    expect(() => springRate(200, 480, 0)).toThrow(/Lift/);
  });
});
