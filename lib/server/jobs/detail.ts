import "server-only";
import { fn, col } from "sequelize";
import { benchRoute, deriveReadings, isJobLocked, type Verdict } from "@/lib/domain";
import { Customer, Flag, SpecTemplate } from "@/models";
import { loadJobContext, type JobContext } from "@/lib/server/jobs/context";
import { loadJobReadings, measuredStations, requiredStationIds, type JobReadings } from "@/lib/server/jobs/readings";
import type { JobStatus } from "@/lib/domain";

// One job for its desk page: header fields, the engine as entered, and a readings summary per
// bench section (required stations done, as the release checklist counts them; verdicts of the
// current values) plus the verdicts of the derived values.
type Counts = Record<Verdict, number>;
const zero = (): Counts => ({ in_spec: 0, marginal: 0, out_of_spec: 0 });

export type SectionSummary = {
  id: string;
  label: string;
  stations: number;
  measured: number;
  required: number;
  requiredDone: number;
  verdicts: Counts;
};

function sectionsOf(ctx: JobContext, readings: JobReadings, done: Set<string>): SectionSummary[] {
  const byStation = new Map(readings.current.map((r) => [r.stationId, r]));
  return benchRoute(ctx.shape).sections.map((s) => {
    const required = requiredStationIds(ctx, s.stations);
    const verdicts = zero();
    let measured = 0;
    for (const st of s.stations) {
      const r = byStation.get(st.id);
      if (!r) continue;
      measured += 1;
      if (r.verdict) verdicts[r.verdict] += 1;
    }
    return {
      id: s.id,
      label: s.label,
      stations: s.count,
      measured,
      required: required.length,
      requiredDone: required.filter((id) => done.has(id)).length,
      verdicts,
    };
  });
}

function summarise(ctx: JobContext, readings: JobReadings, done: Set<string>) {
  const base = { readingCount: readings.all.length, currentCount: readings.current.length };
  const derived = { ...zero(), pending: 0 };
  try {
    const sections = sectionsOf(ctx, readings, done);
    for (const d of deriveReadings(readings.raws, ctx.shape, ctx.spec)) {
      if (d.verdict) derived[d.verdict] += 1;
      else if (d.missing.length && d.limits) derived.pending += 1;
    }
    return { ...base, sections, derived, routeError: null };
  } catch (err) {
    return { ...base, sections: [] as SectionSummary[], derived, routeError: (err as Error).message };
  }
}

async function flagCounts(shopId: number, jobId: number) {
  const rows = (await Flag.findAll({
    where: { shopId, jobId },
    attributes: ["state", [fn("COUNT", col("id")), "n"]],
    group: ["state"],
    raw: true,
  })) as unknown as { state: string; n: number | string }[];
  const out = { open: 0, disposed: 0, closed: 0 };
  for (const r of rows) out[r.state as keyof typeof out] = Number(r.n);
  return out;
}

export async function getJobDetail(shopId: number, jobId: number) {
  const ctx = await loadJobContext(shopId, jobId);
  const { job, engine } = ctx;
  const [customer, template, readings, measured, flags] = await Promise.all([
    Customer.findByPk(job.customerId),
    job.templateId ? SpecTemplate.findByPk(job.templateId, { attributes: ["id", "name"] }) : null,
    loadJobReadings(shopId, jobId),
    measuredStations(shopId, [jobId]),
    flagCounts(shopId, jobId),
  ]);
  return {
    job: {
      id: job.id,
      code: job.code,
      title: job.title,
      status: job.status as JobStatus,
      unitSystem: job.unitSystem,
      dueDate: job.dueDate ?? null,
      notes: job.notes ?? null,
      specRevision: job.specRevision,
      locked: isJobLocked(job),
      templateId: job.templateId ?? null,
      templateName: template?.name ?? null,
      limitCount: ctx.spec.length,
      hasBuildPlan: !!job.buildPlan,
      createdAt: job.createdAt.toISOString(),
      updatedAt: job.updatedAt.toISOString(),
    },
    customer: {
      id: job.customerId,
      name: customer?.name ?? "",
      email: customer?.email ?? null,
      phone: customer?.phone ?? null,
    },
    engine: {
      description: engine.description,
      cylinders: engine.cylinders,
      layout: engine.layout,
      mains: engine.mains,
      valvesPerCylinder: engine.valvesPerCylinder,
      ringsPerPiston: engine.ringsPerPiston,
      boltsPerRod: engine.boltsPerRod,
      nominalBore: engine.nominalBore,
      nominalStroke: engine.nominalStroke,
      blockMaterial: engine.blockMaterial,
      headMaterial: engine.headMaterial ?? null,
      pistonMaterial: engine.pistonMaterial ?? null,
      blockSerial: engine.blockSerial ?? null,
      crankSerial: engine.crankSerial ?? null,
      headSerials: engine.headSerials ?? null,
      fuel: engine.fuel ?? null,
    },
    flags,
    summary: summarise(ctx, readings, measured.get(jobId) ?? new Set()),
  };
}

export type JobDetail = Awaited<ReturnType<typeof getJobDetail>>;
