import "server-only";
import { benchRoute, type SpecLimit } from "@/lib/domain";
import type { UnitSystem } from "@/lib/schemas/enums";
import type { BoardJob } from "@/lib/schemas/job";
import { toEngineShape } from "@/lib/server/jobs/context";
import { measuredStations, requiredStationIds } from "@/lib/server/jobs/readings";
import { flagCountsByJob, jobSpecs, listJobsWithParties, type EngineRow } from "@/lib/server/jobs/repo";

// The jobs board: every job of the shop with what the lead scans for at a glance. Progress
// counts the REQUIRED stations of the engine's bench route, as the release checklist does (a
// required limit on the station's own characteristic, or the station feeds a derived value
// with a required limit); a station is done when its current reading is a value, not a skip.
// Closed jobs show no progress: their record is final and reading them all would slow the board.

function progressOf(engine: EngineRow, unitSystem: UnitSystem, spec: SpecLimit[], measured: Set<string>) {
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

export async function listJobBoard(shopId: number): Promise<BoardJob[]> {
  const jobs = await listJobsWithParties(shopId);
  const ids = jobs.map((j) => j.id);
  const open = jobs.filter((j) => j.status !== "closed").map((j) => j.id);
  const [specs, measured, flags] = await Promise.all([
    jobSpecs(open),
    measuredStations(shopId, open),
    flagCountsByJob(shopId, ids, ["open", "disposed"]),
  ]);
  return jobs.map((j) => ({
    id: j.id,
    code: j.code,
    title: j.title,
    status: j.status,
    unitSystem: j.unitSystem,
    dueDate: j.dueDate ?? null,
    customer: j.customerName,
    engine: j.engine?.description ?? "",
    progress:
      j.engine && specs.has(j.id) ? progressOf(j.engine, j.unitSystem, specs.get(j.id)!, measured.get(j.id)!) : null,
    flags: { open: flags.get(j.id)!.open, disposed: flags.get(j.id)!.disposed },
    updatedAt: j.updatedAt.toISOString(),
  }));
}
