import { describe, expect, it } from "vitest";
import {
  CHARACTERISTICS,
  MEASURE_UNITS,
  UNIT_SYSTEM_WORDS,
  UNIT_WORDS,
  VERDICT_WORDS,
  VERDICTS,
  characteristicWords,
  instrumentKindWords,
  stationWords,
  unitWords,
  verdictInText,
} from "../../../lib/domain";

// The words every screen, the record, the CSV and the mails share: the product's own wording. A
// product of units takes a middle dot (N·m), as the SI Brochure writes it (from memory); lbf·ft too.
describe("unit words", () => {
  it("write each unit as its symbol", () => {
    expect(UNIT_WORDS).toEqual({ in: "in", mm: "mm", lbf_ft: "lbf·ft", nm: "N·m" });
    for (const u of MEASURE_UNITS) expect(unitWords(u)).toBe(UNIT_WORDS[u]);
  });
  it("show a unit the core does not know as stored", () => {
    expect(unitWords("cc")).toBe("cc");
  });
  it("name a unit system by its length and torque units", () => {
    expect(UNIT_SYSTEM_WORDS).toEqual({ in: "Inch (in, lbf·ft)", mm: "Metric (mm, N·m)" });
  });
});

describe("verdict words", () => {
  it("are one word-set on its own and the same in a line of text", () => {
    expect(VERDICTS.map((v) => VERDICT_WORDS[v])).toEqual(["In spec", "Marginal", "Out of spec"]);
    expect(VERDICTS.map(verdictInText)).toEqual(["in spec", "marginal", "out of spec"]);
  });
});

describe("station and characteristic words", () => {
  it("describe a station from the grammar, and show an id the catalogue no longer knows as stored", () => {
    expect(stationWords("bore/3/top/A")).toBe("Cylinder 3 · top of bore · axis A (thrust)");
    expect(stationWords("crank/1")).toBe("crank/1");
  });
  it("name a characteristic by its catalogue label, an unknown one with spaces", () => {
    expect(characteristicWords("main_oil_clearance")).toBe(CHARACTERISTICS.main_oil_clearance.label);
    expect(characteristicWords("cam_lift")).toBe("cam lift");
  });
  it("name a registered gauge kind by its label, an unknown one with spaces", () => {
    expect(instrumentKindWords("outside_mic")).toBe("Outside micrometer");
    expect(instrumentKindWords("laser_scanner")).toBe("laser scanner");
  });
});
