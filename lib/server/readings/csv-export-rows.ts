import "server-only";
import {
  benchRoute,
  cleanDecimal,
  convertLength,
  convertTorque,
  characteristicWords,
  deriveReadings,
  stationWords,
  UNIT_WORDS,
  VERDICT_WORDS,
  type LengthUnit,
  type MeasureUnit,
  type TorqueUnit,
} from "@/lib/domain";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { loadJobReadings, type JobReadings } from "@/lib/server/jobs/readings";
import type { StoredReading } from "@/lib/schemas/readings";
import { toCsv, type Cell } from "@/lib/server/readings/csv-export";

// GET /api/jobs/[jobId]/readings.csv: one row per current reading (each station's current
// value, the rule flag reconciliation uses) and per derived value that has a value, in bench
// order. With history, every other reading is listed before the current one of its station and
// marked superseded? "yes" (corrected, measured again, or a skip). Values, limits and deviations are in the job's units (the header says which:
// lengths in in or mm, torque in lbf·ft or N·m) and the unit column names the row's own unit.
// Verdicts, limits and deviations of readings are the server's stored ones.

type Units = { length: LengthUnit; torque: TorqueUnit };

function converter(units: Units) {
  return (x: number | null | undefined, from: MeasureUnit): number | null => {
    if (x === null || x === undefined) return null;
    // Converted figures are cleaned of float noise (102.362 mm is 4.03 in, not 4.029999999999999).
    if (from === "in" || from === "mm")
      return from === units.length ? x : cleanDecimal(convertLength(x, from, units.length));
    return from === units.torque ? x : cleanDecimal(convertTorque(x, from, units.torque));
  };
}

const isTorqueUnit = (u: MeasureUnit) => u === "lbf_ft" || u === "nm";

function readingRow(r: StoredReading, units: Units, ctx: { current: Set<string>; data: JobReadings }): Cell[] {
  const to = converter(units);
  const unit = r.unit as MeasureUnit;
  const rowUnit = isTorqueUnit(unit) ? units.torque : units.length;
  const gauge = r.instrumentId ? ctx.data.instruments.get(r.instrumentId)?.serial : null;
  return [
    "reading",
    r.stationId,
    stationWords(r.stationId),
    characteristicWords(r.characteristic),
    r.skipped ? null : to(r.value, unit),
    UNIT_WORDS[rowUnit],
    to(r.limitMin, unit),
    to(r.limitMax, unit),
    r.skipped ? "Skipped" : r.verdict ? VERDICT_WORDS[r.verdict] : "",
    to(r.deviation, unit),
    gauge,
    ctx.data.takers.get(r.takenBy) ?? "",
    r.takenAt.toISOString(),
    ctx.current.has(r.id) ? "no" : "yes",
  ];
}

export async function readingsCsv(shopId: number, jobId: number, opts: { history?: boolean } = {}) {
  const ctx = await loadJobContext(shopId, jobId);
  const data = await loadJobReadings(shopId, jobId);
  const current = new Set(data.current.map((r) => r.id));
  const units: Units =
    ctx.job.unitSystem === "mm" ? { length: "mm", torque: "nm" } : { length: "in", torque: "lbf_ft" };
  const to = converter(units);
  let order = new Map<string, number>();
  let derivedRows: Cell[][] = [];
  try {
    order = new Map(
      benchRoute(ctx.shape)
        .sections.flatMap((s) => s.stations)
        .map((s, i) => [s.id, i]),
    );
    derivedRows = deriveReadings(data.raws, ctx.shape, ctx.spec)
      .filter((d) => typeof d.value === "number")
      .map((d) => [
        "derived",
        d.stationId,
        stationWords(d.stationId),
        characteristicWords(d.characteristic),
        to(d.value, d.unit),
        UNIT_WORDS[units.length],
        d.limits ? to(d.limits.min, d.limits.unit) : null,
        d.limits ? to(d.limits.max, d.limits.unit) : null,
        d.verdict ? VERDICT_WORDS[d.verdict] : "",
        to(d.deviation, d.unit),
        "",
        "",
        "",
        "",
      ]);
  } catch {
    // An engine the core cannot lay out: readings still export, in the order they were taken.
  }
  const rank = (id: string) => order.get(id) ?? Number.MAX_SAFE_INTEGER;
  // data.all is in taken order, and the sort is stable: earlier readings of a station come first.
  const picked = data.all
    .filter((r) => current.has(r.id) || opts.history)
    .sort((a, b) => rank(a.stationId) - rank(b.stationId));
  const u = `${UNIT_WORDS[units.length]} | ${UNIT_WORDS[units.torque]}`;
  const header = [
    "row",
    "station",
    "station (words)",
    "characteristic",
    `value (${u})`,
    "unit",
    `min (${u})`,
    `max (${u})`,
    "verdict",
    `deviation (${u})`,
    "gauge serial",
    "taken by",
    "taken at (UTC, ISO 8601)",
    "superseded?",
  ];
  return {
    csv: toCsv(header, [...picked.map((r) => readingRow(r, units, { current, data })), ...derivedRows]),
    code: ctx.job.code,
  };
}
