// Retry timing after a network error or a 5xx: exponential, capped, with "equal jitter" (half
// the delay fixed, half random) so a shop full of tablets coming back online does not retry in
// step, and no retry ever comes sooner than half the nominal delay.
export interface BackoffRule {
  baseMs: number;
  maxMs: number;
}

export const DEFAULT_BACKOFF: BackoffRule = { baseMs: 2_000, maxMs: 5 * 60_000 };

/** Delay before attempt `failures + 1`, given `failures` failures in a row (≥ 1). */
export function backoffDelay(
  failures: number,
  rule: BackoffRule = DEFAULT_BACKOFF,
  random: () => number = Math.random,
): number {
  if (failures < 1) return 0;
  const nominal = Math.min(rule.maxMs, rule.baseMs * 2 ** Math.min(failures - 1, 30));
  return Math.round(nominal / 2 + random() * (nominal / 2));
}
