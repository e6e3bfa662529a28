import { lengthWords, shellSetWords, type LengthUnit } from "@/lib/domain";
import type { Clearance, ShellView } from "./bearings";

// Small word helpers of the bearing screens, on top of the core's words.

/** "Series S, main, 0.001 in thinner (extra clearance)" for a stored set. */
export function setName(s: ShellView): string {
  const step = {
    kind: s.step,
    ...(s.stepAmount != null ? { amount: s.stepAmount } : {}),
    ...(s.grade ? { grade: s.grade } : {}),
  };
  return shellSetWords({ series: s.series, role: s.role, step, unit: s.unit });
}

/** "0.0020 in ± 0.0002" (U at k = 2), or a dash. */
export function clearanceWords(c: Clearance | null, unit: LengthUnit): string {
  if (!c) return "—";
  const u = c.uncertainty ? ` ± ${lengthWords(c.uncertainty, unit).split(" ")[0]}` : "";
  return `${lengthWords(c.value, unit)}${u}`;
}

/** Measured minus predicted, signed: "+0.0002 in". */
export function differenceWords(measured: number, predicted: number, unit: LengthUnit): string {
  const d = Number((measured - predicted).toPrecision(12));
  return `${d >= 0 ? "+" : "−"}${lengthWords(Math.abs(d), unit)}`;
}
