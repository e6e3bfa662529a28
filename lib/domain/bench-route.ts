// The bench route: every station a job needs, from its engine's shape, in the order a shop
// usually works: the bare block (bores, deck, main bearing bores with the caps torqued), the
// crank, the rods (bolt free length, then bearing bores and torqued length with the caps on),
// pistons and rings, then the assembly checks (end play, side clearance), torque, and lash.
// Sections are grouped so the tablet can show progress per section.
import {
  deckBanks,
  parseStationId,
  ringNames,
  valveNames,
  CHARACTERISTICS,
  SECTION_LABELS,
  BORE_DEPTHS,
  AXES,
  JOURNAL_POSITIONS,
} from "./stations";
import { describeStation } from "./station-words";
import { usualGaugeKind } from "./gauges";
import { EXPANSION_COEFFICIENTS } from "./thermal";
import { ENGINE_LAYOUTS, type LengthUnit, type TorqueUnit } from "./enums";
import type { BenchRoute, EngineShape, RouteSection, SectionId, Station } from "./types";

export const SECTION_ORDER: readonly SectionId[] = [
  "bore",
  "deck",
  "main-brg",
  "main",
  "rod",
  "bolt",
  "rod-brg",
  "skirt",
  "ring-gap",
  "end-play",
  "side",
  "torque",
  "lash",
];

/** Fastener groups logged when the engine names none. */
export const DEFAULT_TORQUE_GROUPS: readonly string[] = ["main-caps", "rod-bolts", "head-bolts", "flywheel", "damper"];

function whole(value: unknown, name: string, lo: number, hi: number): void {
  if (typeof value !== "number" || !Number.isInteger(value) || value < lo || value > hi) {
    throw new Error(`${name} must be a whole number from ${lo} to ${hi}; got ${String(value)}`);
  }
}

function checkOptions(engine: EngineShape): void {
  if (engine.boltsPerRod !== undefined) whole(engine.boltsPerRod, "Bolts per rod", 1, 4);
  if (engine.ringsPerPiston !== undefined) ringNames(engine.ringsPerPiston);
  if (engine.rodJournals !== undefined) whole(engine.rodJournals, "Rod journals (crankpins)", 1, engine.cylinders);
  if (engine.rodJournalMap !== undefined) {
    if (!Array.isArray(engine.rodJournalMap) || engine.rodJournalMap.length !== engine.cylinders) {
      throw new Error(`The rod-to-crankpin map needs one crankpin number per rod (${engine.cylinders})`);
    }
    const pins = rodJournalCount(engine);
    engine.rodJournalMap.forEach((pin, i) => whole(pin, `Crankpin of rod ${i + 1}`, 1, pins));
  }
  for (const g of engine.torqueGroups ?? []) parseStationId(`torque/${g}`);
  for (const [part, material] of Object.entries(engine.materials ?? {})) {
    if (!(material in EXPANSION_COEFFICIENTS)) {
      throw new Error(
        `Unknown material '${String(material)}' for ${part}; use one of ${Object.keys(EXPANSION_COEFFICIENTS).join(", ")}`,
      );
    }
  }
  for (const [kind, sizes] of [
    ["Nominal", engine.nominalSizes],
    ["Finished", engine.finishedSizes],
  ] as const) {
    for (const [size, value] of Object.entries(sizes ?? {})) {
      if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
        throw new Error(`${kind} ${size} size must be a number above zero; got ${String(value)}`);
      }
    }
  }
}

/** Throws, saying what to fix, when an engine shape cannot be measured as given. */
export function checkEngineShape(engine: EngineShape): void {
  if (engine === null || typeof engine !== "object")
    throw new Error("An engine shape is needed (cylinders, layout, mains…)");
  whole(engine.cylinders, "Cylinders", 1, 16);
  if (!(ENGINE_LAYOUTS as readonly string[]).includes(engine.layout)) {
    throw new Error(`Layout must be inline, v or flat; got '${String(engine.layout)}'`);
  }
  if (engine.layout !== "inline" && engine.cylinders % 2 !== 0) {
    throw new Error(
      `A ${engine.layout === "v" ? "V" : "flat"} engine has an even number of cylinders; got ${engine.cylinders}`,
    );
  }
  whole(engine.mains, "Main bearings", 1, 10);
  valveNames(engine.valvesPerCylinder);
  if (engine.unitSystem !== "inch" && engine.unitSystem !== "metric") {
    throw new Error(`Unit system must be inch or metric; got '${String(engine.unitSystem)}'`);
  }
  checkOptions(engine);
}

export function lengthUnitOf(engine: EngineShape): LengthUnit {
  return engine.unitSystem === "metric" ? "mm" : "in";
}

export function torqueUnitOf(engine: EngineShape): TorqueUnit {
  return engine.unitSystem === "metric" ? "nm" : "lbf_ft";
}

/** Crankpins: as given, else one per cylinder (inline, flat) or one per pair of rods (V). */
export function rodJournalCount(engine: EngineShape): number {
  return engine.rodJournals ?? (engine.layout === "v" ? engine.cylinders / 2 : engine.cylinders);
}

