// Engine build arithmetic: displacement, compression ratio, rod ratio, deck stack-up, valve lift
// and spring rate. Volumes follow Heywood, Internal Combustion Engine Fundamentals (1988), §2.2:
// swept volume π/4·B²·L per cylinder, compression ratio (Vd + Vc)/Vc. A flat head (0 cc chamber)
// is allowed: a diesel with its combustion bowl in the piston, or a flat-head engine, keeps its
// clearance volume in the piston, the gasket and the deck, and the formula stands as it is.
import { requireFinite, requirePositive } from "./checks";
import type { LengthUnit } from "./enums";
import { cleanDecimal, decimalDifference, decimalSum } from "./units";

function cylinderVolume(diameter: number, height: number): number {
  return (Math.PI / 4) * diameter * diameter * height;
}

/** Total swept volume in the cube of the input unit (in → in³, mm → mm³; cc = mm³ / 1000). */
export function displacement(bore: number, stroke: number, cylinders: number): number {
  requirePositive(bore, "Bore");
  requirePositive(stroke, "Stroke");
  if (!Number.isInteger(cylinders) || cylinders < 1) {
    throw new Error(`Cylinder count must be a whole number of 1 or more; got ${String(cylinders)}`);
  }
  return cylinderVolume(bore, stroke) * cylinders;
}

export interface CompressionRatioInput {
  lengthUnit: LengthUnit;
  bore: number;
  stroke: number;
  gasketBore: number;
  /** Compressed thickness. */
  gasketThickness: number;
  /** Positive when the piston crown sits below the deck at TDC, negative when above. */
  deckClearance: number;
  chamberCc: number;
  /** Positive for a dish (adds volume), negative for a dome (takes it away). */
  pistonCc: number;
}

export interface CompressionRatioResult {
  ratio: number;
  sweptCc: number;
  clearanceCc: number;
  gasketCc: number;
  deckCc: number;
}

const CM_PER_UNIT: Readonly<Record<LengthUnit, number>> = { in: 2.54, mm: 0.1 };

/** Static compression ratio of one cylinder; all volumes returned in cc. */
export function compressionRatio(input: CompressionRatioInput): CompressionRatioResult {
  const { lengthUnit, bore, stroke, gasketBore, gasketThickness, deckClearance, chamberCc, pistonCc } = input;
  const cm = CM_PER_UNIT[lengthUnit];
  if (cm === undefined) throw new Error(`Length unit must be 'in' or 'mm'; got '${String(lengthUnit)}'`);
  requirePositive(bore, "Bore");
  requirePositive(stroke, "Stroke");
  requirePositive(gasketBore, "Gasket bore");
  requireFinite(gasketThickness, "Gasket thickness");
  if (gasketThickness < 0) throw new Error("Gasket thickness cannot be negative");
  requireFinite(deckClearance, "Deck clearance");
  requireFinite(chamberCc, "Chamber volume");
  if (chamberCc < 0) throw new Error("Chamber volume cannot be negative; enter 0 for a flat head");
  requireFinite(pistonCc, "Piston dish/dome volume");
  // Deck volume uses the bore (the piston's own cylinder); gasket volume uses the gasket bore.
  const sweptCc = cylinderVolume(bore * cm, stroke * cm);
  const gasketCc = cylinderVolume(gasketBore * cm, gasketThickness * cm);
  const deckCc = cylinderVolume(bore * cm, deckClearance * cm);
  const clearanceCc = chamberCc + gasketCc + deckCc + pistonCc;
  if (clearanceCc <= 0) {
    throw new Error(
      `Clearance volume comes to ${clearanceCc.toFixed(2)} cc, so the piston would hit the head; ` +
        "check the dome volume (negative for a dome) and the deck clearance sign",
    );
  }
  return { ratio: (sweptCc + clearanceCc) / clearanceCc, sweptCc, clearanceCc, gasketCc, deckCc };
}

/** Connecting-rod length (centre to centre) over stroke. */
export function rodRatio(rodLength: number, stroke: number): number {
  requirePositive(rodLength, "Rod length");
  requirePositive(stroke, "Stroke");
  return rodLength / stroke;
}

export interface CompressionHeightInput {
  deckHeight: number;
  stroke: number;
  rodLength: number;
  /** Wanted deck clearance, positive below the deck. */
  deckClearance: number;
  /** Shortest compression height a usable piston can have (pin bore plus ring pack); default 0. */
  minCompressionHeight?: number;
}

export interface CompressionHeightResult {
  compressionHeight: number;
  fits: boolean;
  reason?: string;
}

/**
 * Piston compression height needed for a crank, rod and block: deck height − stroke/2 − rod
 * length − deck clearance. The issue asks "will this crank, rod and piston fit the block?", so it
 * answers with `fits` and, when it does not, a reason the builder can act on.
 */
export function compressionHeight(input: CompressionHeightInput): CompressionHeightResult {
  const { deckHeight, stroke, rodLength, deckClearance, minCompressionHeight = 0 } = input;
  requirePositive(deckHeight, "Deck height");
  requirePositive(stroke, "Stroke");
  requirePositive(rodLength, "Rod length");
  requireFinite(deckClearance, "Deck clearance");
  requireFinite(minCompressionHeight, "Minimum compression height");
  const needed = decimalSum([deckHeight, -stroke / 2, -rodLength, -deckClearance]);
  if (needed <= 0) {
    return {
      compressionHeight: needed,
      fits: false,
      reason: "Crank and rod alone reach past the deck; use a shorter rod or stroke, or a taller deck",
    };
  }
  if (needed < minCompressionHeight) {
    return {
      compressionHeight: needed,
      fits: false,
      reason: `Needs a compression height of ${needed}, below the ${minCompressionHeight} minimum; shorten the rod`,
    };
  }
  return { compressionHeight: needed, fits: true };
}

/** Deck clearance that a given stack gives (positive = piston below the deck at TDC). */
export function deckClearanceFor(input: {
  deckHeight: number;
  stroke: number;
  rodLength: number;
  compressionHeight: number;
}): number {
  const { deckHeight, stroke, rodLength, compressionHeight: ch } = input;
  requirePositive(deckHeight, "Deck height");
  requirePositive(stroke, "Stroke");
  requirePositive(rodLength, "Rod length");
  requirePositive(ch, "Compression height");
  return decimalSum([deckHeight, -stroke / 2, -rodLength, -ch]);
}

/** Valve lift from lobe lift and rocker ratio; net subtracts lash measured at the valve tip. */
export function valveLift(lobeLift: number, rockerRatio: number, lash = 0): { gross: number; net: number } {
  requirePositive(lobeLift, "Lobe lift");
  requirePositive(rockerRatio, "Rocker ratio");
  requireFinite(lash, "Lash");
  if (lash < 0) throw new Error("Lash cannot be negative; enter 0 for a hydraulic lifter");
  const gross = cleanDecimal(lobeLift * rockerRatio);
  return { gross, net: decimalDifference(gross, lash) };
}

/** Spring rate: (open load − seat load) / lift, e.g. lbf/in. */
export function springRate(seatLoad: number, openLoad: number, lift: number): number {
  requireFinite(seatLoad, "Seat load");
  requireFinite(openLoad, "Open load");
  requirePositive(lift, "Lift");
  if (seatLoad < 0 || openLoad < seatLoad) {
    throw new Error("Open load must be at least the seat load (check the two are not swapped)");
  }
  return (openLoad - seatLoad) / lift;
}
