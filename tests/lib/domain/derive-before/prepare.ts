// The derivation as it was before the speed-up (lib/domain/derive*.ts, December 2026), kept verbatim
// as the reference derive-before.test.ts compares the new code with: readings made ready.
import { lengthUnitOf } from "../../../../lib/domain/bench-route";
import { AXES, BORE_DEPTHS, CHARACTERISTICS, LUBRICANT_LABELS, parseStationId } from "../../../../lib/domain/stations";
import { LENGTH_UNITS, TORQUE_UNITS, type LengthUnit, type MeasureUnit } from "../../../../lib/domain/enums";
import { correctTo20C, EXPANSION_COEFFICIENTS } from "../../../../lib/domain/thermal";
import { stationWords, unitWords } from "../../../../lib/domain/words";
import type {
  CharacteristicId,
  EngineShape,
  RawCharacteristic,
  RawReading,
  ThermalCorrection,
} from "../../../../lib/domain/types";
import { cleanDecimal, convertLength } from "../../../../lib/domain/units";

/** A reading checked and brought to 20 °C where it can be. */
export interface Prepared {
  characteristic: RawCharacteristic;
  value: number;
  unit: MeasureUnit;
  uncertainty?: number;
  correction?: ThermalCorrection;
  note?: string;
}

// Gaps may be zero (a tight rod); every diameter, length and torque must be above zero.
const MAY_BE_ZERO = new Set<CharacteristicId>(["ring_end_gap", "rod_side_clearance", "crank_end_play", "valve_lash"]);

function checkReading(reading: RawReading, characteristic: RawCharacteristic): void {
  // In words (the tablet shows these): the station as a person names it, units as written.
  const id = stationWords(reading.stationId);
  const { kind, label } = CHARACTERISTICS[characteristic];
  const units: readonly string[] = kind === "length" ? LENGTH_UNITS : TORQUE_UNITS;
  if (!units.includes(reading.unit))
    throw new Error(
      `${id} takes a ${kind} in ${units.map(unitWords).join(" or ")}; got unit '${String(reading.unit)}'`,
    );
  if (typeof reading.value !== "number" || !Number.isFinite(reading.value))
    throw new Error(`${id}: the value must be a number; re-enter it`);
  const zeroOk = MAY_BE_ZERO.has(characteristic);
  if (zeroOk ? reading.value < 0 : reading.value <= 0) {
    throw new Error(
      `${id}: ${reading.value} cannot be right; a ${label.split(",")[0].toLowerCase()} is ${zeroOk ? "zero or more" : "above zero"}`,
    );
  }
  const u = reading.uncertainty;
  if (u !== undefined && (typeof u !== "number" || !Number.isFinite(u) || u < 0)) {
    throw new Error(`${id}: uncertainty U must be zero or more; got ${String(u)}`);
  }
  if (kind === "torque" && !(reading.lubricant && reading.lubricant in LUBRICANT_LABELS)) {
    const words = Object.values(LUBRICANT_LABELS).map((l) => l.toLowerCase());
    throw new Error(`${id}: say which lubricant was used (${words.join(", ")})`);
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

export function prepare(reading: RawReading, engine: EngineShape): Prepared {
  if (reading === null || typeof reading !== "object") throw new Error("A reading needs { stationId, value, unit }");
  const { characteristic } = parseStationId(reading.stationId);
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
  const station = parseStationId(stationId);
  if (station.characteristic !== "ring_end_gap") return [];
  return BORE_DEPTHS.flatMap((d) => AXES.map((a) => `bore/${station.cylinder}/${d}/${a}`));
}

export function boreMean(stations: string[], readings: Map<string, Prepared>, engine: EngineShape): number | undefined {
  const values = stations
    .map((id) => readings.get(id))
    .filter((p): p is Prepared => p !== undefined)
    .map((p) => toEngineUnit(p, engine));
  return values.length ? cleanDecimal(values.reduce((s, v) => s + v, 0) / values.length) : undefined;
}

export function toEngineUnit(p: Prepared, engine: EngineShape, x = p.value): number {
  return cleanDecimal(convertLength(x, p.unit as LengthUnit, lengthUnitOf(engine)));
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
