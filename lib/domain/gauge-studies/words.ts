// How a study's figures are written in its words: indices to two places, measured figures to
// four significant digits (the unit is the gauge's and is named by the screen that shows them).

export function indexFigure(x: number): string {
  return x.toFixed(2);
}

export function measureFigure(x: number): string {
  if (x === 0) return "0";
  return String(Number(x.toPrecision(4)));
}

export function percentFigure(x: number): string {
  return `${Number(x.toPrecision(3))} %`;
}
