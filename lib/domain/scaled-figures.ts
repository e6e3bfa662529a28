// Fast exact paths for the decimal maths of verdict.ts and units.ts. Both take each figure as it
// reads to 12 significant digits (toPrecision(12)) and work on that exact decimal (decimal.js-light):
// a text round trip per figure, a third of the job page's CPU. Shop figures are short decimals, and
// for those integers give the very same results far faster; anything else takes the decimal path.
//
// Why the integer path is exact (R is x to 12 significant digits, the decimal the slow path uses):
// - scaledFigure(x, k) returns an integer r with |r| < 1e12 only when |x·10^k − r| < 0.5e-12·|x·10^k|.
//   Then R = r·10^-k: r·10^-k has at most 12 significant digits, and x lies closer to it than half the
//   spacing of 12-digit decimals around x (that spacing exceeds 1e-12·|x|), so no other 12-digit
//   decimal is as near. The double product x·10^k is off by at most 2^-53 of itself, far inside the
//   margin checked (1e-13), and 10^k is exact in a double for k ≤ 22.
// - Sums and differences of such integers stay below 2^53, so they are exact integers.
// - An exact integer divided by an exact 10^k (or 2·10^k) is the correctly rounded double of the
//   exact quotient (IEEE 754 division), which is what Decimal's toNumber gives for the same decimal
//   (it parses its own exact text, and parsing rounds correctly).
// - Decimal never yields −0; the integers here are kept +0 (r + 0) so no −0 appears either.

/** 10^k for k = 0 … 22, each exact (parsed, so correctly rounded, and representable). */
export const POW10: readonly number[] = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

const LARGEST_SCALED = 1e12; // 12 significant digits at most
const MARGIN = 1e-13; // far inside the 0.5e-12 a figure may lie from its 12-digit decimal

/**
 * Decimal places (at most 22) at which a figure of size `size` keeps at most 12 significant
 * digits; −1 when it has none to spare (size ≥ 1e12, or not finite). A place too many or too few
 * near a power of ten is harmless: scaledFigure then refuses, and the decimal path answers.
 */
export function placesFor(size: number): number {
  if (size === 0) return 22;
  if (!(size < LARGEST_SCALED)) return -1;
  const k = 11 - Math.floor(Math.log10(size));
  return k > 22 ? 22 : k;
}

/** x to 12 significant digits as a count of 10^-k (an exact integer), or NaN when it is not one. */
export function scaledFigure(x: number, k: number): number {
  const m = x * POW10[k];
  const r = Math.round(m);
  return Math.abs(r) < LARGEST_SCALED && Math.abs(m - r) <= MARGIN * Math.abs(m) ? r + 0 : NaN;
}

/** The common places for figures whose largest size is `size`, or −1 (see placesFor). */
export function placesForAll(...xs: number[]): number {
  let size = 0;
  for (const x of xs) size = Math.max(size, Math.abs(x));
  return placesFor(size);
}

/** A non-negative integer n divided by an integer d ≥ 1, rounded to an integer, a half upwards. */
export function divideHalfUp(n: number, d: number): number {
  let q = Math.floor(n / d);
  let rest = n - q * d;
  // n and d are exact integers below 2^53, so q·d and the rest are exact; a quotient rounded up
  // across an integer by the division shows as a negative rest and is put back.
  if (rest < 0) {
    q -= 1;
    rest += d;
  }
  return 2 * rest >= d ? q + 1 : q;
}

/** A finite number (the fast paths only take these; anything else goes the checked decimal way). */
export function isFiniteNumber(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x);
}
