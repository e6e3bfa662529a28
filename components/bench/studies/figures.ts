/** Places a gauge shows: those of its resolution (0.0001 → 4), so a figure reads as the gauge shows it. */
export function gaugePlaces(resolution: number): number {
  const text = String(resolution);
  const exp = /e-(\d+)$/.exec(text);
  if (exp) return Number(exp[1]);
  return text.includes(".") ? text.split(".")[1].length : 0;
}

export const gaugeFigure = (value: number, resolution: number, extra = 0) =>
  value.toFixed(Math.min(gaugePlaces(resolution) + extra, 10));
