import "server-only";
import { Op, type InferAttributes, type Order, type Transaction, type WhereOptions } from "sequelize";
import type { Disposition } from "@/lib/schemas/enums";
import type { FlagListQuery } from "@/lib/schemas/flag";
import {
  decimalToNumber,
  type Flag,
  type FlagDisposition,
  type Instrument,
  type Job,
  type Reading,
  type User,
} from "@/models";
import { models } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";

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

const flagIncludes = () => {
  const { Instrument, Job, Reading, User } = models();
  return [
    { model: Job, as: "job", attributes: ["id", "code", "title", "status", "unitSystem", "lockedAt"] },
    { model: User, as: "disposer", attributes: ["id", "name"] },
    {
      model: Reading,
      as: "reading",
      attributes: ["id", "takenAt", "instrumentId", "takenBy"],
      include: [
        { model: Instrument, as: "instrument", attributes: ["id", "label", "serial", "calibrationDue"] },
        { model: User, as: "taker", attributes: ["id", "name"] },
      ],
    },
  ];
};

const STATES: Record<FlagListQuery["state"], string[] | null> = {
  open: ["open"],
  disposed: ["disposed"],
  active: ["open", "disposed"],
  closed: ["closed"],
  all: null,
};

function whereOf(shopId: number, q: FlagListQuery): WhereOptions {
  const states = STATES[q.state];
  return {
    shopId,
    ...(states ? { state: { [Op.in]: states } } : {}),
    ...(q.job ? { jobId: q.job } : {}),
    ...(q.verdict ? { verdict: q.verdict } : {}),
    ...(q.reason ? { reason: q.reason } : {}),
  };
}

// Each sort is walked along its own index (migration 20261205010000), forwards for one direction
// and backwards for the other, tie-breakers included, so a page reads only its own rows. ENUMs sort
// by their position (marginal < out_of_spec, open < disposed < closed): an enum sort's forward walk
// is "worst first, oldest first". Age grows as the judged time falls: its forward walk is oldest first.
const SORT_INDEX: Record<FlagListQuery["sort"], { forward: FlagListQuery["dir"]; keys: [string, "ASC" | "DESC"][] }> = {
  age: { forward: "desc", keys: [["judgedAt", "ASC"]] },
  job: {
    forward: "asc",
    keys: [
      ["jobCode", "ASC"],
      ["stationId", "ASC"],
    ],
  },
  station: { forward: "asc", keys: [["stationId", "ASC"]] },
  value: { forward: "asc", keys: [["value", "ASC"]] },
  deviation: { forward: "asc", keys: [["deviation", "ASC"]] },
  verdict: {
    forward: "desc",
    keys: [
      ["verdict", "DESC"],
      ["judgedAt", "ASC"],
    ],
  },
  reason: {
    forward: "desc",
    keys: [
      ["reason", "DESC"],
      ["judgedAt", "ASC"],
    ],
  },
  state: {
    forward: "desc",
    keys: [
      ["state", "DESC"],
      ["judgedAt", "ASC"],
    ],
  },
};

function orderOf(q: FlagListQuery): Order {
  const { forward, keys } = SORT_INDEX[q.sort];
  const turn = (d: "ASC" | "DESC") => (q.dir === forward ? d : d === "ASC" ? "DESC" : "ASC");
  return [...keys, ["id", "ASC"] as const].map(([k, d]) => [k, turn(d)]) as Order;
}

/** One page of the shop's flags matching `q`, and how many match in all. */
export async function flagPage(shopId: number, q: FlagListQuery): Promise<{ total: number; rows: LoadedFlag[] }> {
  const { Flag } = models();
  const where = whereOf(shopId, q);
  const [total, rows] = await Promise.all([
    Flag.count({ where }),
    Flag.findAll({
      where,
      include: flagIncludes(),
      order: orderOf(q),
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
      // Plain nested rows: building model instances for each include cost most of a page's CPU.
      raw: true,
      nest: true,
    }),
  ]);
  return { total, rows: rows.map((r) => fromRaw(r as unknown as Nested)) };
}

type Row = Record<string, unknown> & { id: unknown };
type Nested = Row & { job: Row; disposer: Row; reading: Row & { instrument: Row; taker: Row } };
const FLAG_DECIMALS = ["value", "limitMin", "limitMax", "deviation"] as const;
// A left join that found no row comes back from `nest` as an object of nulls.
const found = <T extends Row>(o: T): T | null => (o.id == null ? null : o);

function fromRaw(row: Nested): LoadedFlag {
  const reading = found(row.reading);
  const out: Record<string, unknown> = {
    ...row,
    job: found(row.job),
    disposer: found(row.disposer),
    reading: reading && { ...reading, instrument: found(reading.instrument), taker: found(reading.taker) },
  };
  for (const k of FLAG_DECIMALS) out[k] = decimalToNumber(row[k]);
  return out as unknown as LoadedFlag;
}

/** A flag of this shop with its job, gauge, taker and disposer; 404 for any other shop's. */
export async function getFlagOrThrow(
  shopId: number,
  flagId: number,
): Promise<LoadedFlag & { job: NonNullable<LoadedFlag["job"]> }> {
  const f = await models().Flag.findOne({ where: { id: flagId, shopId }, include: flagIncludes() });
  const loaded = f ? plain<LoadedFlag>(f) : null;
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

export type FlagDecisionRow = Pick<
  StoredFlag,
  "id" | "readingId" | "derivedKey" | "state" | "disposition" | "operation"
>;

/**
 * Flags of a job with their latest decision, oldest first (the readings CSV's decision column): of
 * these readings, or with `readingIds` null, of the job's computed values.
 */
export async function jobFlagDecisions(
  shopId: number,
  jobId: number,
  readingIds: string[] | null,
): Promise<FlagDecisionRow[]> {
  if (readingIds?.length === 0) return [];
  const rows = await models().Flag.findAll({
    where: {
      shopId,
      jobId,
      ...(readingIds ? { readingId: { [Op.in]: readingIds } } : { derivedKey: { [Op.ne]: null } }),
    },
    attributes: ["id", "readingId", "derivedKey", "state", "disposition", "operation"],
    order: [["id", "ASC"]],
  });
  return rows.map((f) => plain<FlagDecisionRow>(f));
}
