// Physical plausibility of a bench figure: catches a slipped decimal point or a wrong unit (a bore
// of 40 in, a 102 "in" bore that was 102 mm) before it becomes a verdict. These are not limits:
// a value inside the range can still be out of spec. The ranges span shop engines from small
// single-cylinder engines to large truck, tractor and industrial diesels. Common practice, from
// memory; they are deliberately wide.
import { CHARACTERISTICS, parseStationId } from "./stations";
import type { MeasureUnit } from "./enums";
import type { CharacteristicId, DerivedCharacteristic, EngineShape, RawCharacteristic } from "./types";
import { cleanDecimal, convertLength, convertTorque, decimalDifference } from "./units";
import { unitWords } from "./words";

export type Range = { min: number; max: number };
/**
 * Lengths in mm, torque in N·m. Gaps and clearances may be zero; a torque may not (the smallest
 * engine fasteners, M5 and M6 screws, take a few N·m: common practice, from memory).
 */
export const PLAUSIBLE_RANGES: Readonly<Record<RawCharacteristic, Range>> = {
  bore_diameter: { min: 20, max: 400 },
  piston_skirt_diameter: { min: 20, max: 400 },
  main_journal_diameter: { min: 10, max: 300 },
  rod_journal_diameter: { min: 10, max: 300 },
  main_bearing_bore: { min: 10, max: 320 },
  rod_bearing_bore: { min: 10, max: 320 },
  ring_end_gap: { min: 0, max: 3 },
  rod_side_clearance: { min: 0, max: 2 },
  crank_end_play: { min: 0, max: 2 },
  rod_bolt_free_length: { min: 10, max: 300 },
  rod_bolt_loaded_length: { min: 10, max: 300 },
  deck_height: { min: 50, max: 1200 },
  valve_lash: { min: 0, max: 2 },
  fastener_torque: { min: 1, max: 3000 },
};

/**
 * Computed values, as a limit on them is written: clearances, taper, out-of-round and stretch are
 * never negative, and a limit far above these is a slipped decimal point (common practice, from
 * memory: service limits are a few hundredths of a millimetre to a few tenths on big diesels).
 */
export const DERIVED_PLAUSIBLE_RANGES: Readonly<Record<DerivedCharacteristic, Range>> = {
  main_oil_clearance: { min: 0, max: 0.5 },
  rod_oil_clearance: { min: 0, max: 0.5 },
  piston_to_wall: { min: 0, max: 0.5 },
  bore_taper: { min: 0, max: 0.5 },
  bore_out_of_round: { min: 0, max: 0.5 },
  main_journal_taper: { min: 0, max: 0.2 },
  main_journal_out_of_round: { min: 0, max: 0.2 },
  rod_journal_taper: { min: 0, max: 0.2 },
  rod_journal_out_of_round: { min: 0, max: 0.2 },
  rod_bolt_stretch: { min: 0, max: 1 },
};

/** The plausible range of any characteristic, raw or computed (mm or N·m). */
export const plausibleRange = (c: CharacteristicId): Range =>
  c in PLAUSIBLE_RANGES
    ? PLAUSIBLE_RANGES[c as RawCharacteristic]
    : DERIVED_PLAUSIBLE_RANGES[c as DerivedCharacteristic];

/** A bore or skirt this far from the engine's nominal bore is a slip, not a worn part. */
export const NOMINAL_BORE_SLACK = 0.1;

const round = (x: number) => cleanDecimal(Number(x.toPrecision(4)));

/** A figure in mm (lengths) or N·m (torque). */
export function canonical(value: number, unit: MeasureUnit): number {
  return cleanDecimal(
    unit === "in" || unit === "mm" ? convertLength(value, unit, "mm") : convertTorque(value, unit, "nm"),
  );
}

export function rangeWords(r: Range, kind: "length" | "torque"): string {
  if (kind === "torque") return `${r.min}–${r.max} N·m (${round(convertTorque(r.max, "nm", "lbf_ft"))} lbf·ft at most)`;
  return `${r.min}–${r.max} mm (${round(convertLength(r.min, "mm", "in"))}–${round(convertLength(r.max, "mm", "in"))} in)`;
}

/**
 * Why a value cannot be a real reading at this station, or undefined when it can. The unit must
 * already suit the characteristic (a length in in or mm, a torque in lbf_ft or nm).
 */
export function implausibleReason(
  stationId: string,
  value: number,
  unit: MeasureUnit,
  engine?: EngineShape,
): string | undefined {
  const { characteristic } = parseStationId(stationId);
  if (!characteristic) return undefined;
  const info = CHARACTERISTICS[characteristic];
  const range = PLAUSIBLE_RANGES[characteristic];
  const name = info.label.split(",")[0].toLowerCase();
  const v = canonical(value, unit);
  if (v < range.min || v > range.max) {
    return (
      `${value} ${unitWords(unit)} cannot be a ${name}: a real one is ${rangeWords(range, info.kind)}. ` +
      "Check the decimal point and the unit"
    );
  }
  if (characteristic === "bore_diameter" || characteristic === "piston_skirt_diameter") {
    return farFromNominalBore(value, unit, engine);
  }
  return undefined;
}

const characteristicName = (c: CharacteristicId) => CHARACTERISTICS[c].label.split(",")[0].toLowerCase();

/**
 * Why a figure cannot be a real value of this characteristic (a reading, or a limit on one), or
 * undefined when it can: below zero for a gap or clearance, or outside the plausible range.
 */
export function figureProblem(c: CharacteristicId, value: number, unit: MeasureUnit): string | undefined {
  const range = plausibleRange(c);
  const name = characteristicName(c);
  const v = canonical(value, unit);
  if (range.min === 0 && v < 0) return `A ${name} cannot be negative; enter 0 or more`;
  if (v >= range.min && v <= range.max) return undefined;
  const words = rangeWords(range, CHARACTERISTICS[c].kind);
  return `${value} ${unit} cannot be a ${name}: a real one is ${words}. Check the decimal point and the unit`;
}

/** Why a bore-sized figure is too far from the engine's nominal bore (NOMINAL_BORE_SLACK), or undefined. */
export function farFromNominalBore(
  value: number,
  unit: MeasureUnit,
  engine?: Pick<EngineShape, "unitSystem" | "nominalSizes">,
): string | undefined {
  const nominal = engine?.nominalSizes?.bore;
  if (!nominal || !engine) return undefined;
  const v = canonical(value, unit);
  const nominalMm = cleanDecimal(convertLength(nominal, engine.unitSystem === "metric" ? "mm" : "in", "mm"));
  // Exact decimal difference, so a value exactly on the 10% edge is still accepted.
  if (Math.abs(decimalDifference(v, nominalMm)) <= cleanDecimal(NOMINAL_BORE_SLACK * nominalMm)) return undefined;
  const unitWord = engine.unitSystem === "metric" ? "mm" : "in";
  return (
    `${value} ${unit} is more than ${NOMINAL_BORE_SLACK * 100}% away from this engine's ${nominal} ${unitWord} bore. ` +
    "Check the decimal point and the unit"
  );
}
