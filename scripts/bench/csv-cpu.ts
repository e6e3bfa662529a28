// CPU of the readings CSV's rows (lib/server/readings/csv-export-rows.ts) without a database: a fully
// measured V8 (scripts/bench/sync-readings.ts) judged against the demo street spec as the server
// stores it, written as the export writes it (current readings, then the computed values), timed by
// process.cpuUsage. Server modules load with the "server-only" stub:
// `npx tsx --tsconfig scripts/bench/tsconfig.sync.json scripts/bench/csv-cpu.ts [calls]`.
import { loadavg } from "node:os";
import { benchRoute, evaluateReadings, parseStationId, type RawReading, type SpecLimit } from "@/lib/domain";
import type { StoredReading } from "@/lib/schemas/readings";
import { csvLine } from "@/lib/server/readings/csv-export";
import { derivedRows, readingRow, unitsOf, type RowContext } from "@/lib/server/readings/csv-export-rows";
import { storedEvaluation } from "@/lib/server/sync/ingest-evaluate";
import { STREET_V8_INCH } from "../seed/demo-specs";
import { benchReadings, V8 } from "./sync-readings";

const spec = STREET_V8_INCH as SpecLimit[];
const job = { shape: { ...V8, finishedSizes: { bore: 4.03, mainJournal: 2.449, rodJournal: 2.099 } }, spec };
const takenAt = new Date(Date.UTC(2026, 10, 30, 8));
const pushed = benchReadings([1], benchRoute(V8).total, takenAt.toISOString());
const raws: RawReading[] = pushed.map((p) => ({
  stationId: p.stationId,
  value: p.value as number,
  unit: p.unit,
  ...(p.lubricant ? { lubricant: p.lubricant } : {}),
}));
const judged = evaluateReadings(raws, job.shape, spec);
const stored: StoredReading[] = pushed.map((p, i) => {
  const e = judged.get(p.stationId);
  const { unit: _u, ...ev } = storedEvaluation(typeof e === "object" ? e : null, p.unit, false);
  return {
    ...ev,
    id: p.id,
    shopId: 1,
    jobId: 1,
    stationId: p.stationId,
    characteristic: parseStationId(p.stationId).characteristic ?? "",
    valueCanonical: null,
    value: p.value as number,
    unit: p.unit,
    entryMode: "direct",
    dialSetting: null,
    dialDeviation: null,
    instrumentId: null,
    partTempC: null,
    gaugeTempC: null,
    lubricant: p.lubricant ?? null,
    skipped: false,
    skipReason: null,
    note: null,
    takenBy: 1,
    takenAt,
    receivedAt: new Date(i * 1000),
    deviceId: "bench",
    supersedes: null,
  };
});
const units = unitsOf("in");
const ctx: RowContext = {
  current: new Set(stored.map((r) => r.id)),
  instruments: new Map(),
  takers: new Map([[1, "Bench machinist"]]),
  decisions: new Map(),
};

const readingLines = () => stored.map((r) => csvLine(readingRow(r, units, ctx))).join("");
const derivedLines = () => derivedRows(job, raws, units, new Map()).map(csvLine).join("");

function cpuMsPerCall(label: string, fn: () => unknown, calls: number) {
  for (let i = 0; i < 20; i++) fn();
  const t0 = process.cpuUsage();
  for (let i = 0; i < calls; i++) fn();
  const t = process.cpuUsage(t0);
  console.log(
    `${label.padEnd(22)} ${((t.user + t.system) / 1000 / calls).toFixed(3)} ms CPU per call (${calls} calls)`,
  );
}

const calls = Number(process.argv[2] ?? 200);
console.log(
  `rows ${stored.length}, load average ${loadavg()
    .map((l) => l.toFixed(2))
    .join(" ")}`,
);
cpuMsPerCall("CSV rows", () => readingLines() + derivedLines(), calls);
cpuMsPerCall("  reading rows", readingLines, calls);
cpuMsPerCall("  derived rows", derivedLines, calls);
const rows = stored.map((r) => readingRow(r, units, ctx)); // the cells alone, for csvLine alone
cpuMsPerCall("  readingRow only", () => stored.map((r) => readingRow(r, units, ctx)), calls);
cpuMsPerCall("  csvLine only", () => rows.map(csvLine).join(""), calls);
