import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { backoffDelay } from "@/lib/offline/backoff";

// "Equal jitter": half the exponential delay fixed, half random (AWS Architecture Blog,
// "Exponential Backoff And Jitter", 2015; from memory). Common practice for retrying clients.
const rule = { baseMs: 2_000, maxMs: 300_000 };

describe("retry delay", () => {
  it("doubles per failure from the base, within [nominal/2, nominal]", () => {
    expect(backoffDelay(1, rule, () => 0)).toBe(1_000);
    expect(backoffDelay(1, rule, () => 1)).toBe(2_000);
    expect(backoffDelay(2, rule, () => 1)).toBe(4_000);
    expect(backoffDelay(4, rule, () => 0.5)).toBe(12_000);
  });
  it("is capped at the maximum, and zero before any failure", () => {
    expect(backoffDelay(40, rule, () => 1)).toBe(300_000);
    expect(backoffDelay(40, rule, () => 0)).toBe(150_000);
    expect(backoffDelay(0, rule)).toBe(0);
  });
  it("always lies in [nominal/2, nominal] (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 60 }), fc.double({ min: 0, max: 1, noNaN: true }), (f, r) => {
        const nominal = Math.min(rule.maxMs, rule.baseMs * 2 ** (f - 1));
        const d = backoffDelay(f, rule, () => r);
        expect(d).toBeGreaterThanOrEqual(Math.floor(nominal / 2));
        expect(d).toBeLessThanOrEqual(nominal);
      }),
    );
  });
});
