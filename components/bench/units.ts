import type { MeasureUnit } from "@/lib/domain";

/** A figure as the gauge shows it: inch work to 4 places, metric to 3, torque to 1. */
export function figure(value: number, unit: MeasureUnit): string {
  const places = unit === "in" ? 4 : unit === "mm" ? 3 : 1;
  return value.toFixed(places);
}
