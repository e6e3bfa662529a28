// The gauge the tablet proposes at a station. Suitable kinds come first (gauges.ts); among them the
// one whose range holds the size the station should read, so a V8's skirts get the 4–5 in
// micrometer, not the 2–3 in one that sorts first, and a gauge's first figure is not refused.
import { rangeHolds, type GaugeRange } from "./gauge-range";
import { gaugesFor, type OfferedGauge } from "./gauges";
import { limitContextFor } from "./job-sizes";
import { limitsFor } from "./limits";
import { parseStationId } from "./stations";
import type { MeasureUnit } from "./enums";
import type { EngineShape, RawCharacteristic, SpecLimit } from "./types";

/** A figure in its unit. */
export type Figure = { value: number; unit: MeasureUnit };

/**
 * The figure a station should read, from its limit on this job: the nominal, else the middle of
 * the window, else its one edge; undefined when the spec has no limit there.
 */
export function expectedFigure(spec: SpecLimit[], stationId: string, engine: EngineShape): Figure | undefined {
  const { characteristic } = parseStationId(stationId);
  if (!characteristic) return undefined;
  const { limits } = limitsFor(spec, characteristic, stationId, limitContextFor(characteristic, engine));
  if (!limits) return undefined;
  const { nominal, min, max, unit } = limits;
  const middle = min !== undefined && max !== undefined ? (min + max) / 2 : undefined;
  const value = nominal ?? middle ?? max ?? min;
  return value === undefined ? undefined : { value, unit };
}

/**
 * The gauge to use: the machinist's pick for this kind of station while it suits and its range
 * holds the expected figure; else the first suitable gauge whose range holds it; else the pick or
 * the first suitable gauge (the check at Enter then says which one to take).
 */
export function defaultGauge<G extends OfferedGauge & GaugeRange & { id: number }>(
  characteristic: RawCharacteristic,
  gauges: readonly G[],
  pickedId?: number,
  expected?: Figure,
): G | undefined {
  const options = gaugesFor(characteristic, gauges);
  const holds = (g: G) => !expected || rangeHolds(g, expected.value, expected.unit);
  const picked = options.find((g) => g.id === pickedId);
  if (picked && holds(picked)) return picked;
  return options.find(holds) ?? picked ?? options[0];
}
