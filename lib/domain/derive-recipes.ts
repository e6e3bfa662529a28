// What each derived value is computed from: one recipe per value (taper and out-of-round per bore
// and journal, piston-to-wall per cylinder, oil clearance per bearing point, stretch per bolt).
//
// - Piston-to-wall uses the bore at mid depth on the thrust axis (A), against the skirt at the
//   piston maker's gauge point. Common practice, from memory: the skirt is gauged square to the
//   pin and bears on the thrust side in the bore's working zone, which mid depth stands for.
// - Oil clearance pairs each installed bearing bore with the journal at the same position and
//   axis (rods with their own crankpin, rodJournalOf).
import { checkEngineShape, rodJournalCount, rodJournalOf } from "./bench-route";
import { boltStretch, oilClearance, pistonToWall } from "./clearances";
import { boreGeometry, journalGeometry, type GeometryResult } from "./geometry";
import { describeStation } from "./station-words";
import { AXES, BORE_DEPTHS, CHARACTERISTICS, JOURNAL_POSITIONS } from "./stations";
import type { DerivedCharacteristic, EngineShape } from "./types";

/** Results shared by the recipes of one pass (a bore's taper and out-of-round read one geometry). */
export type PassMemo = Map<readonly string[], GeometryResult>;

export interface Recipe {
  characteristic: DerivedCharacteristic;
  stationId: string;
  /** `${characteristic}@${stationId}` */
  key: string;
  /** The value's name and place in words. */
  label: string;
  inputs: string[];
  compute: (v: number[], memo: PassMemo) => number;
  /** Index of the input whose diameter a per-inch rule scales with; default: mean of all inputs. */
  diameterInput?: number;
}

export const derivedKey = (characteristic: DerivedCharacteristic, stationId: string) =>
  `${characteristic}@${stationId}`;

type Draft = Omit<Recipe, "key" | "label">;

function geometryRecipes(prefix: "bore" | "main" | "rod", n: number, inputs: string[], half: number): Draft[] {
  const measure = prefix === "bore" ? boreGeometry : journalGeometry;
  // Both values of a bore or journal come from one geometry of the same inputs, worked out once a pass.
  const shape = (v: number[], memo: PassMemo) => {
    let g = memo.get(inputs);
    if (!g) {
      g = measure({ axisA: v.slice(0, half), axisB: v.slice(half) });
      memo.set(inputs, g);
    }
    return g;
  };
  const names =
    prefix === "bore"
      ? (["bore_taper", "bore_out_of_round"] as const)
      : prefix === "main"
        ? (["main_journal_taper", "main_journal_out_of_round"] as const)
        : (["rod_journal_taper", "rod_journal_out_of_round"] as const);
  return [
    { characteristic: names[0], stationId: `${prefix}/${n}`, inputs, compute: (v, m) => shape(v, m).taper },
    { characteristic: names[1], stationId: `${prefix}/${n}`, inputs, compute: (v, m) => shape(v, m).outOfRound },
  ];
}

const range = (n: number): number[] => Array.from({ length: n }, (_, i) => i + 1);
const byAxis = (head: string, spots: readonly string[]): string[] =>
  AXES.flatMap((a) => spots.map((s) => `${head}/${s}/${a}`));
const points = JOURNAL_POSITIONS.flatMap((p) => AXES.map((a) => `${p}/${a}`));

function drafts(engine: EngineShape): Draft[] {
  const out: Draft[] = [];
  for (const c of range(engine.cylinders)) {
    out.push(...geometryRecipes("bore", c, byAxis(`bore/${c}`, BORE_DEPTHS), BORE_DEPTHS.length));
    out.push({
      characteristic: "piston_to_wall",
      stationId: `bore/${c}`,
      inputs: [`bore/${c}/mid/A`, `skirt/${c}`],
      compute: (v) => pistonToWall(v[0], v[1]),
      diameterInput: 0,
    });
  }
  for (const m of range(engine.mains))
    out.push(...geometryRecipes("main", m, byAxis(`main/${m}`, JOURNAL_POSITIONS), JOURNAL_POSITIONS.length));
  for (const j of range(rodJournalCount(engine)))
    out.push(...geometryRecipes("rod", j, byAxis(`rod/${j}`, JOURNAL_POSITIONS), JOURNAL_POSITIONS.length));
  for (const m of range(engine.mains)) {
    for (const pt of points)
      out.push({
        characteristic: "main_oil_clearance",
        stationId: `main-brg/${m}/${pt}`,
        inputs: [`main-brg/${m}/${pt}`, `main/${m}/${pt}`],
        compute: (v) => oilClearance(v[0], v[1]),
        diameterInput: 1,
      });
  }
  for (const r of range(engine.cylinders)) {
    const pin = rodJournalOf(engine, r);
    for (const pt of points)
      out.push({
        characteristic: "rod_oil_clearance",
        stationId: `rod-brg/${r}/${pt}`,
        inputs: [`rod-brg/${r}/${pt}`, `rod/${pin}/${pt}`],
        compute: (v) => oilClearance(v[0], v[1]),
        diameterInput: 1,
      });
    for (const b of range(engine.boltsPerRod ?? 2)) {
      out.push({
        characteristic: "rod_bolt_stretch",
        stationId: `bolt/${r}/${b}`,
        inputs: [`bolt/${r}/${b}/free`, `bolt/${r}/${b}/loaded`],
        compute: (v) => boltStretch(v[0], v[1]),
      });
    }
  }
  return out;
}

// Recipes depend only on the fields of the engine's shape read above (not its sizes, materials or
// unit), so they are built and worded once per shape; the cache is small (a shop has few shapes).
const cache = new Map<string, readonly Recipe[]>();

/** Every recipe of the engine, in the order derived values are listed. The engine must be checked. */
export function recipes(engine: EngineShape): readonly Recipe[] {
  const e = engine;
  const key = JSON.stringify([e.cylinders, e.layout, e.mains, e.boltsPerRod, e.rodJournals, e.rodJournalMap]);
  let out = cache.get(key);
  if (!out) {
    if (cache.size > 50) cache.clear();
    out = drafts(engine).map((d) => ({
      ...d,
      key: derivedKey(d.characteristic, d.stationId),
      label: `${CHARACTERISTICS[d.characteristic].label} · ${describeStation(d.stationId)}`,
    }));
    cache.set(key, out);
  }
  return out;
}

// Keyed by the whole engine's JSON, as reach.ts asks on every sync upload.
const inputsCache = new Map<string, ReadonlyMap<string, readonly string[]>>();

/** Each derived value's key (`${characteristic}@${stationId}`) with the stations it is computed from. */
export function derivedInputs(engine: EngineShape): ReadonlyMap<string, readonly string[]> {
  const key = JSON.stringify(engine);
  let inputs = inputsCache.get(key);
  if (!inputs) {
    checkEngineShape(engine);
    if (inputsCache.size > 50) inputsCache.clear();
    inputs = new Map(recipes(engine).map((r) => [r.key, r.inputs]));
    inputsCache.set(key, inputs);
  }
  return inputs;
}
