// Clearances are differences of two decimal readings, so each result is cleaned of binary
// float noise (exact decimal arithmetic): 2.2022 − 2.2000 must be exactly 0.0022, or a value
// sitting on a limit would read as past it. All lengths are in the caller's unit (in or mm), both alike.
import { requireFinite, requirePositive } from "./checks";
import { cleanDecimal, decimalDifference } from "./units";

/** Installed bearing bore minus journal diameter. Negative means the journal will not fit. */
export function oilClearance(bearingBore: number, journal: number): number {
  requireFinite(bearingBore, "Bearing bore");
  requireFinite(journal, "Journal diameter");
  return decimalDifference(bearingBore, journal);
}

/** Cylinder bore minus piston skirt diameter (skirt measured at the piston maker's gauge point). */
export function pistonToWall(bore: number, skirt: number): number {
  requireFinite(bore, "Bore diameter");
  requireFinite(skirt, "Piston skirt diameter");
  return decimalDifference(bore, skirt);
}

/** Total indicator travel: largest minus smallest dial reading (readings may be negative). */
export function endPlay(dialReadings: number[]): number {
  if (!Array.isArray(dialReadings) || dialReadings.length < 2) {
    throw new Error("End play needs at least two dial readings (pried fully one way, then the other)");
  }
  dialReadings.forEach((r, i) => requireFinite(r, `Dial reading ${i + 1}`));
  return decimalDifference(Math.max(...dialReadings), Math.min(...dialReadings));
}

/** Loaded (torqued) length minus free length. Negative usually means the two were swapped. */
export function boltStretch(freeLength: number, loadedLength: number): number {
  requirePositive(freeLength, "Bolt free length");
  requirePositive(loadedLength, "Bolt loaded length");
  return decimalDifference(loadedLength, freeLength);
}

/**
 * Rule-of-thumb oil clearance: about 0.001 per inch of journal diameter (common practice,
 * not a standard; the engine or bearing maker's figure governs). Works in any length unit,
 * since "per inch of diameter" is a ratio.
 */
export function oilClearanceRule(journalDiameter: number, perInch = 0.001): number {
  requirePositive(journalDiameter, "Journal diameter");
  requirePositive(perInch, "Clearance per inch of diameter");
  return cleanDecimal(journalDiameter * perInch);
}

/**
 * Rule-of-thumb ring end gap: bore × gap per inch of bore (common practice, e.g. about
 * 0.004–0.0045 for a naturally aspirated top ring; the ring maker's chart governs).
 */
export function ringGapRule(bore: number, perInch: number): number {
  requirePositive(bore, "Bore diameter");
  requirePositive(perInch, "Gap per inch of bore");
  return cleanDecimal(bore * perInch);
}
