import "server-only";
import { Op, QueryTypes, type Transaction } from "sequelize";
import { Instrument, Reading } from "@/models";
import type { ServerReading } from "@/lib/schemas/sync";
import { getSequelize } from "./db";
import type { InstrumentInfo, ReadingFacts } from "./ingest-evaluate";

// Readings and the gauges they were taken with. Plain objects out; every query scoped by shop or
// by a job the caller has already checked belongs to the shop.

export type StoredReading = ReadingFacts & {
  shopId: number;
  jobId: number;
  characteristic: string;
  valueCanonical: number | null;
  entryMode: "direct" | "dial";
  dialSetting: number | null;
  dialDeviation: number | null;
  skipped: boolean;
  skipReason: string | null;
  note: string | null;
  takenBy: number;
  receivedAt: Date;
  deviceId: string;
  supersedes: string | null;
  verdict: "in_spec" | "marginal" | "out_of_spec" | null;
  verdictNote: string | null;
  limitMin: number | null;
  limitMax: number | null;
  deviation: number | null;
};
export type NewReading = Omit<StoredReading, "receivedAt"> & { receivedAt: Date };

function plain(r: Reading): StoredReading {
  const { valueEntered, unitEntered, createdAt: _c, updatedAt: _u, ...rest } = r.get({ plain: true });
  return { ...rest, value: valueEntered ?? null, unit: unitEntered } as StoredReading;
}

/**
 * Locks the jobs' rows (ascending id, so two batches never wait on each other in a circle) and
 * returns the ids that belong to the shop. Every writer of a job's readings or flags takes this
 * lock first, which serialises them per job.
 */
export async function lockJobs(t: Transaction, shopId: number, jobIds: number[]): Promise<Set<number>> {
  if (jobIds.length === 0) return new Set();
  const rows = await getSequelize().query<{ id: number }>(
    "SELECT id FROM jobs WHERE shop_id = ? AND id IN (?) ORDER BY id FOR UPDATE",
    { replacements: [shopId, [...new Set(jobIds)].sort((a, b) => a - b)], type: QueryTypes.SELECT, transaction: t },
  );
  return new Set(rows.map((r) => Number(r.id)));
}

/** Readings with these ids in ANY shop: a client id is global, so a clash must be seen to be refused. */
export async function findReadings(t: Transaction | undefined, ids: string[]): Promise<Map<string, StoredReading>> {
  if (ids.length === 0) return new Map();
  getSequelize();
  const rows = await Reading.findAll({ where: { id: { [Op.in]: ids } }, transaction: t });
  return new Map(rows.map((r) => [r.id, plain(r)]));
}

/** Every reading of a job, oldest first (takenAt, then arrival, then id: the core's "latest wins" order). */
export async function jobReadings(t: Transaction | undefined, jobId: number): Promise<StoredReading[]> {
  getSequelize();
  const rows = await Reading.findAll({
    where: { jobId },
    order: [["takenAt", "ASC"], ["receivedAt", "ASC"], ["id", "ASC"]],
    transaction: t,
    lock: t ? t.LOCK.SHARE : undefined,
  });
  return rows.map(plain);
}

/** The station's current figure: the latest reading with a value that no other reading corrects. */
export function currentReadings(all: StoredReading[]): StoredReading[] {
  const corrected = new Set(all.map((r) => r.supersedes).filter(Boolean));
  const latest = new Map<string, StoredReading>();
  for (const r of all) if (!r.skipped && r.value !== null && !corrected.has(r.id)) latest.set(r.stationId, r);
  return [...latest.values()];
}

export async function insertReadings(t: Transaction, rows: NewReading[]): Promise<void> {
  if (rows.length === 0) return;
  getSequelize();
  await Reading.bulkCreate(
    rows.map(({ value, unit, ...r }) => ({ ...r, valueEntered: value, unitEntered: unit })) as never[],
    { transaction: t, returning: false, hooks: false, validate: false },
  );
}

export async function updateEvaluation(
  t: Transaction,
  id: string,
  e: Pick<StoredReading, "verdict" | "verdictNote" | "limitMin" | "limitMax" | "deviation">,
): Promise<void> {
  getSequelize();
  await Reading.update(e, { where: { id }, transaction: t, hooks: false });
}

function toInstrument(i: Instrument): InstrumentInfo {
  return {
    id: i.id, shopId: i.shopId, kind: i.kind, label: i.label, serial: i.serial, unit: i.unit,
    resolution: Number(i.resolution), expandedU: Number(i.expandedU), coverageK: Number(i.coverageK ?? 2),
    calibrationDue: i.calibrationDue ?? null, dialPlusMeansSmaller: !!i.dialPlusMeansSmaller, active: !!i.active,
  };
}

/** The shop's gauges with these ids (other shops' ids are simply absent). */
export async function findInstruments(t: Transaction | undefined, shopId: number, ids: number[]): Promise<Map<number, InstrumentInfo>> {
  if (ids.length === 0) return new Map();
  getSequelize();
  const rows = await Instrument.findAll({ where: { shopId, id: { [Op.in]: [...new Set(ids)] } }, transaction: t });
  return new Map(rows.map((i) => [i.id, toInstrument(i)]));
}

export async function shopInstruments(shopId: number): Promise<InstrumentInfo[]> {
  getSequelize();
  const rows = await Instrument.findAll({ where: { shopId }, order: [["kind", "ASC"], ["label", "ASC"], ["id", "ASC"]] });
  return rows.map(toInstrument);
}

/** Readings with these ids within the given jobs (the feed's and the pack's view). */
export async function readingsOfJobs(jobIds: number[], ids?: string[]): Promise<StoredReading[]> {
  if (jobIds.length === 0 || ids?.length === 0) return [];
  getSequelize();
  const rows = await Reading.findAll({
    where: { jobId: { [Op.in]: jobIds }, ...(ids ? { id: { [Op.in]: ids } } : {}) },
    order: [["takenAt", "ASC"], ["receivedAt", "ASC"], ["id", "ASC"]],
  });
  return rows.map(plain);
}

/** For each id, the reading that corrects it (the latest one, when corrected more than once). */
export async function correctionsOf(ids: string[]): Promise<Map<string, string>> {
  if (ids.length === 0) return new Map();
  const rows = await getSequelize().query<{ id: string; supersedes: string }>(
    "SELECT id, supersedes FROM readings WHERE supersedes IN (?) ORDER BY taken_at, received_at, id",
    { replacements: [ids], type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.supersedes, r.id]));
}

const iso = (d: Date | string) => (d instanceof Date ? d : new Date(d)).toISOString();

export function toServerReading(r: StoredReading, supersededBy: string | null): ServerReading {
  return {
    id: r.id, jobId: r.jobId, stationId: r.stationId, characteristic: r.characteristic,
    value: r.value, unit: r.unit, valueCanonical: r.valueCanonical, entryMode: r.entryMode,
    dialSetting: r.dialSetting, dialDeviation: r.dialDeviation, instrumentId: r.instrumentId,
    partTempC: r.partTempC, gaugeTempC: r.gaugeTempC, lubricant: r.lubricant, skipped: r.skipped,
    skipReason: r.skipReason, note: r.note, supersedes: r.supersedes, supersededBy,
    takenAt: iso(r.takenAt), receivedAt: iso(r.receivedAt), takenBy: r.takenBy, deviceId: r.deviceId,
    verdict: r.verdict, verdictNote: r.verdictNote, limitMin: r.limitMin, limitMax: r.limitMax, deviation: r.deviation,
  };
}
