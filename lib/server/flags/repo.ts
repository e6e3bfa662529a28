import "server-only";
import { type InferAttributes, type Transaction } from "sequelize";
import type { Disposition } from "@/lib/schemas/enums";
import type { FlagListQuery } from "@/lib/schemas/flag";
import { type Flag, type FlagDisposition, type Instrument, type Job, type Reading, type User } from "@/models";
import { models } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";
import { settleAll } from "@/lib/server/core/sql-driver";
import { fromSql } from "@/lib/server/flags/flag-row";
import { readRows, withReads, type Read } from "@/lib/server/core/sql-read";

// The lead's flags: the feature's one door to the database. The queue is filtered, sorted and
// paginated in the database; a decision appends its history row and sets the flag's latest one.
// Plain objects out.

export type StoredFlag = InferAttributes<Flag>;
type Named = Pick<InferAttributes<User>, "id" | "name">;
/** A flag with its job, its reading's gauge and taker, and who decided it last. */
export type LoadedFlag = StoredFlag & {
  job?: Pick<InferAttributes<Job>, "id" | "code" | "title" | "status" | "unitSystem" | "lockedAt">;
  disposer?: Named | null;
  reading?:
    | (Pick<InferAttributes<Reading>, "id" | "takenAt" | "instrumentId" | "takenBy"> & {
        instrument?: Pick<InferAttributes<Instrument>, "id" | "label" | "serial" | "calibrationDue"> | null;
        taker?: Named;
      })
    | null;
};

const plain = <T>(row: { get(o: { plain: true }): object }) => row.get({ plain: true }) as T;

const STATES: Record<FlagListQuery["state"], string> = {
  open: "f.state = 'open'",
  disposed: "f.state = 'disposed'",
  active: "f.state IN ('open', 'disposed')",
  closed: "f.state = 'closed'",
  all: "TRUE",
};

function whereOf(shopId: number, q: FlagListQuery): { sql: string; values: unknown[] } {
  const parts = ["f.shop_id = ?", STATES[q.state]];
  const values: unknown[] = [shopId];
  const add = (sql: string, v: unknown) => (parts.push(sql), values.push(v));
  if (q.job) add("f.job_id = ?", q.job);
  if (q.verdict) add("f.verdict = ?", q.verdict);
  if (q.reason) add("f.reason = ?", q.reason);
  return { sql: parts.join(" AND "), values };
}

// Each sort is walked along its own index (migration 20261205010000), forwards for one direction
// and backwards for the other, tie-breakers included, so a page reads only its own rows. ENUMs sort
// by their position (marginal < out_of_spec, open < disposed < closed): an enum sort's forward walk
// is "worst first, oldest first". Age grows as the judged time falls: its forward walk is oldest first.
type Key = [column: string, dir: "ASC" | "DESC"];
const SORT_INDEX: Record<FlagListQuery["sort"], { forward: FlagListQuery["dir"]; keys: Key[] }> = {
  age: { forward: "desc", keys: [["f.judged_at", "ASC"]] },
  job: {
    forward: "asc",
    keys: [
      ["f.job_code", "ASC"],
      ["f.station_id", "ASC"],
    ],
  },
  station: { forward: "asc", keys: [["f.station_id", "ASC"]] },
  value: { forward: "asc", keys: [["f.value", "ASC"]] },
  deviation: { forward: "asc", keys: [["f.deviation", "ASC"]] },
  verdict: {
    forward: "desc",
    keys: [
      ["f.verdict", "DESC"],
      ["f.judged_at", "ASC"],
    ],
  },
  reason: {
    forward: "desc",
    keys: [
      ["f.reason", "DESC"],
      ["f.judged_at", "ASC"],
    ],
  },
  state: {
    forward: "desc",
    keys: [
      ["f.state", "DESC"],
      ["f.judged_at", "ASC"],
    ],
  },
};

function orderOf(q: FlagListQuery): string {
  const { forward, keys } = SORT_INDEX[q.sort];
  const turn = (d: "ASC" | "DESC") => (q.dir === forward ? d : d === "ASC" ? "DESC" : "ASC");
  return [...keys, ["f.id", "ASC"] as Key].map(([k, d]) => `${k} ${turn(d)}`).join(", ");
}

// A flag with its job, its reading's gauge and taker and who decided it last, read straight on the
// driver (core/sql-read.ts): plain rows, mapped to LoadedFlag below.
const FLAG_SELECT = `SELECT f.id, f.shop_id, f.job_id, f.reading_id, f.derived_key, f.station_id, f.characteristic,
    f.value, f.unit, f.limit_min, f.limit_max, f.deviation, f.verdict, f.reason, f.state, f.disposition,
    f.operation, f.disposition_reason, f.disposed_by, f.disposed_at, f.closed_at, f.closed_by_reading_id,
    f.judged_at, f.job_code, f.created_at, f.updated_at,
    j.id AS j_id, j.code AS j_code, j.title AS j_title, j.status AS j_status, j.unit_system AS j_unit_system,
    j.locked_at AS j_locked_at, d.name AS d_name, r.id AS r_id, r.taken_at AS r_taken_at,
    r.instrument_id AS r_instrument_id, r.taken_by AS r_taken_by, i.id AS i_id, i.label AS i_label,
    i.serial AS i_serial, i.calibration_due AS i_calibration_due, t.id AS t_id, t.name AS t_name
  FROM flags f LEFT JOIN jobs j ON j.id = f.job_id LEFT JOIN users d ON d.id = f.disposed_by
    LEFT JOIN readings r ON r.id = f.reading_id LEFT JOIN instruments i ON i.id = r.instrument_id
    LEFT JOIN users t ON t.id = r.taken_by`;

