import { describe, expect, it } from "vitest";
import { findLimit, resolveLimit, limitContextFor, type EngineShape, type SpecLimit } from "@/lib/domain";
import { templateSchema, compactLimit } from "@/lib/schemas/spec";
import { STARTER_SHEETS } from "@/lib/server/shops/starter-sheets";
import { STARTER_DIESEL_FOUR } from "@/lib/server/shops/starter-diesel";
import { STARTER_V8_STREET } from "@/lib/server/shops/starter-v8";

const asSpec = (limits: typeof STARTER_V8_STREET.limits) => limits.map((l) => compactLimit(l) as unknown as SpecLimit);

describe("starter spec sheets", () => {
  it.each(STARTER_SHEETS.map((s) => [s.name, s] as const))("%s passes the spec editor's own checks", (_, sheet) => {
    const r = templateSchema.safeParse(sheet);
    expect(r.success ? [] : r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`)).toEqual([]);
  });

  it("marks every starter limit as common practice and cautions about torque", () => {
    for (const sheet of STARTER_SHEETS) {
      expect(sheet.limits.every((l) => l.commonPractice === true)).toBe(true);
      expect(sheet.notes).toMatch(/maker's specification/);
      expect(sheet.notes).toMatch(/Fastener torque: use the bolt or engine maker's figure/);
      expect(sheet.limits.some((l) => l.characteristic === "fastener_torque")).toBe(true);
    }
  });

  it("covers one carbureted V8, one diesel four and one inline six, in both unit systems", () => {
    expect(STARTER_SHEETS.map((s) => [s.engineKind, s.unitSystem])).toEqual([
      ["V8 gasoline, carbureted", "in"],
      ["Inline four diesel", "mm"],
      ["Inline six gasoline", "in"],
    ]);
  });

  it("judges the diesel's bore and journals by ISO 286 classes around the job's finished sizes", () => {
    const spec = asSpec(STARTER_DIESEL_FOUR.limits);
    const shape = {
      unitSystem: "metric",
      finishedSizes: { bore: 104, mainJournal: 85, rodJournal: 70 },
    } as unknown as EngineShape;
    const bore = findLimit(spec, "bore_diameter", "bore/1/top/A")!;
    const main = findLimit(spec, "main_journal_diameter", "main/1/front/A")!;
    const rod = findLimit(spec, "rod_journal_diameter", "rod/1/front/A")!;
    // ISO 286-2, table for H7 over 80 up to 120 mm: 0 / +35 µm.
    expect(resolveLimit(bore, limitContextFor("bore_diameter", shape))).toMatchObject({ min: 104, max: 104.035 });
    // ISO 286-2, table for h6 over 80 up to 120 mm: −22 µm / 0.
    expect(resolveLimit(main, limitContextFor("main_journal_diameter", shape))).toMatchObject({
      min: 84.978,
      max: 85,
    });
    // ISO 286-2, table for h6 over 50 up to 80 mm: −19 µm / 0.
    expect(resolveLimit(rod, limitContextFor("rod_journal_diameter", shape))).toMatchObject({ min: 69.981, max: 70 });
  });

  it("scales the V8's ring gaps and oil clearances with the job's sizes (per inch of diameter)", () => {
    const spec = asSpec(STARTER_V8_STREET.limits);
    const shape = {
      unitSystem: "imperial",
      finishedSizes: { bore: 4.03, mainJournal: 2.45, rodJournal: 2.1 },
    } as unknown as EngineShape;
    const top = findLimit(spec, "ring_end_gap", "ring-gap/1/top")!;
    const r = resolveLimit(top, limitContextFor("ring_end_gap", shape));
    // 0.004 and 0.005 in per inch of a 4.030 in bore (common practice): 0.01612 and 0.02015 in.
    expect(r.min).toBeCloseTo(0.01612, 8);
    expect(r.max).toBeCloseTo(0.02015, 8);
    const main = resolveLimit(
      findLimit(spec, "main_oil_clearance", "main-brg/1")!,
      limitContextFor("main_oil_clearance", shape),
    );
    // 0.00075 and 0.001 in per inch of a 2.450 in journal (common practice): 0.0018375 and 0.00245 in.
    expect(main.min).toBeCloseTo(0.0018375, 9);
    expect(main.max).toBeCloseTo(0.00245, 9);
  });
});
