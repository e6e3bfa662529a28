import "server-only";
import { Op, QueryTypes, type Transaction } from "sequelize";
import type { GaugeStudy, Shop, User } from "@/models";
import type {
  GaugeStudySummary,
  GrrMeasurement,
  GrrResult,
  StudyThresholds,
  Type1Result,
} from "@/lib/domain/gauge-studies/types";
import type { GaugeStudyRecord, StudySettings } from "@/lib/schemas/gauge-studies";
import type { JsonObject, JsonValue } from "@/lib/schemas/json";
import type { StudyKind } from "@/lib/schemas/enums";
import { OPEN_JOB_STATUSES } from "@/lib/domain/job-lock";
import { getSequelize, models } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";

// Gauge studies: the feature's one door to the database, plain objects out. A study is kept as
// taken (never updated); a gauge's latest study is the one with the latest date, then the latest id.

const withPerformer = () => ({
  include: [{ model: models().User, as: "performer", attributes: ["id", "name"] }],
});

function summaryOf(s: GaugeStudy): GaugeStudySummary {
  return {
    kind: s.kind,
    performedOn: s.performedOn,
    dueOn: s.dueOn,
    repeatSd: s.repeatSd,
    bias: s.bias,
    ...(s.grrSd !== null && s.grrSd !== undefined ? { grrSd: s.grrSd } : {}),
    thresholds: s.thresholds as unknown as StudyThresholds,
  };
}

function reshape(s: GaugeStudy): GaugeStudyRecord {
  const performer = (s as GaugeStudy & { performer?: User | null }).performer;
  const type1 = s.kind === "type1";
  return {
    id: s.id,
    instrumentId: s.instrumentId,
    kind: s.kind,
    performedOn: s.performedOn,
    dueOn: s.dueOn,
    performedBy: { id: s.performedBy, name: performer?.name ?? "" },
    unit: s.unit,
    resolution: s.resolution,
    reference:
      type1 && s.referenceValue !== null
        ? { value: s.referenceValue, expandedU: s.referenceU ?? 0, coverageK: s.referenceK ?? 2 }
        : null,
    tolerance: s.tolerance ?? null,
    readings: type1 ? (s.measurements as number[]) : null,
    measurements: type1 ? null : (s.measurements as unknown as GrrMeasurement[]),
    appraisers: s.appraisers ?? null,
    passed: !!s.passed,
    summary: summaryOf(s),
    thresholds: s.thresholds as unknown as StudyThresholds,
    type1: type1 ? (s.result as unknown as Type1Result) : null,
    grr: type1 ? null : (s.result as unknown as GrrResult),
    createdAt: s.createdAt.toISOString(),
  };
}

/** The studies of one gauge of the shop, newest first; 404 for another shop's gauge. */
export async function listStudies(shopId: number, instrumentId: number): Promise<GaugeStudyRecord[]> {
  const gauge = await models().Instrument.findOne({ where: { id: instrumentId, shopId }, attributes: ["id"] });
  if (!gauge) throw notFound("Gauge");
  const rows = await models().GaugeStudy.findAll({
    where: { shopId, instrumentId },
    order: [
      ["performedOn", "DESC"],
      ["id", "DESC"],
    ],
    ...withPerformer(),
  });
  return rows.map(reshape);
}

/** Each named gauge's latest study (gauges without one are absent from the map). */
export async function latestStudies(
  shopId: number,
  instrumentIds: readonly number[],
  t?: Transaction,
): Promise<Map<number, GaugeStudyRecord>> {
  const latest = new Map<number, GaugeStudyRecord>();
  const ids = [...new Set(instrumentIds)];
  if (ids.length === 0) return latest;
  const rows = await models().GaugeStudy.findAll({
    where: { shopId, instrumentId: { [Op.in]: ids } },
    order: [
      ["performedOn", "DESC"],
      ["id", "DESC"],
    ],
    transaction: t,
    ...withPerformer(),
  });
  for (const row of rows) if (!latest.has(row.instrumentId)) latest.set(row.instrumentId, reshape(row));
  return latest;
}

/** Each named gauge's latest study as the verdict takes it. */
export async function latestSummaries(
  shopId: number,
  instrumentIds: readonly number[],
  t?: Transaction,
): Promise<Map<number, GaugeStudySummary>> {
  const latest = await latestStudies(shopId, instrumentIds, t);
  return new Map([...latest].map(([id, s]) => [id, s.summary]));
}

export type NewStudyRow = {
  instrumentId: number;
  kind: StudyKind;
  performedBy: number;
  performedOn: string;
  dueOn: string;
  unit: string;
  resolution: number;
  reference: { value: number; expandedU: number; coverageK: number } | null;
  tolerance: number | null;
  measurements: JsonValue[];
  appraisers: string[] | null;
  mean: number | null;
  repeatSd: number;
  bias: number;
  grrSd: number | null;
  passed: boolean;
  thresholds: StudyThresholds;
  result: Type1Result | GrrResult;
};

