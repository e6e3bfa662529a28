// CPU of the pure core behind one job page (lib/server/jobs/detail.ts summarise), no database: a
// fully measured V8 (scripts/bench/sync-readings.ts) against the demo street spec, the same core
// calls the page makes, timed by process.cpuUsage over many calls. `npx tsx scripts/bench/job-page-cpu.ts [calls]`
import { loadavg } from "node:os";
import {
  AXES,
  BORE_DEPTHS,
  JOURNAL_POSITIONS,
  benchRoute,
  currentReadings,
  deckBanks,
  deriveReadings,
  evaluateReading,
  evaluateReadings,
  requiredProgress,
  requiredStationIds,
  rodJournalCount,
  type DerivedCharacteristic,
  type RawReading,
  type SpecLimit,
} from "@/lib/domain";
import { STREET_V8_INCH } from "../seed/demo-specs";
import { benchReadings, V8 } from "./sync-readings";

const spec = STREET_V8_INCH as SpecLimit[];
const takenAt = new Date(Date.UTC(2026, 10, 30, 8)).toISOString();
const pushed = benchReadings([1], benchRoute(V8).total, takenAt);
const stored = pushed.map((p, i) => ({ ...p, supersedes: null, skipped: false, receivedAt: new Date(i * 1000) }));
const raws: RawReading[] = pushed.map((p) => ({ stationId: p.stationId, value: p.value as number, unit: p.unit }));

function page() {
  const route = benchRoute(V8);
  const current = currentReadings(stored);
  const progress = requiredProgress(route, requiredStationIds(V8, spec, route), current);
  const derived = deriveReadings(raws, V8, spec);
  return progress.required + derived.length;
}

// The maps' core (lib/server/readings/maps.ts jobMaps): taper and out-of-round, and every bore,
// journal and deck figure judged; the figures judged one by one (as before the batch) and at once.
const onMaps = (id: string) => /^(bore|main|rod|deck)\//.test(id);
const mapStations = [
  ...(["bore", "main", "rod"] as const).flatMap((part) => {
    const count = part === "bore" ? V8.cylinders : part === "main" ? V8.mains : rodJournalCount(V8);
    const at = part === "bore" ? BORE_DEPTHS : JOURNAL_POSITIONS;
    return Array.from({ length: count }, (_, i) => at.flatMap((s) => AXES.map((a) => `${part}/${i + 1}/${s}/${a}`)));
  }),
  ...deckBanks(V8.layout).map((bank) => [`deck/${bank}/front`, `deck/${bank}/rear`]),
].flat();
const profileValues = (["bore", "main_journal", "rod_journal"] as const).flatMap((p) => [
  `${p}_taper` as DerivedCharacteristic,
  `${p}_out_of_round` as DerivedCharacteristic,
]);
const byStation = new Map(raws.map((r) => [r.stationId, r]));
function mapsCore(judge: (id: string) => unknown) {
  const derived = deriveReadings(raws, V8, spec, { characteristics: profileValues });
  return derived.length + mapStations.filter((id) => judge(id) !== undefined).length;
}
function mapsOneByOne() {
  return mapsCore((id) => {
    const raw = byStation.get(id);
    return raw && evaluateReading(raw, V8, spec, raws);
  });
}
function mapsBatch() {
  const judged = evaluateReadings(raws, V8, spec, { only: onMaps });
  return mapsCore((id) => judged.get(id));
}

function cpuMsPerCall(label: string, fn: () => unknown, calls: number) {
  for (let i = 0; i < 20; i++) fn();
  const t0 = process.cpuUsage();
  for (let i = 0; i < calls; i++) fn();
  const t = process.cpuUsage(t0);
  const ms = (t.user + t.system) / 1000 / calls;
  console.log(`${label.padEnd(22)} ${ms.toFixed(3)} ms CPU per call (${calls} calls)`);
}

const calls = Number(process.argv[2] ?? 200);
console.log(
  `readings ${raws.length}, load average ${loadavg()
    .map((l) => l.toFixed(2))
    .join(" ")}`,
);
cpuMsPerCall("job page core", page, calls);
cpuMsPerCall("  requiredStationIds", () => requiredStationIds(V8, spec, benchRoute(V8)), calls);
cpuMsPerCall("  deriveReadings", () => deriveReadings(raws, V8, spec), calls);
cpuMsPerCall("  currentReadings", () => currentReadings(stored), calls);
cpuMsPerCall("  benchRoute", () => benchRoute(V8), calls);
cpuMsPerCall("maps core, one by one", mapsOneByOne, calls);
cpuMsPerCall("maps core, batch", mapsBatch, calls);
cpuMsPerCall("  maps judging alone", () => evaluateReadings(raws, V8, spec, { only: onMaps }), calls);
