// The station catalogue: what can be measured, where, and how a station id is written.
//
// Station id grammar (segments joined by "/"; numbers 1-based, no leading zeros; cylinders and
// rods use the engine maker's cylinder numbering, rod n sits in cylinder n):
//   bore/<cyl>/<depth>/<axis>        bore diameter; depth top|mid|bottom; axis A (thrust) | B (pin)
//   main/<main>/<pos>/<axis>         main journal diameter; pos front|rear; axis A | B (90° apart)
//   rod/<pin>/<pos>/<axis>           rod journal (crankpin) diameter
//   main-brg/<main>/<pos>/<axis>     main bearing bore, shells in, caps torqued; A square to the cap joint
//   rod-brg/<rod>/<pos>/<axis>       rod bearing bore, shells in, cap torqued
//   skirt/<cyl>                      piston skirt diameter at the piston maker's gauge point
//   ring-gap/<cyl>/<ring>            ring end gap; ring top|second|third|oil
//   side/<rod>                       rod side clearance
//   end-play                         crankshaft end play
//   bolt/<rod>/<bolt>/<state>        rod-bolt length; state free|loaded
//   deck/<bank>/<corner>             deck height; bank block (inline) | left | right; corner front|rear
//   lash/<cyl>/<valve>               valve lash; valve int|exh, numbered int1, int2, exh1… when several
//   torque/<group>                   fastener torque of a group (kebab-case, e.g. main-caps)
// Part ids that only name derived values (no reading is taken there):
//   bore/<cyl>   taper, out-of-round, piston-to-wall     main/<main>, rod/<pin>   taper, out-of-round
//   bolt/<rod>/<bolt>   stretch        (oil clearance uses the bearing bore's own id)
import type {
  Axis,
  BoreDepth,
  CharacteristicId,
  CharacteristicInfo,
  DeckBank,
  EngineShape,
  JournalPosition,
  Lubricant,
  ParsedStation,
  RawCharacteristic,
  SectionId,
} from "./types";

type Entry = Omit<CharacteristicInfo, "id">;
const len = (section: SectionId, label: string, extra: Partial<Entry> = {}): Entry => ({
  label,
  section,
  kind: "length",
  derived: false,
  ...extra,
});
const derived = (section: SectionId, label: string): Entry => ({ label, section, kind: "length", derived: true });

const ENTRIES: Record<CharacteristicId, Entry> = {
  bore_diameter: len("bore", "Cylinder bore diameter", { part: "block" }),
  main_journal_diameter: len("main", "Main journal diameter", { part: "crank" }),
  rod_journal_diameter: len("rod", "Rod journal diameter", { part: "crank" }),
  main_bearing_bore: len("main-brg", "Main bearing bore, shells in and caps torqued", { part: "block" }),
  rod_bearing_bore: len("rod-brg", "Rod bearing bore, shells in and cap torqued", { part: "rods" }),
  piston_skirt_diameter: len("skirt", "Piston skirt diameter", { part: "pistons" }),
  ring_end_gap: len("ring-gap", "Ring end gap, ring square in its bore"),
  rod_side_clearance: len("side", "Rod side clearance"),
  crank_end_play: len("end-play", "Crankshaft end play"),
  rod_bolt_free_length: len("bolt", "Rod bolt length before torquing", { part: "rodBolts" }),
  rod_bolt_loaded_length: len("bolt", "Rod bolt length torqued", { part: "rodBolts" }),
  deck_height: len("deck", "Deck height", { part: "block" }),
  valve_lash: len("lash", "Valve lash"),
  fastener_torque: {
    label: "Fastener torque",
    section: "torque",
    kind: "torque",
    derived: false,
  },
  main_oil_clearance: derived("main-brg", "Main bearing oil clearance"),
  rod_oil_clearance: derived("rod-brg", "Rod bearing oil clearance"),
  piston_to_wall: derived("skirt", "Piston-to-wall clearance"),
  bore_taper: derived("bore", "Bore taper"),
  bore_out_of_round: derived("bore", "Bore out-of-round"),
  main_journal_taper: derived("main", "Main journal taper"),
  main_journal_out_of_round: derived("main", "Main journal out-of-round"),
  rod_journal_taper: derived("rod", "Rod journal taper"),
  rod_journal_out_of_round: derived("rod", "Rod journal out-of-round"),
  rod_bolt_stretch: derived("bolt", "Rod bolt stretch"),
};

