// A gauge's expanded uncertainty restated at k = 2, the coverage factor the verdict's guard band
// uses. A certificate states U = k·uc at its own k (JCGM 100:2008, 6.2.1 and 6.3); the standard
// uncertainty uc = U/k is what carries over, so U at k = 2 is 2·U/k.
export function uncertaintyAtK2(expandedU: number, coverageK = 2): number {
  if (typeof expandedU !== "number" || !Number.isFinite(expandedU) || expandedU < 0) {
    throw new Error(`The gauge's expanded uncertainty U must be zero or more; got ${String(expandedU)}`);
  }
  if (typeof coverageK !== "number" || !Number.isFinite(coverageK) || coverageK <= 0) {
    throw new Error(`The coverage factor k must be greater than zero; got ${String(coverageK)}`);
  }
  return coverageK === 2 ? expandedU : (2 * expandedU) / coverageK;
}
