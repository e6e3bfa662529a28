import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  AXES,
  BORE_DEPTHS,
  CHARACTERISTICS,
  JOURNAL_POSITIONS,
  SECTION_LABELS,
  parseStationId,
  ringNames,
  valveNames,
} from "../../../lib/domain/stations";
import { describeStation } from "../../../lib/domain/station-words";

describe("parseStationId follows the grammar", () => {
  it.each([
    ["bore/3/top/A", { section: "bore", characteristic: "bore_diameter", cylinder: 3, depth: "top", axis: "A" }],
    [
      "main/2/front/B",
      { section: "main", characteristic: "main_journal_diameter", main: 2, position: "front", axis: "B" },
    ],
    [
      "rod/4/rear/A",
      { section: "rod", characteristic: "rod_journal_diameter", journal: 4, position: "rear", axis: "A" },
    ],
    [
      "main-brg/5/rear/B",
      { section: "main-brg", characteristic: "main_bearing_bore", main: 5, position: "rear", axis: "B" },
    ],
    [
      "rod-brg/4/rear/A",
      { section: "rod-brg", characteristic: "rod_bearing_bore", rod: 4, position: "rear", axis: "A" },
    ],
    ["skirt/7", { section: "skirt", characteristic: "piston_skirt_diameter", cylinder: 7 }],
    ["ring-gap/5/top", { section: "ring-gap", characteristic: "ring_end_gap", cylinder: 5, ring: "top" }],
    ["side/6", { section: "side", characteristic: "rod_side_clearance", rod: 6 }],
    ["end-play", { section: "end-play", characteristic: "crank_end_play" }],
    ["bolt/3/1/free", { section: "bolt", characteristic: "rod_bolt_free_length", rod: 3, bolt: 1, boltState: "free" }],
    [
      "bolt/3/2/loaded",
      { section: "bolt", characteristic: "rod_bolt_loaded_length", rod: 3, bolt: 2, boltState: "loaded" },
    ],
    ["deck/left/front", { section: "deck", characteristic: "deck_height", bank: "left", corner: "front" }],
    ["deck/block/rear", { section: "deck", characteristic: "deck_height", bank: "block", corner: "rear" }],
    ["lash/2/int", { section: "lash", characteristic: "valve_lash", cylinder: 2, valve: "int" }],
    ["lash/2/exh2", { section: "lash", characteristic: "valve_lash", cylinder: 2, valve: "exh2" }],
    ["torque/main-caps", { section: "torque", characteristic: "fastener_torque", group: "main-caps" }],
    ["torque/oil-pump-pickup", { section: "torque", characteristic: "fastener_torque", group: "oil-pump-pickup" }],
    ["bore/12", { section: "bore", cylinder: 12 }],
    ["main/1", { section: "main", main: 1 }],
    ["rod/3", { section: "rod", journal: 3 }],
    ["bolt/8/2", { section: "bolt", rod: 8, bolt: 2 }],
  ])("%s", (id, fields) => {
    const parsed = parseStationId(id);
    expect(parsed).toEqual({ id, ...fields });
  });
  it("part ids carry no characteristic: no reading is taken there", () => {
    expect(parseStationId("bore/3").characteristic).toBeUndefined();
  });
});

describe("parseStationId refuses what is not a station, naming the bad segment", () => {
  it.each([
    ["", /station id is needed/],
    ["cam/1", /'cam' is not a section/],
    ["bore/3/top", /has 4 segments/],
    ["bore/3/top/C", /axis must be A \| B, got 'C'/],
    ["bore/0/top/A", /cylinder must be a number from 1/],
    ["bore/03/top/A", /cylinder must be a number from 1/],
    ["bore/three/top/A", /cylinder must be a number from 1/],
    ["bore/3/upper/A", /depth must be top \| mid \| bottom/],
    ["main/2/middle/A", /position must be front \| rear/],
    ["ring-gap/1/fourth", /ring must be/],
    ["bolt/1/1/tight", /boltState must be free \| loaded/],
    ["deck/center/front", /bank must be block \| left \| right/],
    ["lash/1/intake", /valve must be/],
    ["torque/Main Caps", /group must be a lower-case name/],
    ["end-play/1", /has 1 segments/],
    ["skirt/1/extra", /has 2 segments/],
  ])("%s", (id, message) => {
    expect(() => parseStationId(id)).toThrow(message);
  });
});

