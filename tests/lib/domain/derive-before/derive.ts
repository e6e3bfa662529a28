// The derivation as it was before the speed-up (lib/domain/derive*.ts, December 2026), kept verbatim
// as the reference derive-before.test.ts compares the new code with: values and single readings.
import {
  benchRoute,
  checkEngineShape,
  lengthUnitOf,
  rodJournalCount,
  rodJournalOf,
} from "../../../../lib/domain/bench-route";
import { boltStretch, oilClearance, pistonToWall } from "../../../../lib/domain/clearances";
import { boreGeometry, journalGeometry } from "../../../../lib/domain/geometry";
import { limitContextFor } from "../../../../lib/domain/job-sizes";
import { judge, limitsFor } from "../../../../lib/domain/limits";
import { AXES, BORE_DEPTHS, CHARACTERISTICS, JOURNAL_POSITIONS } from "../../../../lib/domain/stations";
import { describeStation } from "../../../../lib/domain/station-words";
import type { LengthUnit } from "../../../../lib/domain/enums";
import type {
  DerivedCharacteristic,
  DerivedValue,
  EngineShape,
  Evaluation,
  RawReading,
  SpecLimit,
} from "../../../../lib/domain/types";
import { clearanceUncertainty } from "../../../../lib/domain/uncertainty";
import { cleanDecimal } from "../../../../lib/domain/units";
import { boreMean, joinNotes, limitInputs, prepare, prepareAll, toEngineUnit, type Prepared } from "./prepare";

// Keyed by the fields the route's station ids are made of (bench-route.ts STATION_IDS), not the
// object, so an edited engine never meets a stale route; not its sizes and materials, which
// made the key long enough to cost more than the lookup (bench:sync).
const routeCache = new Map<string, Set<string>>();
function routeIds(engine: EngineShape): Set<string> {
  const e = engine;
  const key = JSON.stringify([
    e.cylinders,
    e.layout,
    e.mains,
    e.valvesPerCylinder,
    e.boltsPerRod,
    e.ringsPerPiston,
    e.rodJournals,
    e.rodJournalMap,
    e.torqueGroups,
  ]);
  let ids = routeCache.get(key);
  if (!ids) {
    if (routeCache.size > 50) routeCache.clear();
    ids = new Set(benchRoute(engine).sections.flatMap((s) => s.stations.map((st) => st.id)));
    routeCache.set(key, ids);
  }
  return ids;
}

/**
 * Checks one raw reading against the job's spec: verdict, resolved limits and deviation from
 * nominal. Throws, saying what to fix, for a station the engine does not have or a bad value.
 * `readings` (the job's others) give a ring-gap rule its bore; without them the nominal bore is used.
 */
export function evaluateReading(
  reading: RawReading,
  engine: EngineShape,
  spec: SpecLimit[],
  readings: RawReading[] = [],
): Evaluation {
  checkEngineShape(engine);
  const p = prepare(reading, engine);
  if (!routeIds(engine).has(reading.stationId)) {
    throw new Error(
      `Station '${reading.stationId}' is not on this engine's route (${engine.cylinders} cylinders, ${engine.mains} mains)`,
    );
  }
  const sizeFrom = new Set(limitInputs(reading.stationId));
  const sizeReadings = sizeFrom.size ? readings.filter((r) => sizeFrom.has(r?.stationId)) : [];
  const bore = sizeFrom.size ? boreMean([...sizeFrom], prepareAll(sizeReadings, engine).ok, engine) : undefined;
  const found = limitsFor(spec, p.characteristic, reading.stationId, limitContextFor(p.characteristic, engine, bore));
  const base: Evaluation = found.limits
    ? judge(p.value, p.unit, p.uncertainty, found.limits)
    : { value: p.value, unit: p.unit };
  const note = joinNotes(p.note, found.note, base.note);
  return { ...base, ...(p.correction ? { correction: p.correction } : {}), ...(note ? { note } : {}) };
}

interface Recipe {
  characteristic: DerivedCharacteristic;
  stationId: string;
  inputs: string[];
  compute: (v: number[]) => number;
  /** Index of the input whose diameter a per-inch rule scales with; default: mean of all inputs. */
  diameterInput?: number;
}

