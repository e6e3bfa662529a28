// The bearing points of an engine, as bearing shell selection names them: each main bearing
// ("main/3") and each rod's big end ("rod/5", on the crankpin rodJournalOf gives). The desk, the
// tablet's installed-bore stations and the build record all ask here, so a point means one thing.
import { rodJournalCount, rodJournalOf } from "./bench-route";
import type { EngineShape } from "./types";

export type BearingPointKind = "main" | "rod";

export interface BearingPointInfo {
  /** "main/3" or "rod/5". */
  point: string;
  kind: BearingPointKind;
  number: number;
  label: string;
  /** The journal's part id: the main journal, or the crankpin the rod runs on ("rod/2"). */
  journalPart: string;
  /** The section and number its installed-bore stations start with ("main-brg/3"). */
  installedPart: string;
}

const range = (n: number): number[] => Array.from({ length: n }, (_, i) => i + 1);

/** Every main, then every rod, in engine order. */
export function bearingPoints(engine: EngineShape): BearingPointInfo[] {
  const pins = rodJournalCount(engine);
  const mains = range(engine.mains).map((m): BearingPointInfo => ({
    point: `main/${m}`,
    kind: "main",
    number: m,
    label: `Main ${m}`,
    journalPart: `main/${m}`,
    installedPart: `main-brg/${m}`,
  }));
  const rods = range(engine.cylinders).map((r): BearingPointInfo => {
    const pin = rodJournalOf(engine, r);
    return {
      point: `rod/${r}`,
      kind: "rod",
      number: r,
      label: pins === engine.cylinders ? `Rod ${r}` : `Rod ${r} (crankpin ${pin})`,
      journalPart: `rod/${pin}`,
      installedPart: `rod-brg/${r}`,
    };
  });
  return [...mains, ...rods];
}

/** The point an installed-bore station belongs to ("rod-brg/5/front/A" → "rod/5"), else undefined. */
export function bearingPointOfStation(stationId: string): string | undefined {
  const hit = /^(main|rod)-brg\/(\d+)\//.exec(stationId);
  return hit ? `${hit[1]}/${hit[2]}` : undefined;
}
