// The setting master's checks against its gauge (masterProblems) and the schema's words. The figures
// are invented: a 2–6 in bore gauge reading to 0.0001 in, and rings of plausible size and U.
import { describe, expect, it } from "vitest";
import { MASTER_U_MAX_STEPS, masterProblems, settingMasterSchemaFor } from "@/lib/schemas/setting-master";

const BORE = { unit: "in" as const, resolution: 0.0001, rangeMin: 2, rangeMax: 6 };

describe("masterProblems", () => {
  it("accepts a ring inside the range, its ends included, with a U under ten steps", () => {
    expect(masterProblems({ size: 4.03, expandedU: 0.00005 }, BORE)).toEqual({});
    expect(masterProblems({ size: 2, expandedU: 0.0009 }, BORE)).toEqual({});
    expect(masterProblems({ size: 6, expandedU: 0.00005 }, BORE)).toEqual({});
  });

  it("refuses a size outside the range on the size field, in the gauge's unit", () => {
    expect(masterProblems({ size: 1.999, expandedU: 0.00005 }, BORE).size).toBe(
      "A master of 1.999 in is outside this gauge's range, 2–6 in; check the size and that it is in in",
    );
    expect(masterProblems({ size: 102.4, expandedU: 0.00005 }, BORE).size).toMatch(/outside/);
  });

  it("refuses a U of ten steps or more on the U field", () => {
    expect(MASTER_U_MAX_STEPS).toBe(10);
    expect(masterProblems({ size: 4, expandedU: 0.001 }, BORE).expandedU).toMatch(
      /^U 0.001 in is 10 or more of this gauge's steps \(0.0001 in\)/,
    );
  });

  it("checks only the size's plausibility when the gauge has no range on file", () => {
    expect(masterProblems({ size: 50, expandedU: 0.00005 }, { ...BORE, rangeMin: null, rangeMax: null })).toEqual({});
  });
});

describe("settingMasterSchemaFor", () => {
  const schema = settingMasterSchemaFor({ unit: "mm", resolution: 0.001, rangeMin: 50, rangeMax: 160 });
  const messages = (input: unknown) => {
    const r = schema.safeParse(input);
    return r.success ? {} : Object.fromEntries(r.error.issues.map((i) => [i.path.join("."), i.message]));
  };

  it("takes a gauge block with its name trimmed", () => {
    const r = schema.safeParse({ label: "  Block 100 mm ", size: 100, expandedU: 0.0003 });
    expect(r.success && r.data).toEqual({ label: "Block 100 mm", size: 100, expandedU: 0.0003 });
  });

  it("says what to fix on each field", () => {
    expect(messages({ label: "", size: Number.NaN, expandedU: -1 })).toEqual({
      label: "Name the master as it is marked, e.g. Ring 4.0300",
      size: "Enter the master's size as a number",
      expandedU: "The certificate's expanded uncertainty U must be above zero",
    });
    expect(messages({ label: "Block", size: 100.0000001, expandedU: 0.0003 }).size).toMatch(/decimal places|places/);
    expect(messages({ label: "Block", size: 200, expandedU: 0.0003 }).size).toMatch(/outside this gauge's range/);
  });
});
