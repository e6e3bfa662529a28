// Dial bore gauge arithmetic. The gauge is zeroed on a setting size (a ring or a micrometer set to
// the nominal), then each bore is read as the dial's deviation from that zero. On most dial bore
// gauges the needle swings plus when the bore is SMALLER than the setting (the plunger is pushed in
// further), so diameter = setting − reading; some gauges are built or set up the other way round.
// The convention is a per-gauge setting (Instrument.dialPlusMeansSmaller), never a guess.
// Common practice, from memory; the gauge maker's instructions decide for a given gauge.
import { decimalDifference, decimalSum } from "./units";

export interface DialInput {
  /** The size the gauge was zeroed on, in the reading's unit. */
  setting: number;
  /** The dial's reading (signed), same unit. */
  deviation: number;
  /** True when a plus reading means a smaller bore (the common convention). */
  plusMeansSmaller: boolean;
}

/** The diameter a dial reading stands for, exact on the decimal figures as written. */
export function dialDiameter({ setting, deviation, plusMeansSmaller }: DialInput): number {
  if (typeof setting !== "number" || !Number.isFinite(setting) || setting <= 0) {
    throw new Error(`The setting size must be a number above zero; got ${String(setting)}`);
  }
  if (typeof deviation !== "number" || !Number.isFinite(deviation)) {
    throw new Error(`The dial reading must be a number; got ${String(deviation)}`);
  }
  const d = plusMeansSmaller ? decimalDifference(setting, deviation) : decimalSum([setting, deviation]);
  if (d <= 0)
    throw new Error(`A setting of ${setting} and a dial reading of ${deviation} give no diameter; check both`);
  return d;
}
