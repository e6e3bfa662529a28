import { unit as mathUnit } from "mathjs";
import { describe, expect, it } from "vitest";
import { findLimit, judge, limitsFor, matchStationPattern, resolveLimit } from "../../../lib/domain/limits";
import type { SpecLimit } from "../../../lib/domain/types";

const base = { required: true } as const;
const lim = (l: Partial<SpecLimit>): SpecLimit => ({
  characteristic: "bore_diameter",
  stationPattern: "*",
  limitType: "min_max",
  unit: "in",
  ...base,
  ...l,
});

describe("station patterns", () => {
  it.each([
    ["*", "bore/3/top/A", true],
    ["*", "end-play", true],
    ["bore/*", "bore/3/top/A", true],
    ["bore/*", "bore/3", true],
    ["bore/*", "skirt/3", false],
    ["bore/*/top/*", "bore/3/top/A", true],
    ["bore/*/top/*", "bore/3/mid/A", false],
    ["bore/*/top/*", "bore/3/top", false],
    ["main/3/*", "main/3/front/B", true],
    ["main/3/*", "main/30/front/B", false],
    ["main/3/*", "main-brg/3/front/B", false],
    ["deck/left/front", "deck/left/front", true],
    ["deck/left/front", "deck/left/rear", false],
  ])("%s on %s → %s", (pattern, id, expected) => {
    expect(matchStationPattern(pattern, id)).toBe(expected);
  });
  it("refuses empty patterns and empty segments", () => {
    expect(() => matchStationPattern("", "bore/1/top/A")).toThrow(/cannot be empty/);
    expect(() => matchStationPattern("bore//top", "bore/1/top/A")).toThrow(/empty segment/);
  });
});

describe("findLimit: the most specific match wins", () => {
  const all = lim({ stationPattern: "*", min: 1, max: 2, label: "all" });
  const bores = lim({ stationPattern: "bore/*", min: 1, max: 2, label: "bores" });
  const tops = lim({ stationPattern: "bore/*/top/*", min: 1, max: 2, label: "tops" });
  const cyl3 = lim({ stationPattern: "bore/3/*", min: 1, max: 2, label: "cyl3" });
  const exact = lim({ stationPattern: "bore/3/top/A", min: 1, max: 2, label: "exact" });
  const other = lim({
    characteristic: "piston_skirt_diameter",
    stationPattern: "bore/3/top/A",
    min: 1,
    max: 2,
    label: "skirt",
  });
  const spec = [all, bores, tops, cyl3, exact, other];

  it("an exact id beats every pattern; characteristic must match", () => {
    expect(findLimit(spec, "bore_diameter", "bore/3/top/A")?.label).toBe("exact");
    expect(findLimit(spec, "piston_skirt_diameter", "bore/3/top/A")?.label).toBe("skirt");
  });
  it("more literal segments win, then more segments, then the first listed", () => {
    expect(findLimit(spec, "bore_diameter", "bore/2/top/B")?.label).toBe("tops"); // 2 literals beat 1
    expect(findLimit(spec, "bore_diameter", "bore/3/mid/B")?.label).toBe("cyl3"); // 2 literals
    expect(findLimit([all, tops, cyl3], "bore_diameter", "bore/3/top/B")?.label).toBe("tops"); // 2 literals, 4 segments beat 3
    expect(findLimit([bores, all], "bore_diameter", "bore/1/mid/A")?.label).toBe("bores");
    const twin = lim({ stationPattern: "bore/*", min: 0, max: 9, label: "twin" });
    expect(findLimit([bores, twin], "bore_diameter", "bore/1/mid/A")?.label).toBe("bores");
  });
  it("says nothing when the spec has no limit", () => {
    expect(findLimit(spec, "valve_lash", "lash/1/int")).toBeUndefined();
    expect(findLimit([], "bore_diameter", "bore/1/top/A")).toBeUndefined();
  });
});

