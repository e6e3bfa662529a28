import { describe, expect, it } from "vitest";
import {
  engineSizeProblems,
  finishedSizeProblems,
  jobSizeToleranceProblems,
  limitEngineProblems,
  limitFigureProblems,
  type LimitFigures,
} from "../../../lib/domain/plausible-limit";
import type { EngineShape } from "../../../lib/domain/types";

// The ranges are common practice, from memory (deliberately wide, plausible-range.ts); the unit
// handling rests on 1 in = 25.4 mm exactly (NIST SP 811, B.8). Figures are typical shop limits.
const fields = (l: LimitFigures) => limitFigureProblems(l).map((p) => p.field);
const v8: Pick<EngineShape, "unitSystem" | "nominalSizes"> = { unitSystem: "inch", nominalSizes: { bore: 4.03 } };

describe("limitFigureProblems", () => {
  it("accepts ordinary limits in either unit", () => {
    const ok: LimitFigures[] = [
      {
        characteristic: "bore_diameter",
        unit: "in",
        limitType: "nominal_tol",
        nominal: 4.03,
        tolPlus: 0.0005,
        tolMinus: 0,
      },
      { characteristic: "bore_taper", unit: "in", limitType: "max_only", max: 0.001 },
      { characteristic: "main_oil_clearance", unit: "mm", limitType: "min_max", min: 0.03, max: 0.065 },
      { characteristic: "ring_end_gap", unit: "in", limitType: "per_inch", perInchMin: 0.004, perInchMax: 0.0055 },
      { characteristic: "fastener_torque", unit: "lbf_ft", limitType: "min_max", min: 65, max: 75 },
      { characteristic: "rod_side_clearance", unit: "in", limitType: "min_max", min: 0, max: 0.02 },
    ];
    for (const l of ok) expect(limitFigureProblems(l), l.characteristic).toEqual([]);
  });

  it("refuses a negative taper or out-of-round maximum, saying it cannot be negative", () => {
    const [p] = limitFigureProblems({ characteristic: "bore_taper", unit: "in", limitType: "max_only", max: -0.001 });
    expect(p).toEqual({
      field: "max",
      message: expect.stringMatching(/bore taper cannot be negative; enter 0 or more/),
    });
    expect(
      fields({ characteristic: "rod_journal_out_of_round", unit: "mm", limitType: "max_only", max: -0.01 }),
    ).toEqual(["max"]);
  });

  it("refuses a negative clearance minimum", () => {
    expect(
      fields({ characteristic: "piston_to_wall", unit: "in", limitType: "min_max", min: -0.001, max: 0.003 }),
    ).toEqual(["min"]);
  });

  it("refuses a taper maximum no service limit comes near (0.5 mm, about 0.0197 in)", () => {
    // 0.02 in = 0.508 mm, just past the range; 0.019 in = 0.4826 mm, inside it.
    expect(fields({ characteristic: "bore_taper", unit: "in", limitType: "max_only", max: 0.02 })).toEqual(["max"]);
    expect(fields({ characteristic: "bore_taper", unit: "in", limitType: "max_only", max: 0.019 })).toEqual([]);
  });

  it("refuses a bore limit typed in mm on an inch sheet, naming the range in both units", () => {
    const [p] = limitFigureProblems({
      characteristic: "bore_diameter",
      unit: "in",
      limitType: "min_max",
      min: 102.3,
      max: 102.4,
    });
    expect(p.message).toMatch(/102.3 in cannot be a cylinder bore diameter: a real one is 20–400 mm/);
    expect(p.message).toMatch(/Check the decimal point and the unit/);
  });

  it("refuses a tolerance that takes a limit out of the real range, on the tolerance", () => {
    const l: LimitFigures = {
      characteristic: "rod_side_clearance",
      unit: "in",
      limitType: "nominal_tol",
      nominal: 0.015,
    };
    expect(fields({ ...l, tolPlus: 0.005, tolMinus: 0.02 })).toEqual(["tolMinus"]);
    expect(fields({ ...l, tolPlus: 0.1, tolMinus: 0.005 })).toEqual(["tolPlus"]); // 0.115 in = 2.921 mm > 2 mm
  });

  it("refuses a per-inch figure far above any real one", () => {
    expect(fields({ characteristic: "ring_end_gap", unit: "in", limitType: "per_inch", perInchMax: 0.045 })).toEqual([
      "perInchMax",
    ]);
  });

  it("a torque limit is checked in N·m: 2300 lbf·ft is 3118 N·m, past the 3000 N·m range", () => {
    // NIST SP 811, B.8: 1 lbf·ft = 1.355818 N·m
    expect(fields({ characteristic: "fastener_torque", unit: "lbf_ft", limitType: "max_only", max: 2300 })).toEqual([
      "max",
    ]);
    expect(fields({ characteristic: "fastener_torque", unit: "lbf_ft", limitType: "max_only", max: 2200 })).toEqual([]);
  });
});