/** One page of the shop's flags matching `q`, and how many match in all (both read in one go). */
export async function flagPage(shopId: number, q: FlagListQuery): Promise<{ total: number; rows: LoadedFlag[] }> {
  const where = whereOf(shopId, q);
  const [[count], rows] = await withReads((read) =>
    settleAll([
      read<{ n: number }>(`SELECT COUNT(*) AS n FROM flags f WHERE ${where.sql}`, where.values),
      read(`${FLAG_SELECT} WHERE ${where.sql} ORDER BY ${orderOf(q)} LIMIT ? OFFSET ?`, [
        ...where.values,
        q.pageSize,
        (q.page - 1) * q.pageSize,
      ]),
    ]),
  );
  return { total: Number(count?.n ?? 0), rows: rows.map(fromSql) };
}

/** A flag of this shop with its job, gauge, taker and disposer; 404 for any other shop's. */
export async function getFlagOrThrow(
  shopId: number,
  flagId: number,
): Promise<LoadedFlag & { job: NonNullable<LoadedFlag["job"]> }> {
  const [row] = await readRows(`${FLAG_SELECT} WHERE f.id = ? AND f.shop_id = ?`, [flagId, shopId]);
  const loaded = row ? fromSql(row) : null;
  if (!loaded?.job) throw notFound("Flag");
  return loaded as LoadedFlag & { job: NonNullable<LoadedFlag["job"]> };
}

/** Names of these users, by id. */
export async function userNames(ids: number[]): Promise<Map<number, string>> {
  if (!ids.length) return new Map();
  const users = await models().User.findAll({ where: { id: [...new Set(ids)] }, attributes: ["id", "name"] });
  return new Map(users.map((u) => [u.id, u.name]));
}

/** Every decision taken on a flag, oldest first, with the name of who took it. */
export async function dispositionRows(
  flagId: number,
): Promise<(InferAttributes<FlagDisposition> & { user?: Named })[]> {
  const { FlagDisposition, User } = models();
  const rows = await FlagDisposition.findAll({
    where: { flagId },
    include: [{ model: User, as: "user", attributes: ["id", "name"] }],
    order: [
      ["createdAt", "ASC"],
      ["id", "ASC"],
    ],
  });
  return rows.map((d) => plain(d));
}

/**
 * The job and the flag a decision is about, read inside `t` once the caller holds the job row's
 * lock; the flag's row is locked too. Null when either is not this shop's.
 */
export async function decisionTarget(t: Transaction, shopId: number, jobId: number, flagId: number) {
  const { Flag, Job } = models();
  const job = await Job.findOne({ where: { id: jobId, shopId }, transaction: t });
  const flag = await Flag.findOne({ where: { id: flagId, shopId }, transaction: t, lock: t.LOCK.UPDATE });
  return job && flag ? { job: plain<InferAttributes<Job>>(job), flag: plain<StoredFlag>(flag) } : null;
}

/** Appends a decision to the flag's history and makes it the flag's latest; returns the flag as it now is. */
export async function recordDecision(
  t: Transaction,
  flag: StoredFlag,
  d: { disposition: Disposition; operation: string | null; reason: string | null; userId: number },
): Promise<{ dispositionId: number; flag: StoredFlag }> {
  const { Flag, FlagDisposition } = models();
  const row = await FlagDisposition.create({ flagId: flag.id, ...d }, { transaction: t });
  const patch = {
    state: "disposed" as const,
    disposition: d.disposition,
    operation: d.operation,
    dispositionReason: d.reason,
    disposedBy: d.userId,
    disposedAt: row.createdAt,
  };
  await Flag.update(patch, { where: { id: flag.id }, transaction: t });
  return { dispositionId: row.id, flag: { ...flag, ...patch } };
}

/** A flag of a job with its latest decision (the readings CSV's decision column). */
export type FlagDecisionRow = {
  id: number;
  readingId: string | null;
  derivedKey: string | null;
  state: string;
  disposition: string | null;
  operation: string | null;
};

/**
 * How a job's own flags are read: through the job's index alone. Left to itself, MariaDB also
 * builds a row filter from an index led by shop_id, which reads every flag of the shop: a
 * job's few dozen flags then cost as much as the shop's thousands (1.5 ms at a million readings).
 * The shop is still checked on each of the job's rows.
 */
export const JOB_FLAGS_INDEX = "USE INDEX (flags_job_station)";

/**
 * The job's flags, oldest first, of these readings (or of all its readings), and with `derived`, of
 * its computed values too: one statement (the CSV reads them with each page of readings).
 */
export async function flagDecisions(
  shopId: number,
  jobId: number,
  readingIds: string[] | "all",
  derived = false,
  read: Read = readRows,
): Promise<FlagDecisionRow[]> {
  const some = Array.isArray(readingIds) && readingIds.length > 0;
  const of = [
    ...(readingIds === "all" ? ["reading_id IS NOT NULL"] : some ? ["reading_id IN (?)"] : []),
    ...(derived ? ["derived_key IS NOT NULL"] : []),
  ];
  if (!of.length) return [];
  return read<FlagDecisionRow>(
    `SELECT id, reading_id AS readingId, derived_key AS derivedKey, state, disposition, operation
      FROM flags ${JOB_FLAGS_INDEX} WHERE shop_id = ? AND job_id = ? AND (${of.join(" OR ")}) ORDER BY id`,
    [shopId, jobId, ...(some ? [readingIds] : [])],
  );
}