describe("resolveLimit: one case per limit type", () => {
  it("min_max passes the limits through (P23 limits, ISO 14253-1 guard-band example)", () => {
    expect(resolveLimit(lim({ min: 2.0978, max: 2.0988 }))).toEqual({ unit: "in", min: 2.0978, max: 2.0988 });
  });
  it("nominal_tol: 50 mm +0.025/−0 is the H7 hole (ISO 286-2:2010, H7 30–50 mm: 0/+25 µm)", () => {
    const r = resolveLimit(lim({ limitType: "nominal_tol", unit: "mm", nominal: 50, tolPlus: 0.025, tolMinus: 0 }));
    expect(r).toEqual({ unit: "mm", nominal: 50, min: 50, max: 50.025 });
  });
  it("nominal_tol: 50 mm −0.009/−0.025 written as a g6 shaft (ISO 286-2:2010, g6 30–50 mm: −9/−25 µm)", () => {
    const r = resolveLimit(lim({ limitType: "nominal_tol", unit: "mm", nominal: 49.991, tolPlus: 0, tolMinus: 0.016 }));
    expect(r.min).toBe(49.975); // exact, not 49.975000000000001
    expect(r.max).toBe(49.991);
  });
  it("max_only and min_only", () => {
    // common practice, from memory: 0.001 in bore taper is a usual service limit
    expect(resolveLimit(lim({ characteristic: "bore_taper", limitType: "max_only", max: 0.001 }))).toEqual({
      unit: "in",
      max: 0.001,
    });
    // P26 ring gap rule 4.030 × 0.0045 = 0.018135 in (common practice) used as a minimum
    expect(resolveLimit(lim({ characteristic: "ring_end_gap", limitType: "min_only", min: 0.018135 }))).toEqual({
      unit: "in",
      min: 0.018135,
    });
  });
  it("per_inch: 0.001 in per inch on a 2.200 in rod journal is 0.0022 in (common practice)", () => {
    const l = lim({
      characteristic: "rod_oil_clearance",
      limitType: "per_inch",
      perInchMin: 0.00075,
      perInchMax: 0.001,
    });
    expect(resolveLimit(l, { diameter: { value: 2.2, unit: "in" } })).toEqual({
      unit: "in",
      min: 0.00165,
      max: 0.0022,
    });
    // P08: 0.001 × 2.0988 = 0.0020988 (common practice)
    expect(resolveLimit(l, { diameter: { value: 2.0988, unit: "in" } }).max).toBe(0.0020988);
  });
  it("per_inch: a journal measured in mm is converted to inches before an inch rule (NIST SP 811 B.8; mathjs)", () => {
    const l = lim({
      characteristic: "rod_oil_clearance",
      limitType: "per_inch",
      perInchMin: 0.00075,
      perInchMax: 0.001,
    });
    const inches = mathUnit(55.88, "mm").toNumber("inch"); // 2.2 in, cross-checked with mathjs
    const r = resolveLimit(l, { diameter: { value: 55.88, unit: "mm" } });
    expect(r.max).toBeCloseTo(0.001 * inches, 12);
    expect(r).toEqual({ unit: "in", min: 0.00165, max: 0.0022 });
    // a metric rule on the same journal: the ratio is the same in mm per mm
    const mm = resolveLimit({ ...l, unit: "mm" }, { diameter: { value: 2.2, unit: "in" } });
    expect(mm).toEqual({ unit: "mm", min: 0.04191, max: 0.05588 });
  });
  it("per_inch with one side only (P26 ring gap rule, 0.0045 in per inch of a 4.030 in bore, common practice)", () => {
    const l = lim({ characteristic: "ring_end_gap", limitType: "per_inch", perInchMin: 0.0045 });
    expect(resolveLimit(l, { diameter: { value: 4.03, unit: "in" } })).toEqual({ unit: "in", min: 0.018135 });
  });
  it("iso286: 50 mm H7 and g6 (ISO 286-1:2010 Table 1, ISO 286-2:2010; check value P25)", () => {
    expect(resolveLimit(lim({ limitType: "iso286", unit: "mm", nominal: 50, isoClass: "H7" }))).toEqual({
      unit: "mm",
      nominal: 50,
      min: 50,
      max: 50.025,
    });
    const g6 = resolveLimit(lim({ limitType: "iso286", unit: "mm", isoClass: "g6" }), {
      nominal: { value: 50, unit: "mm" },
    });
    expect(g6).toEqual({ unit: "mm", nominal: 50, min: 49.975, max: 49.991 });
  });
  it("iso286 on an inch job: 2 in = 50.8 mm falls in 'over 50 up to 80', IT7 = 30 µm (ISO 286-1:2010 Table 1)", () => {
    const r = resolveLimit(lim({ limitType: "iso286", unit: "in", nominal: 2, isoClass: "H7" }));
    expect(r.min).toBe(2);
    expect(r.max).toBeCloseTo(mathUnit(50.83, "mm").toNumber("inch"), 11);
  });
});

