// Builders for bearing selection tests: a shelf of sets and measured journals with short names.
import type { BearingJournal, BearingRole, ClearanceWindow, LengthUnit, ShellSet, ShellStep } from "@/lib/domain";

export function shellSet(
  id: string,
  step: ShellStep,
  onHand: number,
  more: Partial<ShellSet> & { thickness?: number } = {},
): ShellSet {
  const { thickness, ...rest } = more;
  return {
    id,
    series: "A",
    role: "rod",
    step,
    ...(thickness !== undefined ? { wall: { source: "nominal", thickness } } : {}),
    onHand: { upper: onHand, lower: onHand },
    unit: "in",
    ...rest,
  };
}

export function journal(
  key: string,
  diameter: number | number[],
  housingBore: number,
  more: Partial<BearingJournal> = {},
): BearingJournal {
  return {
    key,
    role: "rod" as BearingRole,
    diameters: Array.isArray(diameter) ? diameter : [diameter],
    journalU: 0,
    housingBore,
    housingU: 0,
    unit: "in" as LengthUnit,
    ...more,
  };
}

export const window = (min: number, max: number, target: number, unit: LengthUnit = "in"): ClearanceWindow => ({
  min,
  max,
  target,
  unit,
});
