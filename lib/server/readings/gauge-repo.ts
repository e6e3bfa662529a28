import "server-only";
import type { Transaction } from "sequelize";
import { latestStudySql, studyFromSql } from "@/lib/server/gauge-studies/summary-sql";
import { sqlRows } from "@/lib/server/core/sql-driver";
import { readRows, type Read } from "@/lib/server/core/sql-read";
import { orNull, type InstrumentInfo } from "@/lib/server/sync/ingest-evaluate";

// The gauges readings are judged with, each with its latest study, read by SQL through the driver:
// in the sync batch's transaction or beside the office's other reads (sql-read.ts). The readings
// repo joins the same columns to a job's readings.

export const GAUGE_COLUMNS = `g.id AS gId, g.shop_id AS gShopId, g.kind AS gKind, g.label AS gLabel, g.serial AS gSerial,
  g.unit AS gUnit, g.resolution AS gResolution, g.expanded_u AS gExpandedU, g.coverage_k AS gCoverageK,
  g.range_min AS gRangeMin, g.range_max AS gRangeMax,
  g.calibration_due AS gCalibrationDue, g.dial_plus_means_smaller AS gDial, g.active AS gActive,
  ${latestStudySql("g")} AS gStudy`;

export function gaugeOf(row: Record<string, unknown>): InstrumentInfo {
  const due = row.gCalibrationDue;
  return {
    id: Number(row.gId),
    shopId: Number(row.gShopId),
    kind: String(row.gKind),
    label: String(row.gLabel),
    serial: String(row.gSerial),
    unit: String(row.gUnit),
    resolution: Number(row.gResolution),
    expandedU: Number(row.gExpandedU),
    coverageK: Number(row.gCoverageK ?? 2),
    rangeMin: orNull(row.gRangeMin),
    rangeMax: orNull(row.gRangeMax),
    calibrationDue:
      due === null || due === undefined
        ? null
        : due instanceof Date
          ? due.toISOString().slice(0, 10)
          : String(due).slice(0, 10),
    dialPlusMeansSmaller: !!row.gDial,
    active: !!row.gActive,
    study: studyFromSql(row.gStudy),
  };
}

/** A transaction's connection as a Read. */
const onTransaction =
  (t: Transaction): Read =>
  (sql, values, shape) =>
    sqlRows(t, sql, values, shape);

/** The shop's gauges with these ids (other shops' ids are simply absent). */
export async function findInstruments(
  t: Transaction | undefined,
  shopId: number,
  ids: number[],
): Promise<Map<number, InstrumentInfo>> {
  if (ids.length === 0) return new Map();
  const read = t ? onTransaction(t) : readRows;
  const rows = await read(`SELECT ${GAUGE_COLUMNS} FROM instruments g WHERE g.shop_id = ? AND g.id IN (?)`, [
    shopId,
    [...new Set(ids)],
  ]);
  return new Map(rows.map((row) => [Number(row.gId), gaugeOf(row)]));
}

/**
 * Every gauge of the shop by id, in label order, through `read`: a shop keeps tens, and reading
 * them all takes a third of the time of finding those a job's readings name among its readings.
 */
export async function shopGaugesOn(read: Read, shopId: number): Promise<Map<number, InstrumentInfo>> {
  const rows = await read(`SELECT ${GAUGE_COLUMNS} FROM instruments g WHERE g.shop_id = ? ORDER BY g.label`, [shopId]);
  return new Map(rows.map((row) => [Number(row.gId), gaugeOf(row)]));
}

/**
 * Every gauge of the shop, read in the batch's transaction: the readings name some, and a refusal
 * names the ones to pick instead.
 */
export const batchInstruments = (t: Transaction, shopId: number) => shopGaugesOn(onTransaction(t), shopId);

/** Every gauge of the shop by kind, then label (the bench's and the bearings' lists). */
export async function shopInstruments(shopId: number): Promise<InstrumentInfo[]> {
  const rows = await readRows(
    `SELECT ${GAUGE_COLUMNS} FROM instruments g WHERE g.shop_id = ? ORDER BY g.kind, g.label, g.id`,
    [shopId],
  );
  return rows.map(gaugeOf);
}
