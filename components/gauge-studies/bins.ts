// How the study charts group and bound their figures. Display only: the statistics themselves are the
// core's (lib/domain/gauge-studies).

export interface HistogramBin {
  /** Lower edge (inclusive) and upper edge (exclusive, inclusive for the last bin). */
  from: number;
  to: number;
  centre: number;
  count: number;
}

const clean = (x: number) => Number(x.toPrecision(12));

/** About √n bins (5 to 12), the usual choice for a few dozen readings (common practice). */
function wantedBins(n: number): number {
  return Math.min(12, Math.max(5, Math.round(Math.sqrt(n))));
}

/** Whole gauge steps per bin, 1, 2 or 5 × 10ⁿ, giving the count of bins nearest the wanted one (at most 12). */
function stepsPerBin(stepsAcross: number, want: number): number {
  const choices = [1, 2, 5].flatMap((m) => [1, 10, 100, 1000, 10_000].map((p) => m * p)).sort((a, b) => a - b);
  const fits = choices.filter((c) => Math.ceil(stepsAcross / c) + 1 <= 12);
  const pool = fits.length ? fits : [choices[choices.length - 1]];
  return pool.reduce((best, c) => (Math.abs(stepsAcross / c - want) < Math.abs(stepsAcross / best - want) ? c : best));
}

/**
 * Bins whose width is a whole number of gauge steps (1, 2 or 5 × 10ⁿ of them) and whose edges sit half a
 * step off the reference, so a reading on the gauge's grid never lands on an edge and every bin holds the
 * same number of possible readings. Without a resolution the span is cut into even bins.
 */
export function histogramBins(
  readings: readonly number[],
  { resolution, reference }: { resolution: number | null; reference: number },
): HistogramBin[] {
  const xs = readings.filter(Number.isFinite);
  if (!xs.length) return [];
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  const step = resolution && resolution > 0 ? resolution : null;
  const want = wantedBins(xs.length);
  let width: number;
  let origin: number;
  if (step) {
    width = stepsPerBin(Math.round((hi - lo) / step) + 1, want) * step;
    origin = reference - step / 2;
  } else {
    width = hi > lo ? (hi - lo) / want : Math.max(Math.abs(hi) * 1e-4, 1e-4);
    origin = lo - (hi > lo ? 0 : width / 2);
  }
  // A tiny allowance so float noise on the grid never moves a reading across an edge.
  const at = (x: number) => Math.floor((x - origin) / width + 1e-9);
  const first = at(lo);
  const last = Math.max(first, at(hi));
  const bins: HistogramBin[] = [];
  for (let k = first; k <= last; k++) {
    const from = clean(origin + k * width);
    const to = clean(origin + (k + 1) * width);
    bins.push({ from, to, centre: clean((from + to) / 2), count: 0 });
  }
  for (const x of xs) bins[Math.min(bins.length - 1, Math.max(0, at(x) - first))].count++;
  return bins;
}

/** Expected readings in a bin of a normal curve with this mean and s (for the curve over the bars). */
export function expectedCount(bin: HistogramBin, n: number, mean: number, sd: number): number {
  if (!(sd > 0)) return 0;
  return n * (normalCdf((bin.to - mean) / sd) - normalCdf((bin.from - mean) / sd));
}

// Abramowitz and Stegun 7.1.26 for erf (error below 1.5e-7), ample for the height of a drawn curve.
function normalCdf(z: number): number {
  const x = Math.abs(z) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * x);
  const poly = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))));
  const erf = 1 - poly * Math.exp(-x * x);
  return z >= 0 ? (1 + erf) / 2 : (1 - erf) / 2;
}

/** The characteristic with the smallest tolerance: the one the run chart's ±0.1·T band is drawn for. */
export function tightest<T extends { tolerance: number }>(characteristics: readonly T[]): T | undefined {
  return characteristics
    .filter((c) => Number.isFinite(c.tolerance) && c.tolerance > 0)
    .reduce<T | undefined>((best, c) => (best === undefined || c.tolerance < best.tolerance ? c : best), undefined);
}
