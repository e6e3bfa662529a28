import "server-only";
import { fn, col, Op } from "sequelize";
import { benchRoute, findLimit, type SpecLimit } from "@/lib/domain";
import { Customer, Engine, Flag, Job, JobLimit } from "@/models";
import { getSequelize } from "./db";
import { toEngineShape, toSpecLimit } from "./job-context";
import { measuredStations } from "./jobs-admin-readings-repo";
import type { JobStatus } from "./jobs-repo";

// The jobs board: every job of the shop with what the lead scans for at a glance. Progress
// counts the REQUIRED stations only: a station of the engine's bench route whose
// characteristic has a required limit on the job's own spec; it is done when its current
// reading has a value.
export type BoardJob = {
  id: number;
  code: string;
  title: string;
  status: JobStatus;
  unitSystem: "in" | "mm";
  dueDate: string | null;
  customer: string;
  engine: string;
  progress: { done: number; required: number };
  flags: { open: number; disposed: number };
  updatedAt: string;
};

/** The required stations of a route for a spec, in bench order. */
export function requiredStations(stationIds: { id: string; characteristic: SpecLimit["characteristic"] }[], spec: SpecLimit[]): string[] {
  return stationIds.filter((s) => findLimit(spec, s.characteristic, s.id)?.required).map((s) => s.id);
}

function progressOf(engine: Engine, unitSystem: "in" | "mm", spec: SpecLimit[], measured: Set<string>) {
  try {
    const stations = benchRoute(toEngineShape(engine, unitSystem)).sections.flatMap((s) => s.stations);
    const required = requiredStations(stations, spec);
    return { done: required.filter((id) => measured.has(id)).length, required: required.length };
  } catch {
    // An engine the core cannot lay out has no route; the job page says why.
    return { done: 0, required: 0 };
  }
}

async function flagCounts(shopId: number, jobIds: number[]) {
  const out = new Map<number, { open: number; disposed: number }>(jobIds.map((id) => [id, { open: 0, disposed: 0 }]));
  if (!jobIds.length) return out;
  const rows = (await Flag.findAll({
    where: { shopId, jobId: { [Op.in]: jobIds }, state: { [Op.in]: ["open", "disposed"] } },
    attributes: ["jobId", "state", [fn("COUNT", col("id")), "n"]],
    group: ["jobId", "state"],
    raw: true,
  })) as unknown as { jobId: number; state: "open" | "disposed"; n: number | string }[];
  for (const r of rows) out.get(r.jobId)![r.state] = Number(r.n);
  return out;
}

export async function listJobBoard(shopId: number): Promise<BoardJob[]> {
  getSequelize();
  const jobs = await Job.findAll({
    where: { shopId },
    include: [{ model: Customer, as: "customer" }, { model: Engine, as: "engine" }],
    order: [["dueDate", "ASC"], ["id", "ASC"]],
  });
  const ids = jobs.map((j) => j.id);
  const [limits, measured, flags] = await Promise.all([
    ids.length ? JobLimit.findAll({ where: { jobId: { [Op.in]: ids } }, order: [["sortOrder", "ASC"], ["id", "ASC"]] }) : [],
    measuredStations(shopId, ids),
    flagCounts(shopId, ids),
  ]);
  const specs = new Map<number, SpecLimit[]>(ids.map((id) => [id, []]));
  for (const l of limits) specs.get(l.jobId)!.push(toSpecLimit(l));
  return jobs.map((j) => ({
    id: j.id, code: j.code, title: j.title, status: j.status as JobStatus, unitSystem: j.unitSystem,
    dueDate: j.dueDate ?? null, customer: j.customer?.name ?? "", engine: j.engine?.description ?? "",
    progress: j.engine ? progressOf(j.engine, j.unitSystem, specs.get(j.id)!, measured.get(j.id)!) : { done: 0, required: 0 },
    flags: flags.get(j.id)!,
    updatedAt: j.updatedAt.toISOString(),
  }));
}
