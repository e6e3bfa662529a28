import { describe, expect, it } from "vitest";
import {
  consequenceWords,
  isWideChange,
  requiredStationsAffected,
  WIDE_CHANGE_FLAGS,
} from "../../../lib/domain/consequences";

// Rules of this product: the words the lead reads before a limit change, and when it asks again.
describe("consequences of a change", () => {
  it("says what a change does, in words", () => {
    expect(consequenceWords({ flagsOpened: 46, flagsClosed: 2, verdictsChanged: 48, requiredStations: 3 })).toBe(
      "opens 46 flags, closes 2, changes 48 verdicts, affects 3 required stations",
    );
    expect(consequenceWords({ flagsOpened: 0, flagsClosed: 1, verdictsChanged: 1, requiredStations: 0 })).toBe(
      "closes 1 flag, changes 1 verdict",
    );
    expect(consequenceWords({ flagsOpened: 0, flagsClosed: 0, verdictsChanged: 0, requiredStations: 0 })).toBe(
      "changes no verdict and no flag",
    );
  });
  it("asks again above a handful of flags", () => {
    expect(isWideChange({ flagsOpened: WIDE_CHANGE_FLAGS })).toBe(false);
    expect(isWideChange({ flagsOpened: WIDE_CHANGE_FLAGS + 1 })).toBe(true);
  });
  it("counts required stations that change: required-ness either way, or a required station's verdict", () => {
    const before = new Set(["a", "b", "c"]);
    const after = new Set(["b", "c", "d"]);
    // a no longer required, d newly required, c's verdict moved; x moved but is not required.
    expect(requiredStationsAffected(before, after, ["c", "x"])).toBe(3);
    expect(requiredStationsAffected(before, before, [])).toBe(0);
  });
});