function geometryRecipes(prefix: "bore" | "main" | "rod", n: number, inputs: string[], half: number): Recipe[] {
  const shape = (v: number[]) =>
    (prefix === "bore" ? boreGeometry : journalGeometry)({ axisA: v.slice(0, half), axisB: v.slice(half) });
  const names =
    prefix === "bore"
      ? (["bore_taper", "bore_out_of_round"] as const)
      : prefix === "main"
        ? (["main_journal_taper", "main_journal_out_of_round"] as const)
        : (["rod_journal_taper", "rod_journal_out_of_round"] as const);
  return [
    { characteristic: names[0], stationId: `${prefix}/${n}`, inputs, compute: (v) => shape(v).taper },
    { characteristic: names[1], stationId: `${prefix}/${n}`, inputs, compute: (v) => shape(v).outOfRound },
  ];
}

const range = (n: number): number[] => Array.from({ length: n }, (_, i) => i + 1);
const byAxis = (head: string, spots: readonly string[]): string[] =>
  AXES.flatMap((a) => spots.map((s) => `${head}/${s}/${a}`));
const points = JOURNAL_POSITIONS.flatMap((p) => AXES.map((a) => `${p}/${a}`));

function recipes(engine: EngineShape): Recipe[] {
  const out: Recipe[] = [];
  for (const c of range(engine.cylinders)) {
    out.push(...geometryRecipes("bore", c, byAxis(`bore/${c}`, BORE_DEPTHS), BORE_DEPTHS.length));
    out.push({
      characteristic: "piston_to_wall",
      stationId: `bore/${c}`,
      inputs: [`bore/${c}/mid/A`, `skirt/${c}`],
      compute: (v) => pistonToWall(v[0], v[1]),
      diameterInput: 0,
    });
  }
  for (const m of range(engine.mains))
    out.push(...geometryRecipes("main", m, byAxis(`main/${m}`, JOURNAL_POSITIONS), JOURNAL_POSITIONS.length));
  for (const j of range(rodJournalCount(engine)))
    out.push(...geometryRecipes("rod", j, byAxis(`rod/${j}`, JOURNAL_POSITIONS), JOURNAL_POSITIONS.length));
  for (const m of range(engine.mains)) {
    for (const pt of points)
      out.push({
        characteristic: "main_oil_clearance",
        stationId: `main-brg/${m}/${pt}`,
        inputs: [`main-brg/${m}/${pt}`, `main/${m}/${pt}`],
        compute: (v) => oilClearance(v[0], v[1]),
        diameterInput: 1,
      });
  }
  for (const r of range(engine.cylinders)) {
    const pin = rodJournalOf(engine, r);
    for (const pt of points)
      out.push({
        characteristic: "rod_oil_clearance",
        stationId: `rod-brg/${r}/${pt}`,
        inputs: [`rod-brg/${r}/${pt}`, `rod/${pin}/${pt}`],
        compute: (v) => oilClearance(v[0], v[1]),
        diameterInput: 1,
      });
    for (const b of range(engine.boltsPerRod ?? 2)) {
      out.push({
        characteristic: "rod_bolt_stretch",
        stationId: `bolt/${r}/${b}`,
        inputs: [`bolt/${r}/${b}/free`, `bolt/${r}/${b}/loaded`],
        compute: (v) => boltStretch(v[0], v[1]),
      });
    }
  }
  return out;
}

function combinedU(inputs: Prepared[], engine: EngineShape): number | undefined {
  const us = inputs.filter((p) => p.uncertainty !== undefined).map((p) => toEngineUnit(p, engine, p.uncertainty));
  if (us.length === 0) return undefined;
  const [a = 0, b = 0] = us.sort((x, y) => y - x);
  return cleanDecimal(2 * clearanceUncertainty({ uBore: a / 2, uJournal: b / 2 }));
}

