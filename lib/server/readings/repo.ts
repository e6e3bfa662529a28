import "server-only";
import type { Transaction } from "sequelize";
import { correctedBy, currentPicker } from "@/lib/domain";
import { READING_COLUMNS, READING_FIELDS, type ReadingField, type StoredReading } from "@/lib/schemas/readings";
import { causalRows } from "@/lib/server/core/cluster";
import { settleAll, sqlRows, sqlWrite, utcDate, utcText } from "@/lib/server/core/sql-driver";
import { readRows, withReads, type Read, type Stream } from "@/lib/server/core/sql-read";
import { insertMany } from "@/lib/server/core/sql-insert";
import type { InstrumentInfo } from "@/lib/server/sync/ingest-evaluate";
import { batchInstruments, shopGaugesOn } from "@/lib/server/readings/gauge-repo";

// Readings and the gauges they were taken with. Plain objects out; every query scoped by shop or
// by a job the caller has already checked belongs to the shop.

// Raw SQL for the hot paths of ingest and reconciliation: model instances cost more than the
// queries here (bench:sync), and these rows only ever travel as plain objects. Columns and field
// names come from the map the model uses too (lib/schemas/readings.ts).
const COLUMNS = READING_FIELDS.map((k) => READING_COLUMNS[k]).join(", ");
const ORDER = "ORDER BY taken_at, received_at, id";

// A reading's cells in READING_FIELDS' order (the select list's), by field.
const AT = Object.fromEntries(READING_FIELDS.map((k, i) => [k, i])) as Record<ReadingField, number>;
// DECIMAL cells come as numbers (sql-driver.ts), or as text should the driver change its mind.
const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

/**
 * A reading from its row's cells (sql-driver.ts's "cells" shape): one object literal, so every
 * reading has the same shape. The type checks that no field is left out.
 */
function fromCells(a: unknown[]): StoredReading {
  return {
    id: a[AT.id] as string,
    shopId: Number(a[AT.shopId]),
    jobId: Number(a[AT.jobId]),
    stationId: a[AT.stationId] as string,
    characteristic: a[AT.characteristic] as string,
    valueCanonical: num(a[AT.valueCanonical]),
    value: num(a[AT.value]),
    unit: a[AT.unit] as string,
    entryMode: a[AT.entryMode] as StoredReading["entryMode"],
    dialSetting: num(a[AT.dialSetting]),
    dialDeviation: num(a[AT.dialDeviation]),
    instrumentId: num(a[AT.instrumentId]),
    partTempC: num(a[AT.partTempC]),
    gaugeTempC: num(a[AT.gaugeTempC]),
    lubricant: a[AT.lubricant] as string | null,
    skipped: !!a[AT.skipped],
    skipReason: a[AT.skipReason] as string | null,
    note: a[AT.note] as string | null,
    takenBy: Number(a[AT.takenBy]),
    takenAt: utcDate(a[AT.takenAt]) as Date,
    receivedAt: utcDate(a[AT.receivedAt]) as Date,
    deviceId: a[AT.deviceId] as string,
    supersedes: a[AT.supersedes] as string | null,
    verdict: a[AT.verdict] as StoredReading["verdict"],
    verdictNote: a[AT.verdictNote] as string | null,
    limitMin: num(a[AT.limitMin]),
    limitMax: num(a[AT.limitMax]),
    deviation: num(a[AT.deviation]),
  };
}

/**
 * Inside a transaction on its own driver connection (the sync hot path), else on a pooled one
 * (sql-read.ts: the office's reads, the feed and the CSV).
 */
async function selectReadings(
  where: string,
  replacements: unknown[],
  t?: Transaction,
  tail = "", // a lock or a LIMIT after the order
): Promise<StoredReading[]> {
  const sql = `SELECT ${COLUMNS} FROM readings WHERE ${where} ${ORDER}${tail}`;
  const rows = t
    ? await sqlRows<unknown[]>(t, sql, replacements, "cells")
    : await readRows<unknown[]>(sql, replacements, "cells");
  return rows.map(fromCells);
}

/**
 * Locks the jobs' rows (ascending id, so two batches never wait on each other in a circle) and
 * returns the ids that belong to the shop. Every writer of a job's readings or flags takes this
 * lock first, which serialises them per job.
 */
export async function lockJobs(t: Transaction, shopId: number, jobIds: number[]): Promise<Set<number>> {
  return new Set((await lockJobRevisions(t, shopId, jobIds)).keys());
}

