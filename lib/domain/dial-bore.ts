// Dial bore gauge arithmetic. The gauge is zeroed on a setting size (a ring, a setting master or
// a micrometer locked at size) and then reads how far a bore departs from that size. On most
// dial bore gauges a plus reading means the plunger went in, i.e. a SMALLER bore; some gauges
// (and most digital heads) read plus for larger. The convention is a per-gauge setting, so the
// sign is always explicit here and the tablet shows which way it runs.
import { decimalSum } from "./units";

function requireFinite(value: number, name: string): void {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new Error(`${name} must be a number; got ${String(value)}`);
  }
}

/**
 * The bore diameter from the setting size and the dial's reading, both in one length unit.
 * plusMeansSmaller = true: diameter = setting − dial; false: diameter = setting + dial.
 * Exact on the decimal figures (4.0300 − (−0.0002) is exactly 4.0302).
 */
export function dialBoreDiameter(setting: number, dialReading: number, plusMeansSmaller: boolean): number {
  requireFinite(setting, "Setting size");
  requireFinite(dialReading, "Dial reading");
  if (setting <= 0) throw new Error(`Setting size must be greater than zero; got ${setting}`);
  if (typeof plusMeansSmaller !== "boolean") throw new Error("Say which way the gauge reads: plus means smaller, or plus means larger");
  const diameter = decimalSum([setting, plusMeansSmaller ? -dialReading : dialReading]);
  if (diameter <= 0) throw new Error(`Setting ${setting} with dial ${dialReading} gives no bore; check the setting size and the sign`);
  return diameter;
}

/** The dial reading that a bore of `diameter` would show on a gauge zeroed at `setting` (the inverse). */
export function dialReadingFor(setting: number, diameter: number, plusMeansSmaller: boolean): number {
  requireFinite(setting, "Setting size");
  requireFinite(diameter, "Diameter");
  const over = decimalSum([diameter, -setting]);
  return plusMeansSmaller ? decimalSum([-over]) : over;
}
