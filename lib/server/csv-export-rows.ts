import "server-only";
import {
  benchRoute, convertLength, convertTorque, deriveReadings, describeStation, CHARACTERISTICS,
  type CharacteristicId, type LengthUnit, type MeasureUnit, type RawReading, type TorqueUnit, type Verdict,
} from "@/lib/domain";
import { loadJobContext } from "./job-context";
import { listJobReadings, toRawReading, type ReadingRow } from "./jobs-admin-readings-repo";
import { toCsv, type Cell } from "./csv-export";

// GET /api/jobs/[jobId]/readings.csv: one row per current reading (per station) and per
// derived value that has a value, in bench order. With history, earlier readings of each
// station come first, marked superseded ("yes": a later reading, a correction or a re-measure,
// replaced it). Values, limits and deviations are in the job's units (the header says which:
// lengths in in or mm, torque in lbf·ft or N·m) and the unit column names the row's own unit.
// Verdicts, limits and deviations of readings are the server's stored ones.
const UNIT_WORDS: Record<MeasureUnit, string> = { in: "in", mm: "mm", lbf_ft: "lbf·ft", nm: "N·m" };
const VERDICT_TEXT: Record<Verdict, string> = { in_spec: "In spec", marginal: "Marginal", out_of_spec: "Out of spec" };

type Units = { length: LengthUnit; torque: TorqueUnit };

function converter(units: Units) {
  return (x: number | null | undefined, from: MeasureUnit): number | null => {
    if (x === null || x === undefined) return null;
    if (from === "in" || from === "mm") return from === units.length ? x : convertLength(x, from, units.length);
    return from === units.torque ? x : convertTorque(x, from, units.torque);
  };
}

const isTorqueUnit = (u: MeasureUnit) => u === "lbf_ft" || u === "nm";

function readingRow(r: ReadingRow, units: Units): Cell[] {
  const to = converter(units);
  const rowUnit = isTorqueUnit(r.unit) ? units.torque : units.length;
  const label = CHARACTERISTICS[r.characteristic as CharacteristicId]?.label ?? r.characteristic;
  let words = "";
  try { words = describeStation(r.stationId); } catch { /* an id the core no longer knows: leave the words out */ }
  return [
    "reading", r.stationId, words, label, to(r.value, r.unit), UNIT_WORDS[rowUnit], to(r.limitMin, r.unit), to(r.limitMax, r.unit),
    r.skipped ? "Skipped" : r.verdict ? VERDICT_TEXT[r.verdict] : "", to(r.deviation, r.unit),
    r.gaugeSerial, r.takenBy, r.takenAt, r.current ? "no" : "yes",
  ];
}

export async function readingsCsv(shopId: number, jobId: number, opts: { history?: boolean } = {}) {
  const ctx = await loadJobContext(shopId, jobId);
  const readings = await listJobReadings(shopId, jobId);
  const units: Units = ctx.job.unitSystem === "mm" ? { length: "mm", torque: "nm" } : { length: "in", torque: "lbf_ft" };
  const to = converter(units);
  let order = new Map<string, number>();
  let derivedRows: Cell[][] = [];
  try {
    order = new Map(benchRoute(ctx.shape).sections.flatMap((s) => s.stations).map((s, i) => [s.id, i]));
    const raw = readings.filter((r) => r.current).map(toRawReading).filter((r): r is RawReading => r !== null);
    derivedRows = deriveReadings(raw, ctx.shape, ctx.spec).filter((d) => typeof d.value === "number").map((d) => [
      "derived", d.stationId, describeStation(d.stationId), CHARACTERISTICS[d.characteristic].label, to(d.value, d.unit), UNIT_WORDS[units.length],
      d.limits ? to(d.limits.min, d.limits.unit) : null, d.limits ? to(d.limits.max, d.limits.unit) : null,
      d.verdict ? VERDICT_TEXT[d.verdict] : "", to(d.deviation, d.unit), "", "", "", "",
    ]);
  } catch {
    // An engine the core cannot lay out: readings still export, in the order they were taken.
  }
  const rank = (id: string) => order.get(id) ?? Number.MAX_SAFE_INTEGER;
  const picked = readings.filter((r) => r.current || opts.history).sort((a, b) => rank(a.stationId) - rank(b.stationId) || a.takenAt.localeCompare(b.takenAt));
  const u = `${UNIT_WORDS[units.length]} | ${UNIT_WORDS[units.torque]}`;
  const header = [
    "row", "station", "station (words)", "characteristic", `value (${u})`, "unit", `min (${u})`, `max (${u})`, "verdict",
    `deviation (${u})`, "gauge serial", "taken by", "taken at (UTC, ISO 8601)", "superseded?",
  ];
  return { csv: toCsv(header, [...picked.map((r) => readingRow(r, units)), ...derivedRows]), code: ctx.job.code };
}
