// Runs every case of the shared reference check values (copied to fixtures/check-values.json)
// whose kind belongs to units, geometry, clearances, fasteners, build math, thermal, uncertainty
// and ISO 286. Each test is named with the case's id, kind and published source; results are
// computed from the case's own inputs and compared within the case's own tolerance.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import {
  boltElongation,
  boltStretch,
  boreGeometry,
  ccToCubicIn,
  compressionRatio,
  correctTo20C,
  cToF,
  cubicInToCc,
  displacement,
  endPlay,
  fToC,
  inToMm,
  iso286Fit,
  iso286Limits,
  itGrade,
  journalGeometry,
  kpaToPsi,
  lbfFtToNm,
  mmToIn,
  nmToLbfFt,
  oilClearance,
  oilClearanceRule,
  pistonToWall,
  preloadFromTorque,
  psiToKpa,
  readingUncertainty,
  recommendedPreload,
  ringGapRule,
  tensileStressAreaMetric,
  tensileStressAreaUnified,
  torqueForPreload,
  valveLift,
} from "../../../lib/domain";

interface Quantity {
  value: number | number[];
  unit: string;
}
type Inputs = Record<string, unknown>;
interface CheckCase {
  id: string;
  kind: string;
  inputs: Inputs;
  expected: Record<string, unknown>;
  rel_tol?: number;
  abs_tol?: number;
  source: string;
  note: string;
  arithmetic: string;
}
type Actual = Record<string, number | number[]>;

const cases = JSON.parse(readFileSync(new URL("./fixtures/check-values.json", import.meta.url), "utf8")) as CheckCase[];

/** Kinds the verdict/limits half of lib/domain checks in its own tests. */
const OTHER_HALF_KINDS = new Set(["conformity.guard_band"]);

const q = (inputs: Inputs, key: string): number => {
  const v = inputs[key];
  const n = typeof v === "number" ? v : (v as Quantity).value;
  if (typeof n !== "number") throw new Error(`input ${key} is not a number`);
  return n;
};
const list = (inputs: Inputs, key: string): number[] => (inputs[key] as Quantity).value as number[];
const unitOf = (u: string) => u.split(" ")[0];

const CONVERSIONS: Record<string, (x: number) => number> = {
  "in->mm": inToMm,
  "mm->in": mmToIn,
  "in^3->cm^3": cubicInToCc,
  "cm^3->in^3": ccToCubicIn,
  "lbf*ft->N*m": lbfFtToNm,
  "N*m->lbf*ft": nmToLbfFt,
  "psi->kPa": psiToKpa,
  "kPa->psi": kpaToPsi,
  "degF->degC": fToC,
  "degC->degF": cToF,
};
function conversions(c: CheckCase): Actual {
  const out: Actual = {};
  for (const [key, exp] of Object.entries(c.expected)) {
    const from = c.inputs[key] as Quantity;
    const fn = CONVERSIONS[`${unitOf(from.unit)}->${unitOf((exp as Quantity).unit)}`];
    if (!fn) throw new Error(`no conversion ${from.unit} -> ${(exp as Quantity).unit}`);
    out[key] = fn(from.value as number);
  }
  return out;
}

function geometryOut(g: ReturnType<typeof boreGeometry>): Actual {
  return {
    taper_A: g.taperA,
    taper_B: g.taperB,
    taper: g.taper,
    oor_by_depth: g.outOfRoundByDepth,
    oor: g.outOfRound,
    max_diameter: g.max,
    min_diameter: g.min,
    mean_diameter: g.mean,
  };
}

function parseUnified(name: string): [number, number] {
  const m = /^(\d+)\/(\d+)-(\d+)$/.exec(name);
  if (!m) throw new Error(`cannot read thread ${name}`);
  return [Number(m[1]) / Number(m[2]), Number(m[3])];
}
function parseMetric(name: string): [number, number] {
  const m = /^M(\d+(?:\.\d+)?)x(\d+(?:\.\d+)?)$/.exec(name);
  if (!m) throw new Error(`cannot read thread ${name}`);
  return [Number(m[1]), Number(m[2])];
}
const LBF_IN_PER_LBF_FT = 12; // 1 ft = 12 in (exact)