export async function insertStudy(t: Transaction, shopId: number, row: NewStudyRow): Promise<GaugeStudyRecord> {
  const { reference, thresholds, result, ...rest } = row;
  const created = await models().GaugeStudy.create(
    {
      ...rest,
      shopId,
      referenceValue: reference?.value ?? null,
      referenceU: reference?.expandedU ?? null,
      referenceK: reference?.coverageK ?? null,
      thresholds: thresholds as unknown as JsonObject,
      result: result as unknown as JsonObject,
    },
    { transaction: t },
  );
  const again = await models().GaugeStudy.findByPk(created.id, { transaction: t, ...withPerformer() });
  return reshape(again as GaugeStudy);
}

const settingsOf = (s: Shop): StudySettings => ({
  minCg: s.studyMinCg,
  minCgk: s.studyMinCgk,
  maxResolutionPct: s.studyMaxResolutionPct,
  maxGrrPct: s.studyMaxGrrPct,
  validMonths: s.studyValidMonths,
});

async function shopOrThrow(shopId: number, t?: Transaction): Promise<Shop> {
  const shop = await models().Shop.findByPk(shopId, { transaction: t });
  if (!shop) throw notFound("Shop");
  return shop;
}

/** The shop's study thresholds (every shop has them: the columns have defaults). */
export async function getStudySettings(shopId: number, t?: Transaction): Promise<StudySettings> {
  return settingsOf(await shopOrThrow(shopId, t));
}

/** Stores new thresholds; returns what was there before and what is there now. */
export async function saveStudySettings(
  t: Transaction,
  shopId: number,
  next: StudySettings,
): Promise<{ before: StudySettings; after: StudySettings }> {
  const shop = await shopOrThrow(shopId, t);
  const before = settingsOf(shop);
  await shop.update(
    {
      studyMinCg: next.minCg,
      studyMinCgk: next.minCgk,
      studyMaxResolutionPct: next.maxResolutionPct,
      studyMaxGrrPct: next.maxGrrPct,
      studyValidMonths: next.validMonths,
    },
    { transaction: t },
  );
  return { before, after: settingsOf(shop) };
}

/** What a study needs of its gauge: unit, step and setting master (404 for another shop's). */
export type StudyGauge = {
  id: number;
  label: string;
  serial: string;
  unit: string;
  resolution: number;
  active: boolean;
  master: { label: string | null; size: number; expandedU: number } | null;
};

export async function studyGaugeOrThrow(shopId: number, id: number, t?: Transaction): Promise<StudyGauge> {
  const g = await models().Instrument.findOne({ where: { id, shopId }, transaction: t });
  if (!g) throw notFound("Gauge");
  return {
    id: g.id,
    label: g.label,
    serial: g.serial,
    unit: g.unit,
    resolution: g.resolution,
    active: g.active,
    master:
      g.masterSize !== null && g.masterSize !== undefined
        ? { label: g.masterLabel ?? null, size: g.masterSize, expandedU: g.masterU ?? 0 }
        : null,
  };
}

// Jobs that still take readings: an open status and not locked (lib/domain/job-lock.ts says the same).
const OPEN_JOB = "j.status IN (:open) AND j.locked_at IS NULL";

/** The open jobs with readings taken with this gauge, by code. */
export async function openJobsUsingGauge(
  t: Transaction,
  shopId: number,
  instrumentId: number,
): Promise<{ id: number; code: string }[]> {
  const rows = await getSequelize().query<{ id: number; code: string }>(
    `SELECT DISTINCT j.id, j.code FROM readings r JOIN jobs j ON j.id = r.job_id
      WHERE r.shop_id = :shopId AND r.instrument_id = :instrumentId AND ${OPEN_JOB} ORDER BY j.code, j.id`,
    { replacements: { shopId, instrumentId, open: [...OPEN_JOB_STATUSES] }, type: QueryTypes.SELECT, transaction: t },
  );
  return rows.map((r) => ({ id: Number(r.id), code: String(r.code) }));
}

/**
 * The tightest tolerance T (upper − lower limit, in the reading's unit) of each characteristic this
 * gauge has judged on open jobs: the tolerances a study of it must answer for.
 */
export async function gaugeTolerances(
  t: Transaction,
  shopId: number,
  instrumentId: number,
): Promise<{ characteristic: string; unit: string; tolerance: number }[]> {
  const rows = await getSequelize().query<{ characteristic: string; unit: string; tolerance: unknown }>(
    `SELECT r.characteristic, r.unit_entered AS unit, MIN(r.limit_max - r.limit_min) AS tolerance
      FROM readings r JOIN jobs j ON j.id = r.job_id
      WHERE r.shop_id = :shopId AND r.instrument_id = :instrumentId AND ${OPEN_JOB}
        AND r.limit_min IS NOT NULL AND r.limit_max IS NOT NULL AND r.limit_max > r.limit_min
      GROUP BY r.characteristic, r.unit_entered ORDER BY r.characteristic, r.unit_entered`,
    { replacements: { shopId, instrumentId, open: [...OPEN_JOB_STATUSES] }, type: QueryTypes.SELECT, transaction: t },
  );
  return rows.map((r) => ({ characteristic: r.characteristic, unit: r.unit, tolerance: Number(r.tolerance) }));
}
