import { describe, expect, it } from "vitest";
import {
  CHARACTERISTICS,
  GAUGE_KINDS,
  INSTRUMENT_KINDS,
  USUAL_GAUGES,
  defaultGauge,
  gaugeRank,
  gaugeSuits,
  gaugesFor,
  isDialBoreGauge,
  takesDialBoreGauge,
  usualGaugeKind,
  type RawCharacteristic,
} from "../../../lib/domain";

// Which gauge measures what is shop practice (common practice, from memory): a journal or a skirt
// with an outside micrometer; a bore with a bore gauge, dial or digital, or an inside micrometer; a
// deck height with a deck gauge or a depth micrometer; gaps with feelers; end play with a dial
// indicator or feelers; bolt stretch with a stretch gauge; torque with a torque wrench.
type G = { id: number; kind: string; label: string; unit: string; active: boolean };
let next = 1;
const gauge = (kind: keyof typeof INSTRUMENT_KINDS, over: Partial<G> = {}): G => ({
  id: next++,
  kind,
  label: INSTRUMENT_KINDS[kind].label,
  unit: INSTRUMENT_KINDS[kind].quantity === "torque" ? "lbf_ft" : "in",
  active: true,
  ...over,
});
const depthMic = gauge("depth_mic");
const insideMic = gauge("inside_mic");
const outsideMic = gauge("outside_mic");
const dialBore = gauge("bore_gauge_dial");
const digitalBore = gauge("bore_gauge_digital");
const deckGauge = gauge("deck_gauge");
const wrench = gauge("torque_wrench");
const everyGauge = [depthMic, insideMic, outsideMic, dialBore, digitalBore, deckGauge, wrench];

describe("the table of which gauge suits which characteristic", () => {
  it("names a usual gauge kind for every raw characteristic and none for a computed one", () => {
    for (const c of Object.values(CHARACTERISTICS)) {
      if (c.derived) expect(usualGaugeKind(c.id)).toBeUndefined();
      else expect(GAUGE_KINDS).toContain(usualGaugeKind(c.id));
    }
    expect(Object.keys(USUAL_GAUGES).sort()).toEqual(
      Object.values(CHARACTERISTICS)
        .filter((c) => !c.derived)
        .map((c) => c.id)
        .sort(),
    );
  });
  it("maps every instrument kind to a gauge kind a spec sheet can name", () => {
    for (const k of Object.values(INSTRUMENT_KINDS)) expect(GAUGE_KINDS).toContain(k.gaugeKind);
  });
  it("ranks the kinds that measure a characteristic in table order and refuses every other kind", () => {
    expect(gaugeRank(dialBore, "bore_diameter")).toBe(0);
    expect(gaugeRank(digitalBore, "bore_diameter")).toBe(1);
    expect(gaugeRank(insideMic, "bore_diameter")).toBe(1);
    // An outside micrometer cannot reach into a bore: same quantity, wrong kind (common practice).
    expect(gaugeRank(outsideMic, "bore_diameter")).toBeUndefined();
    expect(gaugeSuits(outsideMic, "bore_diameter")).toBe(false);
    expect(gaugeRank(wrench, "bore_diameter")).toBeUndefined();
    expect(gaugeRank(outsideMic, "fastener_torque")).toBeUndefined();
    expect(gaugeRank(wrench, "fastener_torque")).toBe(0);
    // The quantity comes from the unit the gauge reads, as the gauge form checks it.
    expect(gaugeRank({ kind: "torque_wrench", unit: "nm" }, "fastener_torque")).toBe(0);
    expect(gaugeRank({ kind: "torque_wrench", unit: "in" }, "fastener_torque")).toBeUndefined();
    expect(gaugeRank({ kind: "something_new", unit: "mm" }, "deck_height")).toBeUndefined();
  });
});

describe("the gauge proposed at a station", () => {
  it("is an outside micrometer on a main journal, with depth, inside and outside micrometers on file", () => {
    const c: RawCharacteristic = "main_journal_diameter";
    expect(defaultGauge(c, [depthMic, insideMic, outsideMic])?.kind).toBe("outside_mic");
    expect(defaultGauge("rod_journal_diameter", [depthMic, insideMic, outsideMic])?.kind).toBe("outside_mic");
    expect(defaultGauge("piston_skirt_diameter", [insideMic, depthMic, outsideMic])?.kind).toBe("outside_mic");
  });
  it("lists only the gauges of a kind that measures the station, in table order, then by name", () => {
    expect(gaugesFor("main_journal_diameter", everyGauge).map((g) => g.kind)).toEqual(["outside_mic"]);
    expect(gaugesFor("bore_diameter", everyGauge).map((g) => g.kind)).toEqual([
      "bore_gauge_dial",
      "bore_gauge_digital",
      "inside_mic",
    ]);
    expect(gaugesFor("deck_height", everyGauge).map((g) => g.kind)).toEqual(["deck_gauge", "depth_mic"]);
    expect(gaugesFor("fastener_torque", everyGauge).map((g) => g.kind)).toEqual(["torque_wrench"]);
    expect(gaugesFor("main_journal_diameter", [{ ...outsideMic, active: false }])).toEqual([]);
  });
  it("keeps the machinist's pick when it suits, and never proposes another kind", () => {
    expect(defaultGauge("bore_diameter", [outsideMic, dialBore])?.id).toBe(dialBore.id);
    expect(defaultGauge("bore_diameter", [digitalBore, dialBore], digitalBore.id)?.id).toBe(digitalBore.id);
    expect(defaultGauge("bore_diameter", [outsideMic, dialBore], outsideMic.id)?.id).toBe(dialBore.id);
    expect(defaultGauge("bore_diameter", [outsideMic, dialBore], wrench.id)?.id).toBe(dialBore.id);
    expect(defaultGauge("bore_diameter", [outsideMic, digitalBore])?.id).toBe(digitalBore.id);
    expect(defaultGauge("deck_height", [outsideMic, dialBore])).toBeUndefined();
    expect(defaultGauge("deck_height", [outsideMic, depthMic])?.id).toBe(depthMic.id);
  });
  it("knows a dial bore gauge and the stations it measures (dial mode)", () => {
    expect(isDialBoreGauge(dialBore)).toBe(true);
    expect(isDialBoreGauge(digitalBore)).toBe(false);
    expect(isDialBoreGauge(undefined)).toBe(false);
    const dial = (Object.keys(USUAL_GAUGES) as RawCharacteristic[]).filter(takesDialBoreGauge);
    expect(dial).toEqual(["bore_diameter", "main_bearing_bore", "rod_bearing_bore"]);
  });
});