/**
 * lockJobs, returning each locked job's context_revision (as text: it is a 64-bit token). Read
 * under the row lock, so it is the latest committed token and cannot change until we commit. On a
 * cluster the lock holds on this node only, so the read is causal (core/cluster.ts): it first waits
 * for every commit made through another node (a limits edit a moment ago), and this transaction's
 * later reads see them too.
 */
export async function lockJobRevisions(t: Transaction, shopId: number, jobIds: number[]): Promise<Map<number, string>> {
  if (jobIds.length === 0) return new Map();
  const rows = await causalRows<{ id: number; revision: string }>(
    t,
    "SELECT id, CAST(context_revision AS CHAR) AS revision FROM jobs WHERE shop_id = ? AND id IN (?) ORDER BY id FOR UPDATE",
    [shopId, [...new Set(jobIds)].sort((a, b) => a - b)],
  );
  return new Map(rows.map((r) => [Number(r.id), String(r.revision)]));
}

/** Readings with these ids in ANY shop: a client id is global, so a clash must be seen to be refused. */
export async function findReadings(t: Transaction | undefined, ids: string[]): Promise<Map<string, StoredReading>> {
  if (ids.length === 0) return new Map();
  const rows = await selectReadings("id IN (?)", [ids], t);
  return new Map(rows.map((r) => [r.id, r]));
}

/**
 * Every reading of a job, oldest first (takenAt, then arrival, then id: the core's "latest wins"
 * order). `locking`: read the latest committed rows whatever snapshot the caller's transaction
 * already holds (a limits edit may have read before it locked the job). A transaction whose first
 * statement locked the job row needs no locking read: its snapshot starts after the lock.
 */
export async function jobReadings(t: Transaction | undefined, jobId: number, locking = true): Promise<StoredReading[]> {
  return selectReadings("job_id = ?", [jobId], t, t && locking ? " LOCK IN SHARE MODE" : "");
}

/** Readings in jobReadings' order: time taken, then arrival, then id. */
function byTaken(a: StoredReading, b: StoredReading): number {
  const taken = a.takenAt.getTime() - b.takenAt.getTime();
  if (taken) return taken;
  const received = a.receivedAt.getTime() - b.receivedAt.getTime();
  return received || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
}

/**
 * Each station's current reading of a job (lib/domain's currentPicker), oldest first, holding only
 * one reading per station whatever the job's history: the ids other readings replace are read
 * first, then the job's rows stream past. In one round trip on `read`'s connection. (Ranking the
 * rows in SQL took twice as long as reading them all: a window, an anti-join and a sort.)
 */
export async function currentJobReadings(jobId: number, read?: Read, stream?: Stream): Promise<StoredReading[]> {
  if (!read || !stream) return withReads((r, s) => currentJobReadings(jobId, r, s));
  const replaced = read<{ supersedes: string }>(
    "SELECT supersedes FROM readings WHERE job_id = ? AND supersedes IS NOT NULL",
    [jobId],
  );
  const rows = stream<unknown[]>(`SELECT ${COLUMNS} FROM readings WHERE job_id = ?`, [jobId], "cells");
  let gone: Set<string>;
  try {
    gone = new Set((await replaced).map((r) => r.supersedes));
  } catch (e) {
    rows.close();
    throw e;
  }
  const pick = currentPicker<StoredReading>(gone);
  await rows.each((row) => pick.offer(fromCells(row)));
  return [...pick.current.values()].sort(byTaken);
}

/** A page of a job's readings at these stations, oldest first (jobReadings' order), after `from`. */
export async function jobReadingPage(
  jobId: number,
  stations: string[],
  from: StoredReading | null,
  limit: number,
): Promise<StoredReading[]> {
  if (!from) return selectReadings("job_id = ? AND station_id IN (?)", [jobId, stations], undefined, ` LIMIT ${limit}`);
  const [taken, received] = [utcText(from.takenAt), utcText(from.receivedAt)];
  return selectReadings(
    `job_id = ? AND station_id IN (?)
      AND (taken_at > ? OR (taken_at = ? AND (received_at > ? OR (received_at = ? AND id > ?))))`,
    [jobId, stations, taken, taken, received, received, from.id],
    undefined,
    ` LIMIT ${limit}`,
  );
}

/**
 * A job's readings, in no set order (its users pick each station's current reading by the core's
 * rule, which no order changes; sorting a job's whole rows was a third of the statement's time), and
 * the shop's gauges, issued at once on `read`'s connection (sql-read.ts) beside the caller's other
 * reads: the office's job page and maps, one round trip in all.
 */
