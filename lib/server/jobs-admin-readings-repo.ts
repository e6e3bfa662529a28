import "server-only";
import { Op, type Transaction } from "sequelize";
import { convertLength, convertTorque, type LengthUnit, type MeasureUnit, type RawReading, type TorqueUnit } from "@/lib/domain";
import { Instrument, Reading, User } from "@/models";
import { getSequelize } from "./db";

// A job's readings as the desk reads them. "Current" follows the sync contract: per station,
// the latest (by takenAt) reading that no other reading supersedes. Skipped stations have a
// current reading with no value; they do not count as measured.
export type ReadingRow = {
  id: string;
  stationId: string;
  characteristic: string;
  value: number | null;
  unit: MeasureUnit;
  skipped: boolean;
  verdict: "in_spec" | "marginal" | "out_of_spec" | null;
  verdictNote: string | null;
  limitMin: number | null;
  limitMax: number | null;
  deviation: number | null;
  partTempC: number | null;
  gaugeTempC: number | null;
  lubricant: string | null;
  gaugeSerial: string | null;
  gaugeU: { value: number; unit: string } | null;
  takenBy: string;
  takenAt: string;
  superseded: boolean;
  current: boolean;
};

const isLength = (u: string): u is LengthUnit => u === "in" || u === "mm";
const isTorque = (u: string): u is TorqueUnit => u === "lbf_ft" || u === "nm";

function reshape(r: Reading & { instrument?: Instrument | null; taker?: User }, superseded: boolean, current: boolean): ReadingRow {
  // The figure as entered is the one the machinist saw; the canonical one (mm, N·m) stands in
  // only when nothing was entered.
  const entered = r.valueEntered !== null && r.valueEntered !== undefined;
  const unit = (entered ? r.unitEntered : isTorque(r.unitEntered) ? "nm" : "mm") as MeasureUnit;
  return {
    id: r.id, stationId: r.stationId, characteristic: r.characteristic,
    value: r.skipped ? null : entered ? r.valueEntered : r.valueCanonical, unit,
    skipped: r.skipped, verdict: r.verdict ?? null, verdictNote: r.verdictNote ?? null,
    limitMin: r.limitMin, limitMax: r.limitMax, deviation: r.deviation,
    partTempC: r.partTempC, gaugeTempC: r.gaugeTempC ?? null, lubricant: r.lubricant ?? null,
    gaugeSerial: r.instrument?.serial ?? null,
    // U at k = 2 (a gauge certified at another k is rescaled), as the verdicts use it.
    gaugeU: r.instrument ? { value: (r.instrument.expandedU * 2) / (Number(r.instrument.coverageK) || 2), unit: r.instrument.unit } : null,
    takenBy: r.taker?.name ?? "", takenAt: r.takenAt.toISOString(), superseded, current,
  };
}

/** Every reading of a job, oldest first, each marked superseded and/or current. */
export async function listJobReadings(shopId: number, jobId: number, t?: Transaction): Promise<ReadingRow[]> {
  getSequelize();
  const rows = await Reading.findAll({
    where: { shopId, jobId },
    include: [
      { model: Instrument, as: "instrument", attributes: ["serial", "expandedU", "coverageK", "unit"] },
      { model: User, as: "taker", attributes: ["name"] },
    ],
    order: [["takenAt", "ASC"], ["receivedAt", "ASC"]],
    transaction: t,
  });
  const supersededIds = new Set(rows.map((r) => r.supersedes).filter((x): x is string => !!x));
  const latest = new Map<string, Reading>();
  for (const r of rows) if (!supersededIds.has(r.id)) latest.set(r.stationId, r); // ascending: the last one wins
  const currentIds = new Set([...latest.values()].map((r) => r.id));
  return rows.map((r) => reshape(r, supersededIds.has(r.id), currentIds.has(r.id)));
}

/** Per job, the stations whose current reading has a value (skips excluded). */
export async function measuredStations(shopId: number, jobIds: number[]): Promise<Map<number, Set<string>>> {
  getSequelize();
  const out = new Map<number, Set<string>>(jobIds.map((id) => [id, new Set()]));
  if (!jobIds.length) return out;
  const rows = await Reading.findAll({
    where: { shopId, jobId: { [Op.in]: jobIds } },
    attributes: ["id", "jobId", "stationId", "supersedes", "skipped", "takenAt"],
    order: [["takenAt", "ASC"], ["receivedAt", "ASC"]],
  });
  const supersededIds = new Set(rows.map((r) => r.supersedes).filter((x): x is string => !!x));
  const latest = new Map<string, Reading>();
  for (const r of rows) if (!supersededIds.has(r.id)) latest.set(`${r.jobId}|${r.stationId}`, r);
  for (const r of latest.values()) if (!r.skipped) out.get(r.jobId)?.add(r.stationId);
  return out;
}

/** A current reading in the core's shape, for deriveReadings (U converted to the reading's unit). */
export function toRawReading(r: ReadingRow): RawReading | null {
  if (r.value === null) return null;
  const out: RawReading = { stationId: r.stationId, value: r.value, unit: r.unit, takenAt: r.takenAt };
  if (r.partTempC !== null) out.temperatureC = r.partTempC;
  if (r.gaugeTempC !== null) out.gaugeTemperatureC = r.gaugeTempC;
  if (r.lubricant) out.lubricant = r.lubricant as RawReading["lubricant"];
  const u = r.gaugeU;
  if (u && isLength(u.unit) && isLength(r.unit)) out.uncertainty = convertLength(u.value, u.unit, r.unit);
  else if (u && isTorque(u.unit) && isTorque(r.unit)) out.uncertainty = convertTorque(u.value, u.unit, r.unit);
  return out;
}
