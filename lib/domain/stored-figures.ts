import Decimal from "decimal.js-light";

// How much of a figure the database keeps: a DECIMAL(digits, places) column holds `places` decimal
// places and fewer than 10^(digits − places) before the point. A figure is refused, in words, when
// it carries more than its column keeps, rather than rounded silently: what a tablet sends is then
// stored exactly, and a resent reading compares equal to its stored copy. The tablet asks the same
// rule as the figure is typed, so it never queues a reading the server would refuse for this.

export type ColumnPrecision = { digits: number; places: number };

/** The reading figures and their columns (migrations/20261201000700-create-readings.ts). */
export const READING_PRECISION = {
  value: { digits: 14, places: 6 },
  dialSetting: { digits: 14, places: 6 },
  dialDeviation: { digits: 14, places: 6 },
  partTempC: { digits: 6, places: 2 },
  gaugeTempC: { digits: 6, places: 2 },
} as const satisfies Record<string, ColumnPrecision>;

/** Decimal places of a number as JavaScript writes it shortest (1e-7 has 7, 20.120 has 2). */
export function decimalPlaces(x: number): number {
  return new Decimal(x).decimalPlaces();
}

// Every figure of every reading is checked against its column's limit: worked out once per column.
const limits = new Map<string, number>();

/** The largest figure the column holds, e.g. 99999999.999999 for DECIMAL(14,6). */
export function columnLimit(p: ColumnPrecision): number {
  const key = `${p.digits},${p.places}`;
  let limit = limits.get(key);
  if (limit === undefined) {
    limit = new Decimal(10)
      .pow(p.digits - p.places)
      .minus(new Decimal(10).pow(-p.places))
      .toNumber();
    limits.set(key, limit);
  }
  return limit;
}

/**
 * `x` as the column keeps it: rounded to its places, a half away from zero, as MariaDB rounds a
 * decimal figure it is given. Two figures are the same stored figure when these are equal.
 */
export function columnFigure(x: number, p: ColumnPrecision): number {
  const kept = new Decimal(x).toDecimalPlaces(p.places, Decimal.ROUND_HALF_UP).toNumber();
  return kept === 0 ? 0 : kept;
}

/**
 * Why `x` cannot be stored in a column of precision `p`, in words naming `what`
 * ("Part temperature keeps 2 decimal places: 20.123 has 3"), or undefined when it is kept exactly.
 */
export function storedFigureProblem(x: number, p: ColumnPrecision, what: string): string | undefined {
  if (!Number.isFinite(x)) return `${what} must be a number`;
  const limit = columnLimit(p);
  if (Math.abs(x) > limit) return `${what} must lie between -${limit} and ${limit}; ${x} cannot be right, check it`;
  const places = decimalPlaces(x);
  if (places > p.places)
    return `${what} keeps ${p.places} decimal places: ${x} has ${places}; round it to ${p.places} places`;
  return undefined;
}
