// Invented bench figures for `npm run bench:sync` (benchmark data only, not reference values):
// every station of a small-block V8's route with a plausible value near the demo spec sheet's
// nominal (scripts/seed/demo-specs.ts STREET_V8_INCH), a few percent of them out of spec.
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

// Centre, spread (± in the station's unit) and a stray's offset, first matching pattern wins. The
// spreads keep an ordinary figure, and the values derived from it (taper, clearances, stretch), inside
// the demo gauges' guard bands (U of ISO 14253-1) on the demo street spec sheet; about 1.5 in 100
// figures are strays, moved by their offset past a limit, so a few percent of the readings of a
// job (the stray and what is derived from it) are out of spec, as on a real bench.
const FIGURES: [pattern: RegExp, centre: number, spread: number, stray: number][] = [
  [/^bore\//, 4.03015, 0.00009, 0.0006], // finished 4.0300 −0.0001/+0.0004, bore gauge U 0.00015
  [/^main-brg\//, 2.4512, 0.00004, 0.001],
  [/^main\//, 2.44905, 0.00004, -0.0008],
  [/^rod-brg\//, 2.1012, 0.00004, 0.001],
  [/^rod\//, 2.09905, 0.00004, -0.0008],
  [/^skirt\//, 4.0285, 0.0001, -0.0006],
  [/^ring-gap\/.*\/second$/, 0.021, 0.002, 0.006],
  [/^ring-gap\/.*\/oil$/, 0.03, 0.008, -0.02], // tight: the feeler set ends at 0.04 in
  [/^ring-gap\//, 0.019, 0.002, 0.006],
  [/^side\//, 0.015, 0.003, 0.008],
  [/^end-play$/, 0.004, 0.001, 0.004],
  [/^bolt\//, 2.1, 0.00004, 0.0006], // within the stretch gauge's 0.5–6 in
  [/^deck\//, 9.025, 0.002, 0.006],
  [/^lash\/.*\/int$/, 0.018, 0.0015, 0.006],
  [/^lash\//, 0.02, 0.0015, 0.006],
  // Torque: whole lbf·ft, inside the 5 lbf·ft windows less the wrench's U of 2.
  [/^torque\/main-caps$/, 72.5, 0.49, -8],
  [/^torque\/head-bolts$/, 67.5, 0.49, -8],
  [/^torque\/rod-bolts$/, 47.5, 0.49, -8],
  [/^torque\//, 62.5, 0.49, -8],
];

/** Share of figures that stray past a limit. */
const STRAY_SHARE = 0.015;

/** A deterministic pseudo-random sequence, so every run measures the same figures. */
export function lcg(seed: number) {
  let x = seed >>> 0;
  return () => (x = (Math.imul(x, 1664525) + 1013904223) >>> 0) / 2 ** 32;
}

export function valueFor(stationId: string, rnd: () => number): number {
  const [, centre, spread, offset] = FIGURES.find(([p]) => p.test(stationId))!;
  const loaded = stationId.endsWith("/loaded") ? 0.0058 : 0; // stretch of a torqued rod bolt
  const decimals = stationId.startsWith("torque/") ? 0 : 4;
  const stray = rnd() < STRAY_SHARE ? offset : 0;
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
