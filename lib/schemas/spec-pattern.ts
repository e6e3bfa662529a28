// Station patterns on a spec sheet, checked against the core's own station grammar
// (lib/domain stations.ts and limits.ts) so a lead cannot save a limit that can never apply.
// A pattern is good when it matches at least one station of its characteristic on some engine
// the shop could measure; the probe engines below hold every station form the grammar has
// (V and inline decks, 2- and 5-valve heads, 4 rings, 4 bolts, 16 cylinders, 10 mains).
import {
  CHARACTERISTICS,
  benchRoute,
  deriveReadings,
  matchStationPattern,
  parseStationId,
  type CharacteristicId,
  type EngineShape,
} from "@/lib/domain";

const PROBES: EngineShape[] = [
  {
    cylinders: 16,
    layout: "v",
    mains: 10,
    valvesPerCylinder: 2,
    ringsPerPiston: 4,
    boltsPerRod: 4,
    unitSystem: "inch",
  },
  { cylinders: 16, layout: "inline", mains: 10, valvesPerCylinder: 5, unitSystem: "inch" },
];

/** How each characteristic's station ids are written, in the words shown beside the field. */
export const STATION_FORMS: Record<CharacteristicId, string> = {
  bore_diameter: "bore/<cylinder>/<top|mid|bottom>/<A|B>",
  main_journal_diameter: "main/<main>/<front|rear>/<A|B>",
  rod_journal_diameter: "rod/<crankpin>/<front|rear>/<A|B>",
  main_bearing_bore: "main-brg/<main>/<front|rear>/<A|B>",
  rod_bearing_bore: "rod-brg/<rod>/<front|rear>/<A|B>",
  piston_skirt_diameter: "skirt/<cylinder>",
  ring_end_gap: "ring-gap/<cylinder>/<top|second|third|oil>",
  rod_side_clearance: "side/<rod>",
  crank_end_play: "end-play",
  rod_bolt_free_length: "bolt/<rod>/<bolt>/free",
  rod_bolt_loaded_length: "bolt/<rod>/<bolt>/loaded",
  deck_height: "deck/<block|left|right>/<front|rear>",
  valve_lash: "lash/<cylinder>/<int|exh> (int1, int2, exh1… on multi-valve heads)",
  fastener_torque: "torque/<group> (main-caps, rod-bolts, head-bolts, flywheel, damper, or your own)",
  main_oil_clearance: "main-brg/<main>/<front|rear>/<A|B>",
  rod_oil_clearance: "rod-brg/<rod>/<front|rear>/<A|B>",
  piston_to_wall: "bore/<cylinder>",
  bore_taper: "bore/<cylinder>",
  bore_out_of_round: "bore/<cylinder>",
  main_journal_taper: "main/<main>",
  main_journal_out_of_round: "main/<main>",
  rod_journal_taper: "rod/<crankpin>",
  rod_journal_out_of_round: "rod/<crankpin>",
  rod_bolt_stretch: "bolt/<rod>/<bolt>",
};

/** The pattern rule in words (the same rule limits.ts applies). */
export const PATTERN_RULE =
  'Write a station id, with * for any part of it. A * at the end matches everything after it ("main/3/*" is all of main 3); ' +
  'a * in the middle matches exactly one part ("bore/*/top/*" is the top of every bore); "*" alone matches every station. ' +
  "When two limits match, the one with more written-out parts wins.";

let stationIndex: Map<string, string[]> | null = null;

// Built once, on first use: every station and part id of the probe engines, by characteristic.
function stationsOf(characteristic: CharacteristicId): string[] {
  if (!stationIndex) {
    const index = new Map<string, Set<string>>();
    const add = (c: string, id: string) => (index.get(c) ?? index.set(c, new Set()).get(c)!).add(id);
    for (const shape of PROBES) {
      for (const s of benchRoute(shape).sections.flatMap((x) => x.stations)) add(s.characteristic, s.id);
      for (const d of deriveReadings([], shape, [])) add(d.characteristic, d.stationId);
    }
    stationIndex = new Map([...index].map(([c, ids]) => [c, [...ids]]));
  }
  return stationIndex.get(characteristic) ?? [];
}

/** Null when the pattern can apply to `characteristic`; otherwise what to fix, in words. */
export function stationPatternProblem(characteristic: CharacteristicId, pattern: string): string | null {
  const info = CHARACTERISTICS[characteristic];
  if (!info) return "Pick a characteristic first";
  try {
    matchStationPattern(pattern, "end-play"); // throws on an empty pattern or an empty segment
  } catch (err) {
    return (err as Error).message;
  }
  if (stationsOf(characteristic).some((id) => matchStationPattern(pattern, id))) return null;
  const form = STATION_FORMS[characteristic];
  if (!pattern.includes("*")) {
    // A torque group the shop named itself is not on the probe engines but is a good station.
    try {
      const parsed = parseStationId(pattern);
      if (parsed.characteristic === characteristic && characteristic === "fastener_torque") return null;
    } catch (err) {
      return `${(err as Error).message}. ${info.label} stations are written ${form}`;
    }
  }
  return `No ${info.label.toLowerCase()} station matches '${pattern}'. Its stations are written ${form}, or use *`;
}
