// Input checks shared by the formulas: each names the input and says what it must be.
export function requireFinite(value: number, name: string): void {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new Error(`${name} must be a number; got ${String(value)}`);
  }
}

export function requirePositive(value: number, name: string): void {
  requireFinite(value, name);
  if (value <= 0) throw new Error(`${name} must be greater than zero; got ${value}`);
}
