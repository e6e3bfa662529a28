// Values computed from raw readings, and the check of a single reading: the one place the
// tablet (offline preview) and the server (authoritative verdicts, flags) both call.
// Readings are made ready in derive-prepare.ts (latest per station, 20 °C); what each value is
// computed from is in derive-recipes.ts.
//
// U of a derived value: the two largest input U (k = 2) are combined as the difference of two
// readings (clearanceUncertainty, no shared part assumed); inputs without U count as 0.
import { benchRoute, checkEngineShape, lengthUnitOf } from "./bench-route";
import {
  boreMean,
  joinNotes,
  limitInputs,
  prepare,
  prepareAll,
  uInEngineUnit,
  valueInEngineUnit,
  type Prepared,
} from "./derive-prepare";
import { recipes, type PassMemo, type Recipe } from "./derive-recipes";
import { limitContextFor } from "./job-sizes";
import { judge, limitsFor } from "./limits";
import type { LengthUnit } from "./enums";
import type {
  BenchRoute,
  DerivedCharacteristic,
  DerivedValue,
  EngineShape,
  Evaluation,
  RawReading,
  SpecLimit,
  ThermalCorrection,
} from "./types";
import { clearanceUncertainty } from "./uncertainty";
import { cleanDecimal } from "./units";

export { limitInputs } from "./derive-prepare";
export { derivedInputs } from "./derive-recipes";

// The route's station ids, kept beside benchRoute's shared route: evaluateReading asks for each reading.
const routeIdSets = new WeakMap<BenchRoute, Set<string>>();
export function routeIds(engine: EngineShape): Set<string> {
  const route = benchRoute(engine);
  let ids = routeIdSets.get(route);
  if (!ids) {
    ids = new Set(route.sections.flatMap((s) => s.stations.map((st) => st.id)));
    routeIdSets.set(route, ids);
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

function combinedU(inputs: Prepared[], engine: EngineShape): number | undefined {
  // The two largest U (a ≥ b), kept as the inputs pass: a value has two to eight inputs.
  let a = 0;
  let b = 0;
  let any = false;
  for (const p of inputs) {
    const u = uInEngineUnit(p, engine);
    if (u === undefined) continue;
    any = true;
    if (u > a) {
      b = a;
      a = u;
    } else if (u > b) b = u;
  }
  if (!any) return undefined;
  return cleanDecimal(2 * clearanceUncertainty({ uBore: a / 2, uJournal: b / 2 }));
}

interface Pass {
  engine: EngineShape;
  spec: SpecLimit[];
  unit: LengthUnit;
  ok: Map<string, Prepared>;
  bad: Map<string, string>;
  memo: PassMemo;
}

function derive(recipe: Recipe, pass: Pass): DerivedValue {
  const { characteristic, stationId, inputs } = recipe;
  const { engine, spec, unit, ok, bad } = pass;
  const got: Prepared[] = [];
  const missing: string[] = [];
  for (const id of inputs) {
    const p = ok.get(id);
    if (p) got.push(p);
    else missing.push(id);
  }
  // The recipe (its inputs too) is shared by every pass: the caller gets its own list.
  const head = { key: recipe.key, characteristic, stationId, label: recipe.label, unit, inputs: [...inputs], missing };
  const values = got.map((p) => valueInEngineUnit(p, engine));
  const measured = missing.length
    ? undefined
    : recipe.diameterInput !== undefined
      ? values[recipe.diameterInput]
      : cleanDecimal(values.reduce((s, v) => s + v, 0) / values.length);
  const found = limitsFor(spec, characteristic, stationId, limitContextFor(characteristic, engine, measured));
  if (missing.length) {
    const unusable = joinNotes(...missing.filter((id) => bad.has(id)).map((id) => `not usable: ${bad.get(id)}`));
    const note = joinNotes(unusable, found.note);
    const out: DerivedValue = head;
    if (found.limits) out.limits = found.limits;
    if (note) out.note = note;
    return out;
  }
  const value = recipe.compute(values, pass.memo);
  const U = combinedU(got, engine);
  const corrections: ThermalCorrection[] = [];
  for (const p of got) if (p.correction) corrections.push(p.correction);
  // judge reports the value in the limit's unit (a length unit, or the engine's when it cannot convert).
  const judged: Evaluation = found.limits
    ? judge(value, unit, U, found.limits)
    : { value, unit, ...(U !== undefined ? { uncertainty: U } : {}) };
  const note = joinNotes(found.note, judged.note, ...got.map((p) => p.note));
  // Assigned, not spread: the same keys in the same order as {...head, ...judged, unit, corrections,
  // note}, at a fraction of the cost (spreading objects of many shapes was a fifth of a pass).
  const out = head as DerivedValue & Record<string, unknown>;
  for (const k in judged) out[k] = judged[k as keyof Evaluation];
  out.unit = judged.unit as LengthUnit;
  if (corrections.length) out.corrections = corrections;
  if (note) out.note = note;
  return out;
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
  const all = recipes(engine);
  const wanted =
    touching || only
      ? all.filter((r) => (!touching || r.inputs.some(touching)) && (!only || only.includes(r.characteristic)))
      : all;
  const needed = touching || only ? new Set(wanted.flatMap((r) => r.inputs)) : undefined;
  const { ok, bad } = prepareAll(needed ? readings.filter((r) => needed.has(r?.stationId)) : readings, engine);
  const pass: Pass = { engine, spec, unit: lengthUnitOf(engine), ok, bad, memo: new Map() };
  return wanted.map((r) => derive(r, pass));
}