function thermalPartAndGauge(i: Inputs): Actual {
  const common = {
    length: q(i, "reading"),
    partTempC: q(i, "t_part"),
    gaugeTempC: q(i, "t_gauge"),
    alphaGauge: q(i, "alpha_gauge"),
  };
  const l20 = correctTo20C({ ...common, alphaPart: q(i, "alpha_part") });
  const b = correctTo20C({ ...common, length: q(i, "b_reading"), alphaPart: q(i, "b_alpha_part") });
  return { L20: l20, correction: l20 - q(i, "reading"), b_L20: b };
}

function gum(i: Inputs): Actual {
  const coeffs = i.sensitivity_coeffs as number[];
  if (coeffs.some((c) => c !== 1)) throw new Error("readingUncertainty assumes sensitivity coefficients of 1");
  const r = readingUncertainty({
    calibrationU: q(i, "calibration_U_k2"),
    k: 2,
    resolution: q(i, "resolution"),
    repeatSd: q(i, "repeatability_s"),
    repeatN: q(i, "n_readings"),
  });
  return { u_cal: r.uCal, u_res: r.uRes, u_rep: r.uRep, u_c: r.uc, U_k2: r.U };
}

function iso286(i: Inputs): Actual {
  const n = q(i, "nominal");
  const hole = iso286Limits(n, i.hole as string);
  const shaft = iso286Limits(n, i.shaft as string);
  const fit = iso286Fit(n, i.hole as string, i.shaft as string);
  return {
    hole_limits: [hole.min, hole.max],
    shaft_limits: [shaft.min, shaft.max],
    min_clearance: fit.minClearance,
    max_clearance: fit.maxClearance,
    IT5_IT9_30_50: [5, 6, 7, 8, 9].map((g) => itGrade(q(i, "it_lookup_nominal"), g)),
  };
}

