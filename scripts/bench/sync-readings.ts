// Invented bench figures for `npm run bench:sync` (benchmark data only, not reference values):
// every station of a small-block V8's route with a plausible value near the demo spec sheet's
// nominal (lib/../scripts/seed/demo-specs.ts STREET_V8_INCH), a few percent of them out of spec.
import { randomUUID } from "node:crypto";
import type { EngineShape, RangedGauge } from "@/lib/domain";
import { benchRoute, gaugesHolding } from "@/lib/domain";
import type { PushReadingInput } from "@/lib/schemas/sync";

export const V8: EngineShape = {
  cylinders: 8,
  layout: "v",
  mains: 5,
  valvesPerCylinder: 2,
  unitSystem: "inch",
  materials: { block: "greyCastIron" },
  nominalSizes: { bore: 4.03 },
};

// Centre and spread (± in the station's unit), first matching pattern wins. Spreads are chosen so
// a few percent of values (raw or derived) land out of spec or marginal, as on a real bench.
const FIGURES: [pattern: RegExp, centre: number, spread: number][] = [
  [/^bore\//, 4.0302, 0.0002],
  [/^main-brg\//, 2.4512, 0.0001],
  [/^main\//, 2.449, 0.0001],
  [/^rod-brg\//, 2.1012, 0.0001],
  [/^rod\//, 2.099, 0.0001],
  [/^skirt\//, 4.0285, 0.0002],
  [/^ring-gap\/.*\/second$/, 0.021, 0.002],
  [/^ring-gap\/.*\/oil$/, 0.03, 0.01],
  [/^ring-gap\//, 0.019, 0.002],
  [/^side\//, 0.015, 0.003],
  [/^end-play$/, 0.004, 0.001],
  [/^bolt\//, 6, 0.0001],
  [/^deck\//, 9.025, 0.002],
  [/^lash\/.*\/int$/, 0.018, 0.0015],
  [/^lash\//, 0.02, 0.0015],
  [/^torque\/main-caps$/, 72, 2],
  [/^torque\/head-bolts$/, 67, 2],
  [/^torque\/rod-bolts$/, 47, 2],
  [/^torque\//, 62, 2],
];

/** A deterministic pseudo-random sequence, so every run measures the same figures. */
export function lcg(seed: number) {
  let x = seed >>> 0;
  return () => (x = (Math.imul(x, 1664525) + 1013904223) >>> 0) / 2 ** 32;
}

export function valueFor(stationId: string, rnd: () => number): number {
  const [, centre, spread] = FIGURES.find(([p]) => p.test(stationId))!;
  const loaded = stationId.endsWith("/loaded") ? 0.0058 : 0; // stretch of a torqued rod bolt
  const decimals = stationId.startsWith("torque/") ? 0 : 4;
  const stray = rnd() < 0.03 ? 4 * spread : 0; // about 3 in 100 figures well off centre
  return Number((centre + loaded + stray + (rnd() * 2 - 1) * spread).toFixed(decimals));
}

/**
 * One full route per job, in bench order; `count` readings in all. With `gauges`, each reading
 * names the first that can take it (as the ingest asks) and a station none can take is passed over.
 */
export function benchReadings(
  jobIds: number[],
  count: number,
  takenAt: string,
  gauges?: readonly (RangedGauge & { id: number })[],
): PushReadingInput[] {
  const rnd = lcg(2611);
  const stations = benchRoute(V8).sections.flatMap((s) => s.stations);
  const out: PushReadingInput[] = [];
  for (const jobId of jobIds) {
    for (const st of stations) {
      if (out.length === count) return out;
      const value = valueFor(st.id, rnd);
      const gauge = gauges && gaugesHolding({ stationId: st.id, value, unit: st.unit }, gauges)[0];
      if (gauges && !gauge) continue;
      out.push({
        id: randomUUID(),
        jobId,
        stationId: st.id,
        value,
        unit: st.unit,
        entryMode: "direct",
        takenAt,
        ...(gauge ? { instrumentId: gauge.id } : {}),
        ...(st.torque ? { lubricant: "engine-oil" as const } : {}),
      });
    }
  }
  return out;
}

export const stationsPerJob = () => benchRoute(V8).total;
