import { describe, expect, it } from "vitest";
import type { BenchInstrument } from "@/lib/schemas/sync";
import { buildReading, cleanTyped, dialGroup, parseEntry } from "@/lib/offline/entry";
import { makePack } from "./fake-server";

const pack = makePack(1);
const station = (id: string) => pack.route.sections.flatMap((s) => s.stations).find((s) => s.id === id)!;
const dialGauge: BenchInstrument = {
  id: 3,
  kind: "bore_gauge_dial",
  label: "Dial bore gauge",
  serial: "X",
  unit: "in",
  resolution: 0.0001,
  expandedU: 0.00015,
  coverageK: 2,
  calibrationDue: null,
  dialPlusMeansSmaller: true,
  active: true,
};
const boreGauge: BenchInstrument = { ...dialGauge, id: 4, kind: "bore_gauge_digital", label: "Digital bore gauge" };
const wrench: BenchInstrument = { ...dialGauge, id: 5, kind: "torque_wrench", label: "Torque wrench", unit: "lbf_ft" };

describe("typed entries", () => {
  it("takes what gauges and keypads type, a comma as the decimal point", () => {
    expect(parseEntry("4.0302")).toEqual({ value: 4.0302 });
    expect(parseEntry("4,0302")).toEqual({ value: 4.0302 });
    expect(parseEntry("-.0002")).toEqual({ value: -0.0002 });
    expect(parseEntry("+0.0003\r")).toEqual({ value: 0.0003 });
    expect(cleanTyped("4.03 in")).toBe("4.03");
  });
  it("says what to fix", () => {
    expect(parseEntry("")).toEqual({ error: "Type the value first" });
    expect(parseEntry("4..03")).toEqual({ error: "'4..03' is not a number; type the value like 4.0302" });
    expect(parseEntry(".")).toHaveProperty("error");
    // The server keeps 6 decimal places of a value, a setting size and a dial reading (DECIMAL(14,6)):
    // the tablet refuses more as it is typed, with the server's words, so it never queues a refusal.
    expect(parseEntry("104.0180005")).toEqual({
      error: "The value keeps 6 decimal places: 104.0180005 has 7; round it to 6 places",
    });
    expect(parseEntry("104.018001")).toEqual({ value: 104.018001 });
    expect(parseEntry("100000000", "the dial reading")).toEqual({
      error:
        "The dial reading must lie between -99999999.999999 and 99999999.999999; 100000000 cannot be right, check it",
    });
  });
});

describe("building a reading", () => {
  it("direct entry, checked for physical sense (a slipped decimal point)", () => {
    expect(buildReading("4.0302", { pack, station: station("bore/1/top/A"), instrument: boreGauge })).toEqual({
      reading: { jobId: 1, stationId: "bore/1/top/A", value: 4.0302, unit: "in", entryMode: "direct", instrumentId: 4 },
    });
    const slip = buildReading("40.302", { pack, station: station("bore/1/top/A") });
    expect("error" in slip && slip.error).toMatch(/Check the decimal point/);
  });
  it("dial mode: the diameter from the setting size and the gauge's sign convention", () => {
    const built = buildReading("-2", {
      pack,
      station: station("bore/1/top/A"),
      instrument: dialGauge,
      dialSetting: 4.03,
    });
    expect("error" in built).toBe(true); // -2 in from a 4.03 setting is no bore
    const ok = buildReading("-0.0002", {
      pack,
      station: station("bore/1/top/A"),
      instrument: dialGauge,
      dialSetting: 4.03,
    });
    expect(ok).toEqual({
      reading: {
        jobId: 1,
        stationId: "bore/1/top/A",
        value: 4.0302,
        unit: "in",
        entryMode: "dial",
        dialSetting: 4.03,
        dialDeviation: -0.0002,
        instrumentId: 3,
      },
    });
    const larger = buildReading("-0.0002", {
      pack,
      station: station("bore/1/top/A"),
      instrument: { ...dialGauge, dialPlusMeansSmaller: false },
      dialSetting: 4.03,
    });
    expect("reading" in larger && larger.reading.value).toBe(4.0298);
  });
  it("torque needs the lubricant", () => {
    const t = station("torque/main-caps");
    expect(buildReading("72", { pack, station: t, instrument: wrench })).toEqual({
      error: "Pick the lubricant used on the threads before saving the torque",
    });
    const ok = buildReading("72", { pack, station: t, instrument: wrench, lubricant: "moly-paste", supersedes: "abc" });
    expect("reading" in ok && ok.reading).toMatchObject({
      value: 72,
      unit: "lbf_ft",
      lubricant: "moly-paste",
      supersedes: "abc",
    });
  });
  it("refuses before storing a gauge whose range does not hold the value, or none, and says which to pick", () => {
    // Invented test wrenches: 20–150 lbf·ft and 100–600 lbf·ft (common sizes, common practice).
    const small = { ...wrench, label: "Click wrench", serial: "TW-1", rangeMin: 20, rangeMax: 150 };
    const big = { ...wrench, id: 6, label: "Big wrench", serial: "TW-2", rangeMin: 100, rangeMax: 600 };
    const t = station("torque/main-caps");
    const ctx = { pack: { ...pack, instruments: [small, big] }, station: t, lubricant: "engine-oil" as const };
    expect(buildReading("210", { ...ctx, instrument: small })).toEqual({
      error:
        "'Click wrench' (TW-1) reads 20–150 lbf·ft; 210 lbf·ft is outside its range. " +
        "Pick a torque wrench whose range holds 210 lbf·ft: 'Big wrench' (TW-2) 100–600 lbf·ft",
    });
    expect(buildReading("210", { ...ctx, instrument: big })).toHaveProperty("reading.instrumentId", 6);
    expect(buildReading("4.0302", { pack: { ...pack, instruments: [] }, station: station("bore/1/top/A") })).toEqual({
      error:
        "No gauge is named for this reading. Pick a dial bore gauge or bore gauge whose range holds 4.0302 in: " +
        "none on file holds it, so ask the admin to register one under Gauges",
    });
  });
  it("groups dial-mode setting sizes by section, only where a dial bore gauge is the usual gauge", () => {
    expect(dialGroup(station("bore/1/top/A"))).toBe("bore");
    expect(dialGroup(station("main-brg/1/front/A"))).toBe("main-brg");
    expect(dialGroup(station("rod-brg/1/rear/B"))).toBe("rod-brg");
    expect(dialGroup(station("main/1/front/A"))).toBeUndefined();
    expect(dialGroup(station("deck/block/front"))).toBeUndefined();
  });
});