export async function jobReadingsOn(
  read: Read,
  shopId: number,
  jobId: number,
): Promise<{ readings: StoredReading[]; instruments: Map<number, InstrumentInfo> }> {
  const [rows, instruments] = await settleAll([
    read<unknown[]>(`SELECT ${COLUMNS} FROM readings WHERE job_id = ?`, [jobId], "cells"),
    shopGaugesOn(read, shopId),
  ]);
  return { readings: rows.map(fromCells), instruments };
}

/**
 * jobReadings and the shop's gauges (those its readings were taken with among them), issued
 * together on the transaction (reconciliation's hot path), or with the gauges the caller already
 * read in it (ingest reads them for its checks); with `stations`, only the readings at those
 * stations (a station's current figure depends on its own readings only: a correction is always
 * taken at the station it corrects).
 */
export async function jobReadingsWithGauges(
  t: Transaction,
  shopId: number,
  jobId: number,
  opts: { locking?: boolean; stations?: readonly string[]; gauges?: Map<number, InstrumentInfo> } = {},
) {
  const { locking = true, stations, gauges } = opts;
  if (stations?.length === 0) return { readings: [], instruments: new Map<number, InstrumentInfo>() };
  const where = stations ? "job_id = ? AND station_id IN (?)" : "job_id = ?";
  const [readings, instruments] = await settleAll([
    selectReadings(where, stations ? [jobId, stations] : [jobId], t, locking ? " LOCK IN SHARE MODE" : ""),
    gauges ? Promise.resolve(gauges) : batchInstruments(t, shopId),
  ]);
  return { readings, instruments };
}

const INSERT_COLUMNS = [...READING_FIELDS.map((k) => READING_COLUMNS[k]), "created_at", "updated_at"];

/** One multi-row INSERT; rows must already be in foreign-key order (a correction after its target). */
export async function insertReadings(t: Transaction, rows: StoredReading[]): Promise<void> {
  const now = new Date();
  await insertMany(
    t,
    "readings",
    INSERT_COLUMNS,
    rows.map((r) => [...READING_FIELDS.map((k) => r[k]), now, now]),
  );
}

const EVALUATION_FIELDS = ["verdict", "verdictNote", "limitMin", "limitMax", "deviation"] as const;
const SET_EVALUATION = EVALUATION_FIELDS.map((k) => `${READING_COLUMNS[k]} = ?`).join(", ");
const UPDATE_EVALUATION = `UPDATE readings SET ${SET_EVALUATION}, updated_at = ? WHERE id = ?`;

export async function updateEvaluation(
  t: Transaction,
  id: string,
  e: Pick<StoredReading, (typeof EVALUATION_FIELDS)[number]>,
): Promise<void> {
  await sqlWrite(t, UPDATE_EVALUATION, [...EVALUATION_FIELDS.map((k) => e[k]), new Date(), id]);
}

/** Readings with these ids within the given jobs (the feed's and the pack's view). */
export async function readingsOfJobs(jobIds: number[], ids?: string[]): Promise<StoredReading[]> {
  if (jobIds.length === 0 || ids?.length === 0) return [];
  return ids ? selectReadings("job_id IN (?) AND id IN (?)", [jobIds, ids]) : selectReadings("job_id IN (?)", [jobIds]);
}

/**
 * For each id, the reading that corrects it (lib/domain's correctedBy picks one when several do).
 * A correction is always of its own job (the ingest refuses one across jobs), so the corrections
 * are read per job, through (job_id, supersedes): an IN list of ids on supersedes alone is planned
 * as a scan of every reading once it is long (see migrations/20261205020000).
 */
export async function correctionsOf(jobIds: number[], ids: string[]): Promise<Map<string, string>> {
  if (jobIds.length === 0 || ids.length === 0) return new Map();
  const rows = await readRows<{ id: string; stationId: string; supersedes: string; takenAt: unknown }>(
    `SELECT id, station_id AS stationId, supersedes, taken_at AS takenAt FROM readings
      WHERE job_id IN (?) AND supersedes IS NOT NULL`,
    [jobIds],
  );
  const wanted = new Set(ids);
  return correctedBy(
    rows.filter((r) => wanted.has(r.supersedes)).map((r) => ({ ...r, takenAt: utcDate(r.takenAt) as Date })),
  );
}