/** The crankpin rod `rod` runs on (map given, else V rods paired 1–2, 3–4…; inline and flat one each). */
export function rodJournalOf(engine: EngineShape, rod: number): number {
  if (engine.rodJournalMap) return engine.rodJournalMap[rod - 1];
  const pins = rodJournalCount(engine);
  return Math.min(pins, Math.ceil((rod * pins) / engine.cylinders));
}

const range = (n: number): number[] => Array.from({ length: n }, (_, i) => i + 1);
const spans = (prefix: string, count: number): string[] =>
  range(count).flatMap((n) => JOURNAL_POSITIONS.flatMap((p) => AXES.map((a) => `${prefix}/${n}/${p}/${a}`)));

const STATION_IDS: Record<SectionId, (e: EngineShape) => string[]> = {
  bore: (e) => range(e.cylinders).flatMap((c) => BORE_DEPTHS.flatMap((d) => AXES.map((a) => `bore/${c}/${d}/${a}`))),
  deck: (e) => deckBanks(e.layout).flatMap((b) => ["front", "rear"].map((c) => `deck/${b}/${c}`)),
  "main-brg": (e) => spans("main-brg", e.mains),
  main: (e) => spans("main", e.mains),
  rod: (e) => spans("rod", rodJournalCount(e)),
  // All free lengths first (rods apart on the bench), then torqued lengths as each cap goes on.
  bolt: (e) =>
    (["free", "loaded"] as const).flatMap((s) =>
      range(e.cylinders).flatMap((r) => range(e.boltsPerRod ?? 2).map((b) => `bolt/${r}/${b}/${s}`)),
    ),
  "rod-brg": (e) => spans("rod-brg", e.cylinders),
  skirt: (e) => range(e.cylinders).map((c) => `skirt/${c}`),
  "ring-gap": (e) =>
    range(e.cylinders).flatMap((c) => ringNames(e.ringsPerPiston ?? 3).map((r) => `ring-gap/${c}/${r}`)),
  "end-play": () => ["end-play"],
  side: (e) => range(e.cylinders).map((r) => `side/${r}`),
  torque: (e) => (e.torqueGroups ?? DEFAULT_TORQUE_GROUPS).map((g) => `torque/${g}`),
  lash: (e) => range(e.cylinders).flatMap((c) => valveNames(e.valvesPerCylinder).map((v) => `lash/${c}/${v}`)),
};

function stationOf(id: string, engine: EngineShape): Station {
  const { characteristic, section } = parseStationId(id);
  if (!characteristic) throw new Error(`Station '${id}' names a part, not a place to measure`);
  const info = CHARACTERISTICS[characteristic];
  const torque = info.kind === "torque";
  const gaugeKind = usualGaugeKind(characteristic);
  return {
    id,
    characteristic,
    section,
    label: describeStation(id),
    kind: info.kind,
    unit: torque ? torqueUnitOf(engine) : lengthUnitOf(engine),
    torque,
    ...(gaugeKind ? { gaugeKind } : {}),
  };
}

/**
 * What a route is made of: the fields STATION_IDS lays stations out from, and the unit system
 * their units come from. Not sizes or materials, which made the key cost more than the lookup.
 */
function routeKey(e: EngineShape): string {
  return JSON.stringify([
    e.cylinders,
    e.layout,
    e.mains,
    e.valvesPerCylinder,
    e.boltsPerRod,
    e.ringsPerPiston,
    e.rodJournals,
    e.rodJournalMap,
    e.torqueGroups,
    e.unitSystem,
  ]);
}

function layOut(engine: EngineShape, wanted: readonly SectionId[]): BenchRoute {
  const out: RouteSection[] = wanted.map((id) => {
    const stations = STATION_IDS[id](engine).map((sid) => stationOf(sid, engine));
    return { id, label: SECTION_LABELS[id], count: stations.length, stations };
  });
  return { sections: out, total: out.reduce((n, s) => n + s.count, 0) };
}

// A whole route is laid out once per engine key (the job page, the board's progress and the CSV
// each need it, ~0.5 ms a time for a V8) and frozen, as every caller shares it.
const fullRoutes = new Map<string, BenchRoute>();
function fullRoute(engine: EngineShape): BenchRoute {
  const key = routeKey(engine);
  let route = fullRoutes.get(key);
  if (!route) {
    route = layOut(engine, SECTION_ORDER);
    for (const s of route.sections) {
      s.stations.forEach((st) => Object.freeze(st));
      Object.freeze(s.stations);
      Object.freeze(s);
    }
    Object.freeze(route.sections);
    Object.freeze(route);
    if (fullRoutes.size > 50) fullRoutes.clear();
    fullRoutes.set(key, route);
  }
  return route;
}

/**
 * Every station of `sections` (default: all) for this engine, in bench order. Asking for a
 * section twice or in another order still gives bench order. The whole route is shared and frozen.
 */
export function benchRoute(engine: EngineShape, sections?: SectionId[]): BenchRoute {
  checkEngineShape(engine);
  for (const s of sections ?? []) {
    if (!SECTION_ORDER.includes(s))
      throw new Error(`Unknown section '${String(s)}'; use one of ${SECTION_ORDER.join(", ")}`);
  }
  if (!sections) return fullRoute(engine);
  return layOut(
    engine,
    SECTION_ORDER.filter((s) => sections.includes(s)),
  );
}