const HANDLERS: Record<string, (c: CheckCase) => Actual> = {
  "unit_conversion.length": conversions,
  "unit_conversion.volume": conversions,
  "unit_conversion.torque": conversions,
  "unit_conversion.pressure": conversions,
  "unit_conversion.temperature": conversions,
  "cylinder_bore.geometry": ({ inputs: i }) =>
    geometryOut(boreGeometry({ axisA: list(i, "axis_A_thrust"), axisB: list(i, "axis_B_pin") })),
  "crank_journal.geometry": ({ inputs: i }) =>
    geometryOut(journalGeometry({ axisA: list(i, "axis_A"), axisB: list(i, "axis_B_90deg") })),
  "clearance.bearing_oil": ({ inputs: i }) => ({
    oil_clearance: oilClearance(q(i, "bearing_id_installed"), q(i, "journal_od")),
    rule_of_thumb_clearance: oilClearanceRule(q(i, "journal_od"), q(i, "rule_in_per_in")),
  }),
  "clearance.piston_to_wall": ({ inputs: i }) => ({ clearance: pistonToWall(q(i, "bore"), q(i, "piston_skirt")) }),
  "clearance.crank_end_play": ({ inputs: i }) => ({ end_play: endPlay(list(i, "dial_readings")) }),
  "rod_bolt.stretch_measured": ({ inputs: i }) => ({
    stretch: boltStretch(q(i, "free_length"), q(i, "loaded_length")),
  }),
  "rod_bolt.elongation_predicted": ({ inputs: i }) => ({
    delta: boltElongation(q(i, "F"), q(i, "L"), q(i, "A"), q(i, "E")),
  }),
  "rod_bolt.preload_from_torque": ({ inputs: i }) => ({
    F: preloadFromTorque(q(i, "T") * LBF_IN_PER_LBF_FT, q(i, "K"), q(i, "d")),
  }),
  "rod_bolt.recommended_preload_torque": ({ inputs: i }) => {
    const p = recommendedPreload({ stressArea: q(i, "At"), proofStrength: q(i, "Sp"), fraction: q(i, "fraction") });
    const t = torqueForPreload(p.preload, q(i, "K"), q(i, "d"));
    return { Fp: p.proofLoad, Fi: p.preload, T: t, T_ft: t / LBF_IN_PER_LBF_FT };
  },
  "thread.tensile_stress_area_UN": ({ expected }) =>
    Object.fromEntries(Object.keys(expected).map((k) => [k, tensileStressAreaUnified(...parseUnified(k))])),
  "thread.tensile_stress_area_ISO": ({ expected }) =>
    Object.fromEntries(Object.keys(expected).map((k) => [k, tensileStressAreaMetric(...parseMetric(k))])),
  "rod_bolt.metric_elongation_and_torque": ({ inputs: i }) => ({
    delta: boltElongation(q(i, "F"), q(i, "L"), q(i, "As"), q(i, "E")),
    T: torqueForPreload(q(i, "F"), q(i, "K"), q(i, "d")) / 1000, // N·mm → N·m
  }),
  "engine.displacement": ({ inputs: i }) => {
    const v = displacement(q(i, "bore"), q(i, "stroke"), q(i, "cylinders"));
    return { displacement: v, displacement_cc: cubicInToCc(v) };
  },
  "engine.compression_ratio": ({ inputs: i }) => {
    const r = compressionRatio({
      lengthUnit: "in",
      bore: q(i, "bore"),
      stroke: q(i, "stroke"),
      chamberCc: q(i, "chamber"),
      pistonCc: q(i, "piston_dish_positive"),
      gasketBore: q(i, "gasket_bore"),
      gasketThickness: q(i, "gasket_thickness_compressed"),
      deckClearance: q(i, "deck_clearance_below_deck_positive"),
    });
    return {
      swept_per_cyl: r.sweptCc,
      gasket_volume: r.gasketCc,
      deck_volume: r.deckCc,
      clearance_volume: r.clearanceCc,
      compression_ratio: r.ratio,
    };
  },
  "valvetrain.valve_lift": ({ inputs: i }) => {
    const v = valveLift(q(i, "lobe_lift"), q(i, "rocker_ratio"), q(i, "lash"));
    return { gross_valve_lift: v.gross, net_valve_lift: v.net };
  },
  "thermal.correction_to_20C_part_and_gauge": ({ inputs }) => thermalPartAndGauge(inputs),
  "thermal.correction_to_20C_part_only": ({ inputs: i }) => ({
    L20: correctTo20C({ length: q(i, "reading"), partTempC: q(i, "t_part"), alphaPart: q(i, "alpha_part") }),
  }),
  "uncertainty.combined_GUM": ({ inputs }) => gum(inputs),
  "iso286.limits_and_fit": ({ inputs }) => iso286(inputs),
  "rule_of_thumb.ring_gap": ({ inputs: i }) => ({
    top_ring_gap_min: ringGapRule(q(i, "bore"), q(i, "factor_in_per_in_of_bore")),
  }),
};

function expectWithin(actual: number, expected: number, c: CheckCase, label: string): void {
  const allowed = c.abs_tol ?? (c.rel_tol ?? 0) * Math.abs(expected);
  const diff = Math.abs(actual - expected);
  expect(diff, `${c.id} ${label}: got ${actual}, expected ${expected} ± ${allowed}`).toBeLessThanOrEqual(allowed);
}

describe("shared check values", () => {
  it("every case is either run here or belongs to the verdict half", () => {
    const unhandled = cases.filter((c) => !HANDLERS[c.kind] && !OTHER_HALF_KINDS.has(c.kind)).map((c) => c.id);
    expect(unhandled).toEqual([]);
    expect(cases.filter((c) => HANDLERS[c.kind]).length).toBe(25);
  });

  for (const c of cases.filter((x) => HANDLERS[x.kind])) {
    it(`${c.id} ${c.kind} (${c.note}) — source: ${c.source}`, () => {
      expect(c.abs_tol ?? c.rel_tol, `${c.id} has a tolerance`).toBeGreaterThan(0);
      const actual = HANDLERS[c.kind](c);
      for (const [key, exp] of Object.entries(c.expected)) {
        const want = (exp as Quantity).value;
        const got = actual[key];
        expect(got, `${c.id} computes ${key}`).toBeDefined();
        if (Array.isArray(want)) {
          expect(Array.isArray(got) && got.length === want.length, `${c.id} ${key} length`).toBe(true);
          want.forEach((w, n) => expectWithin((got as number[])[n], w, c, `${key}[${n}]`));
        } else {
          expectWithin(got as number, want, c, key);
        }
      }
    });
  }
});