/** Every characteristic, keyed by id. */
export const CHARACTERISTICS: Readonly<Record<CharacteristicId, CharacteristicInfo>> = Object.fromEntries(
  Object.entries(ENTRIES).map(([id, e]) => [id, { id, ...e }]),
) as Record<CharacteristicId, CharacteristicInfo>;

export const SECTION_LABELS: Readonly<Record<SectionId, string>> = {
  bore: "Cylinder bores",
  deck: "Deck height",
  "main-brg": "Main bearing bores (installed)",
  main: "Main journals",
  rod: "Rod journals",
  "rod-brg": "Rod bearing bores (installed)",
  skirt: "Piston skirts",
  "ring-gap": "Ring end gaps",
  "end-play": "Crankshaft end play",
  side: "Rod side clearance",
  bolt: "Rod bolt stretch",
  torque: "Fastener torque",
  lash: "Valve lash",
};

export const BORE_DEPTHS: readonly BoreDepth[] = ["top", "mid", "bottom"];
export const AXES: readonly Axis[] = ["A", "B"];
export const JOURNAL_POSITIONS: readonly JournalPosition[] = ["front", "rear"];

export const TORQUE_GROUP_LABELS: Readonly<Record<string, string>> = {
  "main-caps": "main caps",
  "rod-bolts": "rod bolts",
  "head-bolts": "cylinder head bolts",
  flywheel: "flywheel bolts",
  damper: "crank damper bolt",
};

export const LUBRICANT_LABELS: Readonly<Record<Lubricant, string>> = {
  "engine-oil": "Engine oil",
  "moly-paste": "Moly assembly paste",
  "fastener-lube": "Fastener maker's lube",
  "thread-sealant": "Thread sealant",
  dry: "Dry (clean, no lubricant)",
};

/** Ring names for a piston with `count` rings: the top ring first, the oil ring last. */
export function ringNames(count: number): string[] {
  const byCount: Record<number, string[]> = {
    1: ["top"],
    2: ["top", "oil"],
    3: ["top", "second", "oil"],
    4: ["top", "second", "third", "oil"],
  };
  const names = byCount[count];
  if (!names) throw new Error(`Rings per piston must be 1 to 4; got ${String(count)}`);
  return names;
}

/** Valve names for a cylinder: intakes first (the larger half when odd), then exhausts. */
export function valveNames(count: number): string[] {
  if (!Number.isInteger(count) || count < 2 || count > 5) {
    throw new Error(`Valves per cylinder must be 2 to 5; got ${String(count)}`);
  }
  const intakes = Math.ceil(count / 2);
  const name = (kind: string, n: number, of: number) => (of === 1 ? kind : `${kind}${n}`);
  return [
    ...Array.from({ length: intakes }, (_, i) => name("int", i + 1, intakes)),
    ...Array.from({ length: count - intakes }, (_, i) => name("exh", i + 1, count - intakes)),
  ];
}

export function deckBanks(layout: EngineShape["layout"]): DeckBank[] {
  return layout === "inline" ? ["block"] : ["left", "right"];
}

// Each section's segments after the first: a field name and what it may hold.
type FieldRule = readonly [keyof ParsedStation, readonly string[] | "number" | RegExp];
const NUMBER = /^[1-9]\d{0,2}$/;
const POS_AXIS = [
  ["position", JOURNAL_POSITIONS],
  ["axis", AXES],
] as const;
const GRAMMAR: Record<
  SectionId,
  { fields: readonly FieldRule[]; partLength?: number; characteristic: RawCharacteristic }
