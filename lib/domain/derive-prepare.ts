// Raw readings made ready for derive.ts: checked, the latest per station, brought to 20 °C.
//
// Choices, each made once here:
// - A station with several readings uses the latest (later takenAt; without times, the later in
//   the list): corrections supersede, they never average.
// - Lengths with a part temperature are brought to 20 °C (ISO 1) with the alpha of the part's
//   material (the reading's own, else the engine's), before any difference is taken.
import { lengthUnitOf } from "./bench-route";
import { AXES, BORE_DEPTHS, CHARACTERISTICS, LUBRICANT_LABELS, parseStationId } from "./stations";
import { LENGTH_UNITS, TORQUE_UNITS, type LengthUnit, type MeasureUnit } from "./enums";
import { correctTo20C, EXPANSION_COEFFICIENTS } from "./thermal";
import { stationWords, unitWords } from "./words";
import type { CharacteristicId, EngineShape, RawCharacteristic, RawReading, ThermalCorrection } from "./types";
import { cleanDecimal, convertLength } from "./units";

/** A reading checked and brought to 20 °C where it can be. */
export interface Prepared {
  characteristic: RawCharacteristic;
  value: number;
  unit: MeasureUnit;
  uncertainty?: number;
  correction?: ThermalCorrection;
  note?: string;
  /** value and U in the engine's length unit, worked out once when a derived value first needs them. */
  inEngineUnit?: number;
  uInEngineUnit?: number;
}

// Gaps may be zero (a tight rod); every diameter, length and torque must be above zero.
const MAY_BE_ZERO = new Set<CharacteristicId>(["ring_end_gap", "rod_side_clearance", "crank_end_play", "valve_lash"]);

function checkReading(reading: RawReading, characteristic: RawCharacteristic): void {
  // In words (the tablet shows these): the station as a person names it, units as written. Worded
  // only when a check fails (no closure made per reading either): a job's page checks hundreds.
  const { kind, label } = CHARACTERISTICS[characteristic];
  const units: readonly string[] = kind === "length" ? LENGTH_UNITS : TORQUE_UNITS;
  if (!units.includes(reading.unit))
    throw new Error(
      `${stationWords(reading.stationId)} takes a ${kind} in ${units.map(unitWords).join(" or ")}; got unit '${String(reading.unit)}'`,
    );
  if (typeof reading.value !== "number" || !Number.isFinite(reading.value))
    throw new Error(`${stationWords(reading.stationId)}: the value must be a number; re-enter it`);
  const zeroOk = MAY_BE_ZERO.has(characteristic);
  if (zeroOk ? reading.value < 0 : reading.value <= 0) {
    const what = label.split(",")[0].toLowerCase();
    throw new Error(
      `${stationWords(reading.stationId)}: ${reading.value} cannot be right; a ${what} is ${zeroOk ? "zero or more" : "above zero"}`,
    );
  }
  const u = reading.uncertainty;
  if (u !== undefined && (typeof u !== "number" || !Number.isFinite(u) || u < 0)) {
    throw new Error(`${stationWords(reading.stationId)}: uncertainty U must be zero or more; got ${String(u)}`);
  }
  if (kind === "torque" && !(reading.lubricant && reading.lubricant in LUBRICANT_LABELS)) {
    const words = Object.values(LUBRICANT_LABELS).map((l) => l.toLowerCase());
    throw new Error(`${stationWords(reading.stationId)}: say which lubricant was used (${words.join(", ")})`);
  }
}

function correction(
  reading: RawReading,
  characteristic: RawCharacteristic,
  engine: EngineShape,
): Pick<Prepared, "correction" | "note"> {
  const part = CHARACTERISTICS[characteristic].part;
  const t = reading.temperatureC;
  if (t === undefined || !part) return {};
  const material = reading.material ?? engine.materials?.[part];
  if (!material)
    return { note: `Measured at ${t} °C, but no ${part} material is set, so it is not corrected to 20 °C` };
  const coefficient = EXPANSION_COEFFICIENTS[material];
  if (!coefficient) throw new Error(`${reading.stationId}: unknown material '${String(material)}'`);
  const g = reading.gaugeTemperatureC;
  const corrected = cleanDecimal(
    correctTo20C({
      length: reading.value,
      partTempC: t,
      alphaPart: coefficient.alpha,
      ...(g !== undefined ? { gaugeTempC: g } : {}),
    }),
  );
  return {
    correction: {
      stationId: reading.stationId,
      measured: reading.value,
      corrected,
      partTempC: t,
      alphaPart: coefficient.alpha,
      material,
      ...(g !== undefined ? { gaugeTempC: g } : {}),
    },
  };
}

