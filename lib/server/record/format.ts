import "server-only";
// How the build record writes figures. Plain ASCII signs and words ("to", "max", "-") so the
// text survives any PDF font and any mail client; the unit is always written out.
import { unitWords, type MeasureUnit } from "@/lib/domain";

// Fewest decimals shown: a tenth (0.0001 in) for inch lengths, a micrometre for mm.
const MIN_DECIMALS: Record<string, number> = { in: 4, mm: 3, lbf_ft: 0, nm: 0, cc: 1 };

/** A figure with at least its unit's usual decimals and at most six, trailing zeros trimmed past those. */
export function num(x: number | null | undefined, unit: string): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "";
  const min = MIN_DECIMALS[unit] ?? 2;
  let s = x.toFixed(6);
  while (s.includes(".") && s.endsWith("0") && s.split(".")[1].length > min) s = s.slice(0, -1);
  if (s.endsWith(".")) s = s.slice(0, -1);
  return s === "-0" || /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

export function withUnit(x: number | null | undefined, unit: string): string {
  const n = num(x, unit);
  return n ? `${n} ${unitWords(unit)}` : "";
}

export function signed(x: number | null | undefined, unit: string): string {
  const n = num(x, unit);
  if (!n) return "";
  return x! > 0 && !/^0\.?0*$/.test(n) ? `+${n}` : n;
}

export function limitsText(
  min: number | null | undefined,
  max: number | null | undefined,
  unit: MeasureUnit | string,
): string {
  const lo = num(min, unit);
  const hi = num(max, unit);
  if (lo && hi) return `${lo} to ${hi} ${unitWords(unit)}`;
  if (hi) return `max ${hi} ${unitWords(unit)}`;
  if (lo) return `min ${lo} ${unitWords(unit)}`;
  return "no limit";
}

/** "2026-12-01 14:05 UTC": one clock for everyone who reads the record. */
export function when(d: Date | string | null | undefined): string {
  if (!d) return "";
  const date = d instanceof Date ? d : new Date(d);
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** "2026-12-01 14:05" for table cells whose header says UTC. */
export function stamp(d: Date | string | null | undefined): string {
  return when(d).replace(" UTC", "");
}

export function day(d: Date | string | null | undefined): string {
  return d ? (d instanceof Date ? d : new Date(d)).toISOString().slice(0, 10) : "";
}

export const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