function derive(
  recipe: Recipe,
  engine: EngineShape,
  spec: SpecLimit[],
  ok: Map<string, Prepared>,
  bad: Map<string, string>,
): DerivedValue {
  const { characteristic, stationId, inputs } = recipe;
  const unit = lengthUnitOf(engine);
  const missing = inputs.filter((id) => !ok.has(id));
  const head = {
    key: derivedKey(characteristic, stationId),
    characteristic,
    stationId,
    label: `${CHARACTERISTICS[characteristic].label} · ${describeStation(stationId)}`,
    unit,
    inputs,
    missing,
  };
  const unusable = joinNotes(...missing.filter((id) => bad.has(id)).map((id) => `not usable: ${bad.get(id)}`));
  const got = inputs.map((id) => ok.get(id)).filter((p): p is Prepared => p !== undefined);
  const values = got.map((p) => toEngineUnit(p, engine));
  const measured = missing.length
    ? undefined
    : recipe.diameterInput !== undefined
      ? values[recipe.diameterInput]
      : cleanDecimal(values.reduce((s, v) => s + v, 0) / values.length);
  const found = limitsFor(spec, characteristic, stationId, limitContextFor(characteristic, engine, measured));
  if (missing.length) {
    const note = joinNotes(unusable, found.note);
    return { ...head, ...(found.limits ? { limits: found.limits } : {}), ...(note ? { note } : {}) };
  }
  const value = recipe.compute(values);
  const U = combinedU(got, engine);
  const corrections = got.flatMap((p) => (p.correction ? [p.correction] : []));
  // judge reports the value in the limit's unit (a length unit, or the engine's when it cannot convert).
  const judged: Evaluation = found.limits
    ? judge(value, unit, U, found.limits)
    : { value, unit, ...(U !== undefined ? { uncertainty: U } : {}) };
  const note = joinNotes(found.note, judged.note, ...got.map((p) => p.note));
  return {
    ...head,
    ...judged,
    unit: judged.unit as LengthUnit,
    ...(corrections.length ? { corrections } : {}),
    ...(note ? { note } : {}),
  };
}

const derivedKey = (characteristic: DerivedCharacteristic, stationId: string) => `${characteristic}@${stationId}`;

// Recipes depend only on the engine's shape; keyed by its JSON, like the route above.
const inputsCache = new Map<string, ReadonlyMap<string, readonly string[]>>();

/** Each derived value's key (`${characteristic}@${stationId}`) with the stations it is computed from. */
export function derivedInputs(engine: EngineShape): ReadonlyMap<string, readonly string[]> {
  const key = JSON.stringify(engine);
  let inputs = inputsCache.get(key);
  if (!inputs) {
    checkEngineShape(engine);
    if (inputsCache.size > 50) inputsCache.clear();
    inputs = new Map(recipes(engine).map((r) => [derivedKey(r.characteristic, r.stationId), r.inputs]));
    inputsCache.set(key, inputs);
  }
  return inputs;
}

export interface DeriveOptions {
  /**
   * Only the values with an input at a station this accepts (the part on the tablet's screen, the
   * stations a sync upload touched): the same values as a full pass would give, without the rest.
   */
  touching?: (stationId: string) => boolean;
  /** Only values of these characteristics (the maps draw taper and out-of-round alone). */
  characteristics?: readonly DerivedCharacteristic[];
}

/**
 * Every value computed from the raw readings (one per recipe: taper and out-of-round per bore
 * and journal, piston-to-wall per cylinder, oil clearance per bearing point, stretch per bolt),
 * each with its resolved limits and verdict when the spec has a limit, and the inputs still missing.
 */
export function deriveReadings(
  readings: RawReading[],
  engine: EngineShape,
  spec: SpecLimit[],
  options: DeriveOptions = {},
): DerivedValue[] {
  checkEngineShape(engine);
  if (!Array.isArray(readings)) throw new Error("deriveReadings needs the job's readings as a list");
  const { touching, characteristics: only } = options;
  const wanted = recipes(engine).filter(
    (r) => (!touching || r.inputs.some(touching)) && (!only || only.includes(r.characteristic)),
  );
  const needed = touching || only ? new Set(wanted.flatMap((r) => r.inputs)) : undefined;
  const { ok, bad } = prepareAll(needed ? readings.filter((r) => needed.has(r?.stationId)) : readings, engine);
  return wanted.map((r) => derive(r, engine, spec, ok, bad));
}
