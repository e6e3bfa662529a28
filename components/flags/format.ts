import { formatDeviation, unitWords, type MeasureUnit } from "@/lib/domain";

// How figures read on the desk: inch work to the tenth (0.0001 in), metric to the µm, torque
// to the unit; one more digit only when the figure has it (a gauge reading 0.00005 in).
const DIGITS: Record<string, [number, number]> = { in: [4, 5], mm: [3, 4], lbf_ft: [0, 1], nm: [0, 1] };

export function figure(x: number | null | undefined, unit: string): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "—";
  const [min, max] = DIGITS[unit] ?? [3, 6];
  const long = x.toFixed(max);
  const short = x.toFixed(min);
  return Number(short) === Number(long) ? short : long.replace(/0+$/, "");
}

export const withUnit = (x: number | null | undefined, unit: string) =>
  x === null || x === undefined ? "—" : `${figure(x, unit)} ${unitWords(unit)}`;

export function limitsText(min: number | null, max: number | null, unit: string): string {
  const u = unitWords(unit);
  if (min !== null && max !== null) return `${figure(min, unit)} – ${figure(max, unit)} ${u}`;
  if (max !== null) return `at most ${figure(max, unit)} ${u}`;
  if (min !== null) return `at least ${figure(min, unit)} ${u}`;
  return "no limit";
}

export function deviationText(dev: number | null, unit: string): string {
  if (dev === null) return "—";
  try {
    return formatDeviation(dev, unit as MeasureUnit);
  } catch {
    return figure(dev, unit);
  }
}

/** How far outside (or how close inside) the nearer limit, signed: + beyond max, − below min. */
export function beyondLimit(value: number, min: number | null, max: number | null): number | null {
  if (max !== null && value > max) return value - max;
  if (min !== null && value < min) return value - min;
  return null;
}

export function age(iso: string, now = Date.now()): string {
  const minutes = Math.max(0, Math.round((now - Date.parse(iso)) / 60_000));
  if (minutes < 1) return "under 1 min";
  if (minutes < 60) return `${minutes} min`;
  const hours = Math.round(minutes / 60);
  if (hours < 48) return `${hours} h`;
  return `${Math.round(hours / 24)} days`;
}

export const when = (iso: string | null) =>
  iso
    ? new Date(iso).toLocaleString("en-GB", {
        day: "numeric",
        month: "short",
        year: "numeric",
        hour: "2-digit",
        minute: "2-digit",
      })
    : "—";
