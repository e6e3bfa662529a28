import "server-only";
import { fn, col, Op } from "sequelize";
import { benchRoute, type SpecLimit } from "@/lib/domain";
import { Customer, Engine, Flag, Job, JobLimit } from "@/models";
import { getSequelize } from "@/lib/server/core/db";
import { toEngineShape, toSpecLimit } from "@/lib/server/jobs/context";
import { measuredStations, requiredStationIds } from "@/lib/server/jobs/readings";
import type { JobStatus } from "@/lib/domain";
import type { JobSummary } from "@/lib/server/jobs/repo";

// The jobs board: every job of the shop with what the lead scans for at a glance. Progress
// counts the REQUIRED stations of the engine's bench route, as the release checklist does (a
// required limit on the station's own characteristic, or the station feeds a derived value
// with a required limit); a station is done when its current reading is a value, not a skip.
// Closed jobs show no progress: their record is final and reading them all would slow the board.
export type BoardJob = JobSummary & {
  progress: { done: number; required: number } | null;
  flags: { open: number; disposed: number };
  updatedAt: string;
};

function progressOf(engine: Engine, unitSystem: "in" | "mm", spec: SpecLimit[], measured: Set<string>) {
  try {
    const shape = toEngineShape(engine, unitSystem);
    const required = requiredStationIds(
      { spec, shape },
      benchRoute(shape).sections.flatMap((s) => s.stations),
    );
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
    include: [
      { model: Customer, as: "customer" },
      { model: Engine, as: "engine" },
    ],
    order: [
      ["dueDate", "ASC"],
      ["id", "ASC"],
    ],
  });
  const ids = jobs.map((j) => j.id);
  const open = jobs.filter((j) => j.status !== "closed").map((j) => j.id);
  const [limits, measured, flags] = await Promise.all([
    open.length
      ? JobLimit.findAll({
          where: { jobId: { [Op.in]: open } },
          order: [
            ["sortOrder", "ASC"],
            ["id", "ASC"],
          ],
        })
      : [],
    measuredStations(shopId, open),
    flagCounts(shopId, ids),
  ]);
  const specs = new Map<number, SpecLimit[]>(open.map((id) => [id, []]));
  for (const l of limits) specs.get(l.jobId)!.push(toSpecLimit(l));
  return jobs.map((j) => ({
    id: j.id,
    code: j.code,
    title: j.title,
    status: j.status as JobStatus,
    unitSystem: j.unitSystem,
    dueDate: j.dueDate ?? null,
    customer: j.customer?.name ?? "",
    engine: j.engine?.description ?? "",
    progress:
      j.engine && specs.has(j.id) ? progressOf(j.engine, j.unitSystem, specs.get(j.id)!, measured.get(j.id)!) : null,
    flags: flags.get(j.id)!,
    updatedAt: j.updatedAt.toISOString(),
  }));
}
