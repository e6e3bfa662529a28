// Every reading of a job checked at once (evaluateReadings) against the single check it batches
// (evaluateReading, called station by station with the job's readings): the same evaluations and the
// same error words, on random jobs of three engine shapes. Spec sheets are the demo's invented ones
// plus invented ring-gap rules per inch of bore (demo data only); the figures are random.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { benchRoute } from "../../../lib/domain/bench-route";
import { evaluateReading } from "../../../lib/domain/derive";
import { evaluateReadings } from "../../../lib/domain/evaluate-many";
import type { EngineShape, RawReading, SpecLimit } from "../../../lib/domain/types";
import { STREET_V8_INCH, TRACTOR_DIESEL_MM } from "../../../scripts/seed/demo-specs";

const V8: EngineShape = {
  cylinders: 8,
  layout: "v",
  mains: 5,
  valvesPerCylinder: 2,
  unitSystem: "inch",
  materials: { block: "greyCastIron" },
  nominalSizes: { bore: 4.03 },
  finishedSizes: { bore: 4.03, mainJournal: 2.449, rodJournal: 2.099 },
};
const DIESEL: EngineShape = {
  cylinders: 4,
  layout: "inline",
  mains: 5,
  valvesPerCylinder: 2,
  unitSystem: "metric",
  boltsPerRod: 2,
  materials: { block: "greyCastIron", pistons: "aluminium356" },
  nominalSizes: { bore: 104 },
};
// No sizes at all: a ring gap's rule per inch takes its bore from the readings, or has nothing.
const FLAT: EngineShape = { cylinders: 4, layout: "flat", mains: 3, valvesPerCylinder: 2, unitSystem: "inch" };

const perInch = (unit: string, pattern: string, v: Partial<SpecLimit>) =>
  ({ characteristic: "ring_end_gap", stationPattern: pattern, limitType: "per_inch", unit, ...v }) as SpecLimit;
const inchSpec = [
  ...(STREET_V8_INCH as SpecLimit[]).filter((l) => l.stationPattern !== "ring-gap/*/top"),
  perInch("in", "ring-gap/*/top", { perInchMin: 0.0045, perInchMax: 0.0055 }),
  perInch("in", "ring-gap/2/second", {}), // a rule left half entered: a note, no verdict
];
const ENGINES: [EngineShape, SpecLimit[]][] = [
  [V8, inchSpec],
  [DIESEL, [...(TRACTOR_DIESEL_MM as SpecLimit[]), perInch("mm", "ring-gap/*/top", { perInchMin: 0.004 })]],
  [FLAT, inchSpec],
];

/** A deterministic pseudo-random sequence (a linear congruential generator), so a failure repeats. */
function lcg(seed: number) {
  let x = seed >>> 0;
  return () => (x = (Math.imul(x, 1664525) + 1013904223) >>> 0) / 2 ** 32;
}

function sizeAt(stationId: string, metric: boolean): number {
  const mm = metric ? 25.4 : 1;
  if (stationId.startsWith("torque/")) return metric ? 130 : 65;
  if (stationId.startsWith("bore/")) return metric ? 104 : 4.03;
  if (stationId.startsWith("ring-gap/")) return 0.02 * mm;
  if (stationId.startsWith("deck/")) return 9.025 * mm;
  return 2.45 * mm;
}

// Off the route, a part, a bad axis, a cylinder the flat four lacks: each refused in words.
const ODD_STATIONS = ["bore/1", "bore/99/top/A", "bore/1/top/C", "ring-gap/6/top", "bore/6/top/A"];
// Figures on a limit's edge, within 1e-12 of it, and float noise, beside the usual random ones.
const EDGES = [4.0299, 4.0304, 4.0304 + 1e-12, 4.0312 - 4.0302, 0.0181, 0.022, 104.035, -0, 1e-9, 1e9];

/**
 * A job's readings: most stations near their usual size, some left out, some taken twice (later
 * or earlier), some refused (zero, negative, NaN, another unit, no lubricant, a station not on the
 * route), some at a part temperature, and entries that are not readings at all.
 */
