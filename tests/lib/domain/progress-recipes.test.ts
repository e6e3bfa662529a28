// Required stations from the engine's recipes alone (lib/domain/progress.ts) against the way it was
// found before: a derivation pass without readings, its values' characteristic, station and inputs
// read back. The same stations, the same reasons, on random required flags of the demo's invented
// spec sheets (demo data only) and on engines the core cannot lay out.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { benchRoute } from "../../../lib/domain/bench-route";
import { deriveReadings } from "../../../lib/domain/derive";
import { findLimit } from "../../../lib/domain/limits";
import { requiredStations, type RequiredStation } from "../../../lib/domain/progress";
import type {
  CharacteristicId,
  DerivedCharacteristic,
  EngineShape,
  SpecLimit,
  Station,
} from "../../../lib/domain/types";
import { STREET_V8_INCH, TRACTOR_DIESEL_MM } from "../../../scripts/seed/demo-specs";

// The replaced code, kept verbatim but for its name.
function derivedRecipes(shape: EngineShape, spec: SpecLimit[]) {
  try {
    return deriveReadings([], shape, spec);
  } catch {
    return [];
  }
}

function requiredStationsBefore(shape: EngineShape, spec: SpecLimit[], stations: readonly Station[]) {
  const byId = new Map(stations.map((s) => [s.id, s]));
  const need = new Map<string, RequiredStation>();
  const add = (id: string, why?: DerivedCharacteristic) => {
    const station = byId.get(id);
    if (!station) return;
    const entry = need.get(id) ?? { station, own: false, neededFor: new Set<DerivedCharacteristic>() };
    if (why) entry.neededFor.add(why);
    else entry.own = true;
    need.set(id, entry);
  };
  for (const s of stations) if (findLimit(spec, s.characteristic, s.id)?.required) add(s.id);
  for (const d of derivedRecipes(shape, spec)) {
    if (findLimit(spec, d.characteristic as CharacteristicId, d.stationId)?.required)
      for (const id of d.inputs) add(id, d.characteristic);
  }
  return stations.filter((s) => need.has(s.id)).map((s) => need.get(s.id)!);
}

const V8: EngineShape = { cylinders: 8, layout: "v", mains: 5, valvesPerCylinder: 2, unitSystem: "inch" };
const DIESEL: EngineShape = {
  cylinders: 4,
  layout: "inline",
  mains: 5,
  valvesPerCylinder: 2,
  unitSystem: "metric",
  boltsPerRod: 2,
};
const CASES: [EngineShape, SpecLimit[]][] = [
  [V8, STREET_V8_INCH as SpecLimit[]],
  [DIESEL, TRACTOR_DIESEL_MM as SpecLimit[]],
];
const stationsOf = (e: EngineShape) => benchRoute(e).sections.flatMap((s) => s.stations);

describe("required stations from the recipes", () => {
  it("match a derivation pass without readings, whatever limits are required", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 1 }),
        fc.array(fc.boolean(), { minLength: 60, maxLength: 60 }),
        (c, flags) => {
          const [engine, sheet] = CASES[c];
          const spec = sheet.map((l, i) => ({ ...l, required: flags[i % flags.length] }));
          const stations = stationsOf(engine);
          const now = requiredStations(engine, spec, stations);
          expect(now).toEqual(requiredStationsBefore(engine, spec, stations));
          return true;
        },
      ),
      { numRuns: 40 },
    );
  });

  it("find derived inputs on the demo V8 (an oil clearance needs its bearing bore and journal)", () => {
    const spec = (STREET_V8_INCH as SpecLimit[]).map((l) => ({ ...l, required: true }));
    const now = requiredStations(V8, spec, stationsOf(V8));
    expect(now.some((r) => r.neededFor.size > 0)).toBe(true);
    expect(now).toEqual(requiredStationsBefore(V8, spec, stationsOf(V8)));
  });

  it("count only own limits, as before, on an engine the core cannot lay out", () => {
    const bad = { ...V8, cylinders: 0 };
    const spec = (STREET_V8_INCH as SpecLimit[]).map((l) => ({ ...l, required: true }));
    const stations = stationsOf(V8);
    const now = requiredStations(bad, spec, stations);
    expect(now.every((r) => r.neededFor.size === 0)).toBe(true);
    expect(now.length).toBeGreaterThan(0);
    expect(now).toEqual(requiredStationsBefore(bad, spec, stations));
  });
});
