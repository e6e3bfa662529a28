import type { MeasureUnit } from "@/lib/domain";

export const UNIT_WORDS: Record<MeasureUnit, string> = { in: "in", mm: "mm", lbf_ft: "lbf·ft", nm: "N·m" };

/** A figure as the gauge shows it: inch work to 4 places, metric to 3, torque to 1. */
export function figure(value: number, unit: MeasureUnit): string {
  const places = unit === "in" ? 4 : unit === "mm" ? 3 : 1;
  return value.toFixed(places);
}
