// Measurement uncertainty after JCGM 100:2008 (the GUM). Components are combined in quadrature
// (eq. 10, sensitivity coefficients 1): calibration U/k (7.2.3 / 4.3.3), resolution δ/√12
// (F.2.2.1, rectangular distribution of half-width δ/2) and repeatability s/√n (4.2.3).

function requireNonNegative(value: number, name: string): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0) {
    throw new Error(`${name} must be a number of zero or more; got ${String(value)}`);
  }
}

export interface ReadingUncertaintyInput {
  /** Expanded uncertainty from the gauge's calibration certificate. */
  calibrationU: number;
  /** Coverage factor of the certificate and of the returned U (default 2, about 95 %). */
  k?: number;
  /** Smallest step the gauge displays. */
  resolution: number;
  /** Standard deviation of repeated readings. */
  repeatSd?: number;
  /** Number of readings averaged (default 1: a single reading). */
  repeatN?: number;
}

export interface ReadingUncertaintyResult {
  uc: number;
  U: number;
  uCal: number;
  uRes: number;
  uRep: number;
}

/** Combined standard uncertainty uc and expanded uncertainty U = k·uc of one reading. */
export function readingUncertainty(input: ReadingUncertaintyInput): ReadingUncertaintyResult {
  const { calibrationU, k = 2, resolution, repeatSd = 0, repeatN = 1 } = input;
  requireNonNegative(calibrationU, "Calibration uncertainty U");
  if (typeof k !== "number" || !Number.isFinite(k) || k <= 0) {
    throw new Error(`Coverage factor k must be greater than zero; got ${String(k)}`);
  }
  requireNonNegative(resolution, "Resolution");
  requireNonNegative(repeatSd, "Repeatability standard deviation");
  if (!Number.isInteger(repeatN) || repeatN < 1) {
    throw new Error(`Number of repeat readings must be a whole number of 1 or more; got ${String(repeatN)}`);
  }
  const uCal = calibrationU / k;
  const uRes = resolution / Math.sqrt(12);
  const uRep = repeatSd / Math.sqrt(repeatN);
  const uc = Math.sqrt(uCal * uCal + uRes * uRes + uRep * uRep);
  return { uc, U: k * uc, uCal, uRes, uRep };
}

export interface ClearanceUncertaintyInput {
  uBore: number;
  uJournal: number;
  /** Standard uncertainty contained in both readings (same setting master, same gauge). */
  uShared?: number;
}

/**
 * Standard uncertainty of a difference of two readings (e.g. bore − journal). A component common
 * to both is fully correlated and cancels (GUM 5.2.2, eq. 16 with r = 1, c = ±1):
 * u² = uBore² + uJournal² − 2·uShared².
 */
export function clearanceUncertainty(input: ClearanceUncertaintyInput): number {
  const { uBore, uJournal, uShared = 0 } = input;
  requireNonNegative(uBore, "Bore uncertainty");
  requireNonNegative(uJournal, "Journal uncertainty");
  requireNonNegative(uShared, "Shared uncertainty");
  const sumSquares = uBore * uBore + uJournal * uJournal;
  const radicand = sumSquares - 2 * uShared * uShared;
  // Allow float rounding when the shared part is the whole of both; anything more is an input error.
  if (radicand < -1e-12 * sumSquares) {
    throw new Error(
      "Shared uncertainty is larger than the readings' own uncertainties allow " +
        "(uBore² + uJournal² − 2·uShared² < 0); the shared part must be contained in both",
    );
  }
  return Math.sqrt(Math.max(0, radicand));
}