describe("limitEngineProblems", () => {
  it("refuses bore limits more than 10% from the engine's nominal bore", () => {
    const ok = { characteristic: "bore_diameter", unit: "in", limitType: "min_max", min: 4.06, max: 4.0605 } as const;
    expect(limitEngineProblems(ok, v8)).toEqual([]);
    const far = limitEngineProblems({ ...ok, min: 3.5, max: 3.5005 }, v8);
    expect(far.map((p) => p.field)).toEqual(["min", "max"]);
    expect(far[0].message).toMatch(/more than 10% away from this engine's 4.03 in bore/);
  });
  it("leaves other characteristics alone", () => {
    expect(
      limitEngineProblems(
        { characteristic: "main_journal_diameter", unit: "in", limitType: "max_only", max: 2.45 },
        v8,
      ),
    ).toEqual([]);
  });
});

describe("engineSizeProblems", () => {
  it("refuses a 40 in nominal bore and a stroke in the wrong unit", () => {
    const p = engineSizeProblems({ nominalBore: 40, nominalStroke: 88 }, "in");
    expect(p.map((x) => x.field)).toEqual(["nominalBore", "nominalStroke"]);
    expect(p[0].message).toMatch(/40 in cannot be a cylinder bore diameter/);
  });
  it("refuses a standard journal size typed in mm on an inch job", () => {
    const p = engineSizeProblems({ nominalBore: 4, nominalStroke: 3.48, nominalMainJournal: 62.2 }, "in");
    expect(p.map((x) => x.field)).toEqual(["nominalMainJournal"]);
  });
  it("accepts a small-block V8 in inches and a tractor diesel in mm", () => {
    expect(engineSizeProblems({ nominalBore: 4.03, nominalStroke: 3.48 }, "in")).toEqual([]);
    expect(engineSizeProblems({ nominalBore: 104, nominalStroke: 132 }, "mm")).toEqual([]);
  });
});

describe("a job's finished sizes and the tolerances around them", () => {
  it("accepts a 0.030 in overbore and a 0.010 in undersize grind", () => {
    const nominal = { bore: 4.0, mainJournal: 2.45, rodJournal: 2.1 };
    expect(finishedSizeProblems({ bore: 4.03, mainJournal: 2.44, rodJournal: 2.09 }, "in", nominal)).toEqual([]);
  });
  it("refuses a finished bore far from the engine's, and a journal typed in mm on an inch job", () => {
    const p = finishedSizeProblems({ bore: 4.6, rodJournal: 53.3 }, "in", { bore: 4.0, rodJournal: 2.1 });
    expect(p.map((x) => x.size)).toEqual(["bore", "rodJournal"]);
    expect(p[0].message).toMatch(/more than 10% away from the engine's 4 in bore/);
    expect(p[1].message).toMatch(/53.3 in cannot be a rod journal diameter/);
  });
  it("refuses a finished-size tolerance wider than 1 mm (0.0394 in)", () => {
    const l = { characteristic: "bore_diameter", unit: "in", limitType: "job_size_tol" } as const;
    expect(jobSizeToleranceProblems({ ...l, tolPlus: 0.0005, tolMinus: 0 })).toEqual([]);
    expect(jobSizeToleranceProblems({ ...l, tolPlus: 0.05, tolMinus: 0 }).map((p) => p.field)).toEqual(["tolPlus"]);
  });
});