> = {
  bore: {
    fields: [
      ["cylinder", "number"],
      ["depth", BORE_DEPTHS],
      ["axis", AXES],
    ],
    partLength: 1,
    characteristic: "bore_diameter",
  },
  main: { fields: [["main", "number"], ...POS_AXIS], partLength: 1, characteristic: "main_journal_diameter" },
  rod: { fields: [["journal", "number"], ...POS_AXIS], partLength: 1, characteristic: "rod_journal_diameter" },
  "main-brg": { fields: [["main", "number"], ...POS_AXIS], characteristic: "main_bearing_bore" },
  "rod-brg": { fields: [["rod", "number"], ...POS_AXIS], characteristic: "rod_bearing_bore" },
  skirt: { fields: [["cylinder", "number"]], characteristic: "piston_skirt_diameter" },
  "ring-gap": {
    fields: [
      ["cylinder", "number"],
      ["ring", ["top", "second", "third", "oil"]],
    ],
    characteristic: "ring_end_gap",
  },
  side: { fields: [["rod", "number"]], characteristic: "rod_side_clearance" },
  "end-play": { fields: [], characteristic: "crank_end_play" },
  bolt: {
    fields: [
      ["rod", "number"],
      ["bolt", "number"],
      ["boltState", ["free", "loaded"]],
    ],
    partLength: 2,
    characteristic: "rod_bolt_free_length",
  },
  deck: {
    fields: [
      ["bank", ["block", "left", "right"]],
      ["corner", ["front", "rear"]],
    ],
    characteristic: "deck_height",
  },
  lash: {
    fields: [
      ["cylinder", "number"],
      ["valve", /^(int|exh)([1-9])?$/],
    ],
    characteristic: "valve_lash",
  },
  torque: { fields: [["group", /^[a-z0-9]+(-[a-z0-9]+)*$/]], characteristic: "fastener_torque" },
};

function fieldValue(id: string, [name, rule]: FieldRule, raw: string | undefined): string | number {
  const ok =
    raw !== undefined &&
    (rule === "number" ? NUMBER.test(raw) : rule instanceof RegExp ? rule.test(raw) : rule.includes(raw));
  if (!ok) {
    const want =
      rule === "number" ? "a number from 1" : rule instanceof RegExp ? "a lower-case name" : rule.join(" | ");
    throw new Error(`Unknown station '${id}': the ${String(name)} must be ${want}, got '${raw ?? ""}'`);
  }
  return rule === "number" ? Number(raw) : raw;
}

// A server judges thousands of readings of the same few hundred stations: each id is parsed once.
// The parts are frozen, as every caller shares them.
const parsedIds = new Map<string, ParsedStation>();

/** Takes a station id apart (grammar at the top of this file); throws naming the wrong segment. */
export function parseStationId(id: string): ParsedStation {
  let parsed = parsedIds.get(id);
  if (parsed === undefined) {
    parsed = Object.freeze(parseAnew(id));
    if (parsedIds.size > 5000) parsedIds.clear();
    parsedIds.set(id, parsed);
  }
  return parsed;
}

function parseAnew(id: string): ParsedStation {
  if (typeof id !== "string" || id === "") throw new Error("A station id is needed, e.g. 'bore/1/top/A'");
  const [head, ...rest] = id.split("/");
  const grammar = (GRAMMAR as Record<string, (typeof GRAMMAR)[SectionId]>)[head];
  if (!grammar)
    throw new Error(`Unknown station '${id}': '${head}' is not a section (${Object.keys(GRAMMAR).join(", ")})`);
  const isPart = grammar.partLength !== undefined && rest.length === grammar.partLength;
  if (!isPart && rest.length !== grammar.fields.length) {
    throw new Error(`Unknown station '${id}': a ${head} station has ${grammar.fields.length + 1} segments`);
  }
  const out: Record<string, string | number> = { id, section: head };
  rest.forEach((raw, i) => (out[grammar.fields[i][0]] = fieldValue(id, grammar.fields[i], raw)));
  if (!isPart) {
    out.characteristic = out.boltState === "loaded" ? "rod_bolt_loaded_length" : grammar.characteristic;
  }
  return out as unknown as ParsedStation;
}

// The bench asks after every entry for each input of the part's recipes: parse each id once.
const parts = new Map<string, string>();

/**
 * The part a station is on ("bore/3/top/A" → "bore/3", "bolt/2/1/free" → "bolt/2/1"): the id the
 * grammar gives the part's derived values where it has one, else the section and its first segment.
 */
export function partOf(id: string): string {
  let part = parts.get(id);
  if (part === undefined) {
    const { section } = parseStationId(id);
    const segments = id.split("/");
    part = segments.slice(0, 1 + (GRAMMAR[section].partLength ?? 1)).join("/");
    if (parts.size > 5000) parts.clear();
    parts.set(id, part);
  }
  return part;
}