describe("resolveLimit says what is missing", () => {
  it.each([
    [lim({ min: 1 }), {}, /has no maximum/],
    [lim({ min: 2, max: 1 }), {}, /swap them/],
    [lim({ limitType: "nominal_tol", nominal: 1, tolPlus: 0.1 }), {}, /minus tolerance/],
    [lim({ limitType: "nominal_tol", nominal: 1, tolPlus: 0.1, tolMinus: -0.1 }), {}, /both ≥ 0/],
    [lim({ limitType: "max_only" }), {}, /has no maximum/],
    [lim({ limitType: "min_only" }), {}, /has no minimum/],
    [lim({ limitType: "per_inch" }), { diameter: { value: 2, unit: "in" } }, /neither perInchMin nor perInchMax/],
    [lim({ limitType: "per_inch", perInchMax: 0.001 }), {}, /needs that diameter/],
    [lim({ limitType: "per_inch", perInchMax: 0.001, unit: "nm" }), {}, /only works for lengths/],
    [lim({ limitType: "iso286", nominal: 50 }), {}, /no tolerance class/],
    [lim({ limitType: "iso286", isoClass: "H7" }), {}, /needs a nominal size/],
    [lim({ limitType: "iso286", unit: "mm", nominal: 50, isoClass: "Q7" }), {}, /Unknown ISO 286 tolerance class/],
    [lim({ limitType: "bogus" as never }), {}, /unknown type/],
    [lim({ unit: "furlong" as never, min: 1, max: 2 }), {}, /unknown unit/],
  ] as const)("%#", (limit, context, message) => {
    expect(() => resolveLimit(limit, context)).toThrow(message);
  });
  it("names the limit by its label", () => {
    expect(() => resolveLimit(lim({ label: "Deck height, street build", min: 1 }))).toThrow(
      /Deck height, street build/,
    );
  });
});

describe("limitsFor and judge", () => {
  it("gives a note, not an exception, when there is no limit or the rule lacks its context", () => {
    expect(limitsFor([], "bore_diameter", "bore/1/top/A").note).toMatch(/no limit/);
    const spec = [lim({ characteristic: "ring_end_gap", limitType: "per_inch", perInchMin: 0.0045 })];
    expect(limitsFor(spec, "ring_end_gap", "ring-gap/1/top").note).toMatch(/needs that diameter/);
  });
  it("judges a mm reading against inch limits in the limits' unit (1 in = 25.4 mm, NIST SP 811 B.8)", () => {
    // P23 limits; 2.0986 in = 53.30444 mm sits on the upper conformance-zone edge with U = 0.0002 in
    const e = judge(53.30444, "mm", 0.00508, { unit: "in", min: 2.0978, max: 2.0988 });
    expect(e).toMatchObject({ verdict: "in_spec", value: 2.0986, unit: "in", uncertainty: 0.0002, deviation: 0.0003 });
    expect(judge(53.30698, "mm", 0.00508, { unit: "in", min: 2.0978, max: 2.0988 }).verdict).toBe("marginal");
  });
  it("refuses to compare a torque with a length limit", () => {
    expect(judge(65, "lbf_ft", undefined, { unit: "in", max: 1 }).note).toMatch(/fix the spec unit/);
  });
});
