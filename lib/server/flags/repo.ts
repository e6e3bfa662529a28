import "server-only";
import { Op, type Order, type WhereOptions } from "sequelize";
import { characteristicWords, stationWords } from "@/lib/domain";
import type { FlagListItem, FlagListQuery, FlagPage, GaugeRef } from "@/lib/schemas/flag";
import { Flag, Instrument, Job, Reading, User } from "@/models";
import { getSequelize } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";

// The lead's flag queue across jobs: filtered, sorted and paginated in the database.

export const gaugeRef = (g: Instrument | null | undefined): GaugeRef | null =>
  g ? { id: g.id, label: g.label, serial: g.serial, calibrationDue: g.calibrationDue ?? null } : null;

const iso = (d: Date | null | undefined) => (d ? new Date(d).toISOString() : null);

type Loaded = Flag & {
  job?: Job;
  disposer?: User | null;
  reading?: (Reading & { instrument?: Instrument | null; taker?: User }) | null;
};

export function toListItem(f: Loaded): FlagListItem {
  return {
    id: f.id,
    jobId: f.jobId,
    jobCode: f.job?.code ?? "",
    jobTitle: f.job?.title ?? "",
    stationId: f.stationId,
    station: stationWords(f.stationId),
    characteristic: f.characteristic,
    characteristicLabel: characteristicWords(f.characteristic),
    derived: !f.readingId,
    value: f.value,
    unit: f.unit,
    limitMin: f.limitMin ?? null,
    limitMax: f.limitMax ?? null,
    deviation: f.deviation ?? null,
    verdict: f.verdict,
    reason: f.reason,
    state: f.state,
    disposition: f.disposition ?? null,
    operation: f.operation ?? null,
    dispositionReason: f.dispositionReason ?? null,
    disposedBy: f.disposer?.name ?? null,
    disposedAt: iso(f.disposedAt),
    closedAt: iso(f.closedAt),
    gauge: gaugeRef(f.reading?.instrument),
    takenBy: f.reading?.taker?.name ?? null,
    takenAt: iso(f.reading?.takenAt),
    createdAt: iso(f.createdAt) as string,
  };
}

export const flagIncludes = [
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

function orderOf(q: FlagListQuery): Order {
  const dir = q.dir === "asc" ? "ASC" : "DESC";
  // Age grows as createdAt falls: the oldest flag has the largest age.
  const flip = dir === "ASC" ? "DESC" : "ASC";
  const by: Record<FlagListQuery["sort"], Order> = {
    age: [["createdAt", flip]],
    job: [
      [{ model: Job, as: "job" }, "code", dir],
      ["stationId", "ASC"],
    ],
    station: [["stationId", dir]],
    value: [["value", dir]],
    deviation: [["deviation", dir]],
    // ENUMs sort by their position: in_spec < marginal < out_of_spec, open < disposed < closed.
    verdict: [
      ["verdict", dir],
      ["createdAt", "ASC"],
    ],
    reason: [
      ["reason", dir],
      ["createdAt", "ASC"],
    ],
    state: [
      ["state", dir],
      ["createdAt", "ASC"],
    ],
  };
  return [...(by[q.sort] as unknown[]), ["id", "ASC"]] as Order;
}

export async function listFlags(shopId: number, q: FlagListQuery): Promise<FlagPage> {
  getSequelize();
  const where = whereOf(shopId, q);
  const [total, rows] = await Promise.all([
    Flag.count({ where }),
    Flag.findAll({
      where,
      include: flagIncludes,
      order: orderOf(q),
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
    }),
  ]);
  return {
    items: rows.map((r) => toListItem(r as Loaded)),
    total,
    page: q.page,
    pageSize: q.pageSize,
    pageCount: Math.max(1, Math.ceil(total / q.pageSize)),
  };
}

/** A flag of this shop with its job, gauge, taker and disposer; 404 for any other shop's. */
export async function getFlagOrThrow(shopId: number, flagId: number): Promise<Loaded & { job: Job }> {
  getSequelize();
  const f = await Flag.findOne({ where: { id: flagId, shopId }, include: flagIncludes });
  if (!f || !(f as Loaded).job) throw notFound("Flag");
  return f as Loaded & { job: Job };
}