function jobReadings(engine: EngineShape, stations: string[], seed: number, drop: number): RawReading[] {
  const rnd = lcg(seed);
  const metric = engine.unitSystem === "metric";
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
  const out: RawReading[] = [];
  for (const stationId of [...stations, ...ODD_STATIONS]) {
    for (let n = rnd() < drop ? 0 : rnd() < 0.15 ? 2 : 1; n > 0; n--) {
      const torque = stationId.startsWith("torque/");
      const odd = Math.floor(rnd() * 50);
      const size = sizeAt(stationId, metric);
      const near = Number((size * (0.99 + rnd() * 0.02)).toFixed(4));
      const value = [0, -1, Number.NaN, Infinity, pick(EDGES)][odd] ?? near;
      const unit = torque ? (metric ? "nm" : "lbf_ft") : odd === 5 ? "mm" : odd === 6 ? "in" : metric ? "mm" : "in";
      const u = pick([undefined, 0, 0.0001, 0.00015, 0.0004, 0.002]);
      const temp = rnd() < 0.2 ? Math.round(10 + rnd() * 25) : undefined;
      const minute = rnd() < 0.7 ? Math.floor(rnd() * 30) : undefined;
      out.push({
        stationId,
        value,
        unit,
        ...(u !== undefined ? { uncertainty: u } : {}),
        ...(temp !== undefined ? { temperatureC: temp } : {}),
        ...(temp !== undefined && rnd() < 0.3 ? { gaugeTemperatureC: 20 } : {}),
        ...(torque && odd !== 7 ? { lubricant: "engine-oil" } : {}),
        ...(minute !== undefined ? { takenAt: new Date(Date.UTC(2026, 11, 1, 8, minute)).toISOString() } : {}),
      } as RawReading);
      if (rnd() < 0.01) out.push(null as unknown as RawReading);
    }
  }
  // Shuffled: a ring gap may come before or after its bore's readings.
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(rnd() * (i + 1));
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}

const outcome = (f: () => unknown) => {
  try {
    return f();
  } catch (err) {
    return (err as Error).message;
  }
};

/** What evaluateReading gives each station, the last reading of a station read twice winning. */
function oneByOne(
  readings: RawReading[],
  engine: EngineShape,
  spec: SpecLimit[],
  only = (_: string) => true,
  context = readings,
) {
  const out = new Map<string, unknown>();
  for (const r of readings)
    if (r && only(r.stationId))
      out.set(
        r.stationId,
        outcome(() => evaluateReading(r, engine, spec, context)),
      );
  return out;
}

describe("evaluateReadings: each station as evaluateReading checks it", () => {
  for (const [engine, spec] of ENGINES) {
    const stations = benchRoute(engine).sections.flatMap((s) => s.stations.map((st) => st.id));
    it(`random jobs of a ${engine.cylinders}-cylinder ${engine.layout} engine, errors included`, () => {
      fc.assert(
        fc.property(fc.integer(), fc.constantFrom(0, 0.05, 0.3, 0.9), fc.nat(3), (seed, drop, pick) => {
          const readings = jobReadings(engine, stations, seed, drop);
          const batch = evaluateReadings(readings, engine, spec);
          expect(batch).toEqual(oneByOne(readings, engine, spec));
          expect([...batch.keys()]).toEqual([...oneByOne(readings, engine, spec).keys()]);
          const only = (s: string) => s.length % 4 === pick || s.startsWith("ring-gap/");
          expect(evaluateReadings(readings, engine, spec, { only })).toEqual(oneByOne(readings, engine, spec, only));
          // Other readings give the bores (the tablet checks refused readings too): here, every other one.
          const context = readings.filter((_, i) => i % 2 === pick % 2);
          expect(evaluateReadings(readings, engine, spec, { context })).toEqual(
            oneByOne(readings, engine, spec, undefined, context),
          );
        }),
        { numRuns: 12 },
      );
    }, 60_000); // a busy machine: each run checks a whole job three times
  }

  it("refuses every station of an engine shape the core refuses, in evaluateReading's words", () => {
    const bad = { ...V8, cylinders: 7 };
    const readings: RawReading[] = [
      { stationId: "bore/1/top/A", value: 4.03, unit: "in" },
      { stationId: "ring-gap/1/top", value: 0, unit: "in" },
    ];
    const batch = evaluateReadings(readings, bad, inchSpec);
    expect(batch).toEqual(oneByOne(readings, bad, inchSpec));
    expect([...batch.values()]).toEqual(Array(2).fill("A V engine has an even number of cylinders; got 7"));
  });

  it("gives a ring gap its own bore's mean: 4.03 in × 0.0045 in per inch = 0.018135 in (worked by hand)", () => {
    const bore = ["top", "mid", "bottom"].flatMap((d) =>
      ["A", "B"].map((a): RawReading => ({ stationId: `bore/3/${d}/${a}`, value: 4.03, unit: "in" })),
    );
    const gap: RawReading = { stationId: "ring-gap/3/top", value: 0.0181, unit: "in" };
    const other: RawReading = { stationId: "ring-gap/4/top", value: 0.0181, unit: "in" };
    const got = evaluateReadings([gap, ...bore, other], FLAT, inchSpec);
    expect(got.get("ring-gap/3/top")).toMatchObject({ verdict: "out_of_spec", limits: { min: 0.018135 } });
    expect(got.get("ring-gap/4/top")).toMatchObject({ note: expect.stringMatching(/needs that diameter/) });
  });
});