// The characteristic a station id names (null for a part), parsed once per id: station ids are a
// small fixed vocabulary, while a job's page prepares hundreds of readings on every call.
const characteristicOf = new Map<string, RawCharacteristic | null>();
function characteristicAt(stationId: string): RawCharacteristic | undefined {
  let c = characteristicOf.get(stationId);
  if (c === undefined) {
    c = parseStationId(stationId).characteristic ?? null; // throws, in words, for an unknown station
    if (characteristicOf.size > 5000) characteristicOf.clear();
    characteristicOf.set(stationId, c);
  }
  return c ?? undefined;
}

export function prepare(reading: RawReading, engine: EngineShape): Prepared {
  if (reading === null || typeof reading !== "object") throw new Error("A reading needs { stationId, value, unit }");
  const characteristic = characteristicAt(reading.stationId);
  if (!characteristic)
    throw new Error(`${reading.stationId} names a part; readings are taken at stations such as 'bore/1/top/A'`);
  checkReading(reading, characteristic);
  const fix = correction(reading, characteristic, engine);
  return {
    characteristic,
    unit: reading.unit,
    ...fix,
    value: fix.correction ? fix.correction.corrected : reading.value,
    ...(reading.uncertainty !== undefined ? { uncertainty: reading.uncertainty } : {}),
  };
}

function latestByStation(readings: RawReading[]): Map<string, RawReading> {
  const latest = new Map<string, RawReading>();
  for (const r of readings) {
    const prev = latest.get(r.stationId);
    const older = prev?.takenAt && r.takenAt && Date.parse(r.takenAt) < Date.parse(prev.takenAt);
    if (!older) latest.set(r.stationId, r);
  }
  return latest;
}

export const joinNotes = (...notes: (string | undefined)[]): string | undefined =>
  notes.filter(Boolean).join("; ") || undefined;

/**
 * Stations whose readings the limit at `stationId` reads: a ring gap's limit may scale with its
 * cylinder's bore (per inch of diameter), taken as the mean of that bore's readings.
 */
export function limitInputs(stationId: string): string[] {
  let inputs = limitInputsOf.get(stationId);
  if (!inputs) {
    const station = parseStationId(stationId);
    inputs =
      station.characteristic === "ring_end_gap"
        ? BORE_DEPTHS.flatMap((d) => AXES.map((a) => `bore/${station.cylinder}/${d}/${a}`))
        : [];
    if (limitInputsOf.size > 5000) limitInputsOf.clear();
    limitInputsOf.set(stationId, inputs);
  }
  return [...inputs];
}
// Asked once per reading checked (the maps judge every figure): parsed once per station id.
const limitInputsOf = new Map<string, readonly string[]>();

/** The prepared value in the engine's length unit (kept on the reading: several values read it). */
export function valueInEngineUnit(p: Prepared, engine: EngineShape): number {
  return (p.inEngineUnit ??= toEngineUnit(p, engine, p.value));
}

/** The prepared reading's U in the engine's length unit; undefined without one. */
export function uInEngineUnit(p: Prepared, engine: EngineShape): number | undefined {
  if (p.uncertainty === undefined) return undefined;
  return (p.uInEngineUnit ??= toEngineUnit(p, engine, p.uncertainty));
}

function toEngineUnit(p: Prepared, engine: EngineShape, x: number): number {
  return cleanDecimal(convertLength(x, p.unit as LengthUnit, lengthUnitOf(engine)));
}

export function boreMean(stations: string[], readings: Map<string, Prepared>, engine: EngineShape): number | undefined {
  const values = stations
    .map((id) => readings.get(id))
    .filter((p): p is Prepared => p !== undefined)
    .map((p) => valueInEngineUnit(p, engine));
  return values.length ? cleanDecimal(values.reduce((s, v) => s + v, 0) / values.length) : undefined;
}

export function prepareAll(
  readings: RawReading[],
  engine: EngineShape,
): { ok: Map<string, Prepared>; bad: Map<string, string> } {
  const ok = new Map<string, Prepared>();
  const bad = new Map<string, string>();
  for (const [id, r] of latestByStation(readings)) {
    try {
      ok.set(id, prepare(r, engine));
    } catch (err) {
      bad.set(id, err instanceof Error ? err.message : String(err));
    }
  }
  return { ok, bad };
}
