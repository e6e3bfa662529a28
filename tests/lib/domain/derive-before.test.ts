// The sped-up derivation (lib/domain/derive*.ts) against the code it replaced (./derive-before/,
// kept verbatim): the same derived values, the same single-reading checks and the same errors, on
// random readings of random engines. Spec sheets are the demo's invented ones (demo data only).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { benchRoute } from "../../../lib/domain/bench-route";
import { deriveReadings, derivedInputs, evaluateReading } from "../../../lib/domain/derive";
import type { DerivedCharacteristic, EngineShape, RawReading, SpecLimit } from "../../../lib/domain/types";
import { STREET_V8_INCH, TRACTOR_DIESEL_MM } from "../../../scripts/seed/demo-specs";
import * as before from "./derive-before/derive";

const V8: EngineShape = {
  cylinders: 8,
  layout: "v",
  mains: 5,
  valvesPerCylinder: 2,
  unitSystem: "inch",
  materials: { block: "greyCastIron" },
  nominalSizes: { bore: 4.03 },
  finishedSizes: { mainJournal: 2.449 },
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
const FLAT: EngineShape = { cylinders: 4, layout: "flat", mains: 3, valvesPerCylinder: 2, unitSystem: "inch" };
const ENGINES: [EngineShape, SpecLimit[]][] = [
  [V8, STREET_V8_INCH as SpecLimit[]],
  [DIESEL, TRACTOR_DIESEL_MM as SpecLimit[]],
  [FLAT, STREET_V8_INCH as SpecLimit[]],
];

/** A deterministic pseudo-random sequence (a linear congruential generator), so a failure repeats. */
function lcg(seed: number) {
  let x = seed >>> 0;
  return () => (x = (Math.imul(x, 1664525) + 1013904223) >>> 0) / 2 ** 32;
}

/**
 * A job's readings: most stations of the route near their usual size, some left out, some taken
 * twice, some off (zero, negative, another unit, no lubricant, a part or a station not on the route).
 */
function jobReadings(engine: EngineShape, stations: string[], seed: number, drop: number): RawReading[] {
  const rnd = lcg(seed);
  const metric = engine.unitSystem === "metric";
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
  const out: RawReading[] = [];
  for (const stationId of [...stations, "bore/1", "bore/99/top/A"]) {
    for (let n = rnd() < drop ? 0 : rnd() < 0.1 ? 2 : 1; n > 0; n--) {
      const torque = stationId.startsWith("torque/");
      const size = torque ? (metric ? 130 : 65) : stationId.startsWith("bore/") ? (metric ? 104 : 4.03) : 2.45;
      const odd = Math.floor(rnd() * 60);
      const value = odd === 0 ? 0 : odd === 1 ? -1 : Number((size * (0.99 + rnd() * 0.02)).toFixed(4));
      const unit = torque ? (metric ? "nm" : "lbf_ft") : odd === 2 ? "mm" : metric ? "mm" : "in";
      const u = pick([undefined, 0, 0.0001, 0.00015, 0.0004, 0.002]);
      const temp = rnd() < 0.2 ? Math.round(10 + rnd() * 25) : undefined;
      const minute = rnd() < 0.7 ? Math.floor(rnd() * 30) : undefined;
      out.push({
        stationId,
        value,
        unit,
        ...(u !== undefined ? { uncertainty: u } : {}),
        ...(temp !== undefined ? { temperatureC: temp } : {}),
        ...(torque && odd !== 3 ? { lubricant: "engine-oil" } : {}),
        ...(minute !== undefined ? { takenAt: new Date(Date.UTC(2026, 11, 1, 8, minute)).toISOString() } : {}),
      } as RawReading);
    }
  }
  return out;
}
const readingsOf = (engine: EngineShape, stations: string[]) =>
  fc
    .record({ seed: fc.integer(), drop: fc.constantFrom(0, 0.05, 0.3, 0.9) })
    .map(({ seed, drop }) => jobReadings(engine, stations, seed, drop));

const only: DerivedCharacteristic[][] = [["bore_taper", "main_journal_out_of_round"], ["rod_oil_clearance"]];

describe("deriveReadings sped up: the same results as before", () => {
  for (const [engine, spec] of ENGINES) {
    const stations = benchRoute(engine).sections.flatMap((s) => s.stations.map((st) => st.id));
    it(`every value, and each option, on ${engine.cylinders}-cylinder ${engine.layout} engines`, () => {
      fc.assert(
        fc.property(readingsOf(engine, stations), fc.nat(3), (readings, pick) => {
          const now = deriveReadings(readings, engine, spec);
          expect(now).toEqual(before.deriveReadings(readings, engine, spec));
          // The same JSON, keys in the same order (what the tablet and the record receive).
          expect(JSON.stringify(now)).toBe(JSON.stringify(before.deriveReadings(readings, engine, spec)));
          const touching = (s: string) => s.length % 4 === pick;
          expect(deriveReadings(readings, engine, spec, { touching })).toEqual(
            before.deriveReadings(readings, engine, spec, { touching }),
          );
          const characteristics = only[pick % 2];
          expect(deriveReadings(readings, engine, spec, { characteristics })).toEqual(
            before.deriveReadings(readings, engine, spec, { characteristics }),
          );
        }),
        { numRuns: 15 },
      );
    }, 60_000); // a busy machine: each run derives a full job six times

    it(`each reading checked alone, errors included, on ${engine.cylinders}-cylinder ${engine.layout} engines`, () => {
      const outcome = (f: () => unknown) => {
        try {
          return f();
        } catch (err) {
          return `error: ${(err as Error).message}`;
        }
      };
      fc.assert(
        fc.property(readingsOf(engine, stations), (readings) => {
          for (const r of readings)
            expect(outcome(() => evaluateReading(r, engine, spec, readings))).toEqual(
              outcome(() => before.evaluateReading(r, engine, spec, readings)),
            );
        }),
        { numRuns: 10 },
      );
    }, 60_000);
  }

  it("lists each value's inputs as before, and a caller's edit of a value's inputs reaches no later pass", () => {
    for (const [engine, spec] of ENGINES) {
      expect(derivedInputs(engine)).toEqual(before.derivedInputs(engine));
      const first = deriveReadings([], engine, spec);
      first[0].inputs.push("bore/1/top/A");
      expect(deriveReadings([], engine, spec)).toEqual(before.deriveReadings([], engine, spec));
    }
  });

  it("refuses a bad engine or readings in the same words", () => {
    const bad = { ...V8, cylinders: 7 };
    expect(() => deriveReadings([], bad, [])).toThrow(
      (() => {
        try {
          before.deriveReadings([], bad, []);
        } catch (err) {
          return (err as Error).message;
        }
        return "no error";
      })(),
    );
    expect(() => deriveReadings("x" as never, V8, [])).toThrow("deriveReadings needs the job's readings as a list");
  });
});
