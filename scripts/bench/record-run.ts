// The build record's render time, for `npm run bench:record` and for bench:scale's report: the
// full V8 of scripts/bench/record-fixture.ts (every station, derived values, decisions, torque,
// ten photos) assembled and rendered to PDF `runs` times in this process, after one warm-up.
import { loadavg } from "node:os";
import { renderRecordPdf } from "@/lib/server/record/pdf";
import { fullV8Record } from "./record-fixture";

export type RecordBench = {
  runs: number;
  p50: number;
  p95: number;
  max: number;
  /** CPU time of this process per render (median): less swayed than wall time by a busy machine. */
  cpuP50: number;
  pages: number;
  bytes: number;
  stations: number;
  photos: number;
  load: [number, number, number];
};

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)];

/** Pages of a PDF we wrote: one page object each (no object streams in our output). */
export const pageCount = (pdf: Buffer) => pdf.toString("latin1").match(/\/Type\s*\/Page\b(?!s)/g)?.length ?? 0;

export async function benchRecord(runs = 20): Promise<RecordBench> {
  const fixture = await fullV8Record();
  let pdf = await renderRecordPdf(fixture.build()); // warm-up: module loading and font metrics
  const times: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    const c0 = process.cpuUsage();
    pdf = await renderRecordPdf(fixture.build());
    const c = process.cpuUsage(c0);
    times.push(performance.now() - t0);
    cpu.push((c.user + c.system) / 1000);
  }
  times.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  return {
    runs,
    p50: quantile(times, 0.5),
    p95: quantile(times, 0.95),
    max: times[times.length - 1],
    cpuP50: quantile(cpu, 0.5),
    pages: pageCount(pdf),
    bytes: pdf.length,
    stations: fixture.stations,
    photos: fixture.photos,
    load: loadavg().map((x) => Number(x.toFixed(2))) as [number, number, number],
  };
}

/** One line for a report: the figures with the load average beside them. */
export function recordBenchLine(b: RecordBench): string {
  const ms = (x: number) => `${x.toFixed(0)} ms`;
  return (
    `build record (V8, ${b.stations} stations, ${b.photos} photos, ${b.pages} pages, ${Math.round(b.bytes / 1024)} KB): ` +
    `p50 ${ms(b.p50)}, p95 ${ms(b.p95)}, max ${ms(b.max)} over ${b.runs} renders (goal ≤ 1000 ms), ` +
    `CPU ${ms(b.cpuP50)} a render; ` +
    `load average ${b.load.join(" ")}`
  );
}