describe("describeStation gives the machinist words", () => {
  it.each([
    ["bore/3/top/A", "Cylinder 3 · top of bore · axis A (thrust)"],
    ["bore/3/bottom/B", "Cylinder 3 · bottom of bore · axis B (pin)"],
    ["bore/3", "Cylinder 3"],
    ["main/2/front/B", "Main journal 2 · front end · axis B (90° from A)"],
    ["rod/1/rear/A", "Rod journal 1 · rear end · axis A"],
    ["main-brg/2/front/A", "Main bearing 2 (installed) · front end · axis A (square to cap joint)"],
    ["rod-brg/4/rear/A", "Rod 4 bearing (installed) · rear end · axis A (square to cap joint)"],
    ["skirt/3", "Piston 3 · skirt at the maker's gauge point"],
    ["ring-gap/5/top", "Cylinder 5 · top ring end gap"],
    ["ring-gap/5/oil", "Cylinder 5 · oil ring end gap"],
    ["side/3", "Rod 3 · side clearance"],
    ["end-play", "Crankshaft · end play"],
    ["bolt/3/1/free", "Rod 3 · bolt 1 · free length"],
    ["bolt/3/1/loaded", "Rod 3 · bolt 1 · torqued length"],
    ["bolt/3/1", "Rod 3 · bolt 1"],
    ["deck/left/front", "Left bank deck · front corner"],
    ["deck/block/rear", "Deck · rear corner"],
    ["lash/2/int", "Cylinder 2 · intake valve lash"],
    ["lash/2/exh1", "Cylinder 2 · exhaust valve 1 lash"],
    ["torque/main-caps", "Torque · main caps"],
    ["torque/oil-pump-pickup", "Torque · oil pump pickup"],
  ])("%s → %s", (id, words) => {
    expect(describeStation(id)).toBe(words);
  });
});

describe("the catalogue", () => {
  const entries = Object.values(CHARACTERISTICS);
  it("lists every characteristic once, with its own id, a section and a label", () => {
    expect(entries).toHaveLength(24);
    for (const [id, info] of Object.entries(CHARACTERISTICS)) {
      expect(info.id).toBe(id);
      expect(SECTION_LABELS[info.section]).toBeTruthy();
      expect(info.label.length).toBeGreaterThan(3);
    }
    expect(new Set(entries.map((e) => e.label)).size).toBe(entries.length);
  });
  it("has 14 raw and 10 derived characteristics; only fastener torque is a torque", () => {
    expect(entries.filter((e) => !e.derived)).toHaveLength(14);
    expect(entries.filter((e) => e.derived)).toHaveLength(10);
    expect(entries.filter((e) => e.kind === "torque").map((e) => e.id)).toEqual(["fastener_torque"]);
  });
  it("ties diameters and lengths to the part whose material sets their expansion", () => {
    expect(CHARACTERISTICS.bore_diameter.part).toBe("block");
    expect(CHARACTERISTICS.main_journal_diameter.part).toBe("crank");
    expect(CHARACTERISTICS.piston_skirt_diameter.part).toBe("pistons");
    expect(CHARACTERISTICS.rod_bolt_loaded_length.part).toBe("rodBolts");
    expect(CHARACTERISTICS.ring_end_gap.part).toBeUndefined();
  });
});

describe("ring and valve names", () => {
  it("names rings top first, oil last", () => {
    expect(ringNames(3)).toEqual(["top", "second", "oil"]);
    expect(ringNames(2)).toEqual(["top", "oil"]);
    expect(ringNames(4)).toEqual(["top", "second", "third", "oil"]);
    expect(() => ringNames(5)).toThrow(/1 to 4/);
  });
  it("names valves intakes first, numbering only when a cylinder has several", () => {
    expect(valveNames(2)).toEqual(["int", "exh"]);
    expect(valveNames(3)).toEqual(["int1", "int2", "exh"]);
    expect(valveNames(4)).toEqual(["int1", "int2", "exh1", "exh2"]);
    expect(valveNames(5)).toEqual(["int1", "int2", "int3", "exh1", "exh2"]);
    expect(() => valveNames(6)).toThrow(/2 to 5/);
  });
});

describe("every id built from the grammar parses back to its parts (fast-check)", () => {
  const n = fc.integer({ min: 1, max: 999 });
  it("bores and journals", () => {
    fc.assert(
      fc.property(
        n,
        fc.constantFrom(...BORE_DEPTHS),
        fc.constantFrom(...AXES),
        fc.constantFrom(...JOURNAL_POSITIONS),
        (k, d, a, p) => {
          const bore = parseStationId(`bore/${k}/${d}/${a}`);
          const brg = parseStationId(`rod-brg/${k}/${p}/${a}`);
          return (
            bore.cylinder === k &&
            bore.depth === d &&
            bore.axis === a &&
            brg.rod === k &&
            brg.position === p &&
            brg.axis === a &&
            describeStation(`bore/${k}/${d}/${a}`).startsWith(`Cylinder ${k} · `)
          );
        },
      ),
    );
  });
});
