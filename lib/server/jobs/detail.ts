import "server-only";
import {
  benchRoute,
  currentReadings,
  deriveReadings,
  hasValue,
  isJobLocked,
  requiredProgress,
  requiredStationIds,
} from "@/lib/domain";
import type { JobDetail, SectionSummary, VerdictCounts } from "@/lib/schemas/job";
import { settleAll } from "@/lib/server/core/sql-driver";
import { withReads } from "@/lib/server/core/sql-read";
import type { JobContext } from "@/lib/server/jobs/context";
import { jobReadingsFrom, type JobReadings } from "@/lib/server/jobs/readings";
import { hasStandingReleaseOn } from "@/lib/server/release/repo";
import { parseStoredPlan } from "@/lib/server/jobs/plan";
import { jobContextOn, jobHeaderOn } from "@/lib/server/jobs/repo";
import { jobReadingsOn } from "@/lib/server/readings/repo";

// One job for its desk page: header fields, the engine as entered, and a readings summary per
// bench section (required stations done by lib/domain's progress rule, as the bench, the board
// and the release checklist count them; verdicts of the current values) plus the derived values.
const zero = (): VerdictCounts => ({ in_spec: 0, marginal: 0, out_of_spec: 0 });

function sectionsOf(ctx: JobContext, readings: JobReadings): SectionSummary[] {
  const route = benchRoute(ctx.shape);
  const current = currentReadings(readings.all);
  const progress = requiredProgress(route, requiredStationIds(ctx.shape, ctx.spec, route), current);
  return route.sections.map((s, i) => {
    const counts = progress.sections[i];
    const verdicts = zero();
    for (const st of s.stations) {
      const r = current.get(st.id);
      if (r && hasValue(r) && r.verdict) verdicts[r.verdict] += 1;
    }
    return {
      id: s.id,
      label: s.label,
      stations: counts.stations,
      measured: counts.measured,
      required: counts.required,
      requiredDone: counts.done,
      verdicts,
    };
  });
}

function summarise(ctx: JobContext, readings: JobReadings) {
  const base = { readingCount: readings.all.length, currentCount: readings.current.length };
  const derived = { ...zero(), pending: 0 };
  try {
    const sections = sectionsOf(ctx, readings);
    for (const d of deriveReadings(readings.raws, ctx.shape, ctx.spec)) {
      if (d.verdict) derived[d.verdict] += 1;
      else if (d.missing.length && d.limits) derived.pending += 1;
    }
    return { ...base, sections, derived, routeError: null };
  } catch (err) {
    return { ...base, sections: [] as SectionSummary[], derived, routeError: (err as Error).message };
  }
}

// Every statement of the page goes out at once on one connection, read straight through the driver
// (sql-read.ts): one round trip, and no model instances for a job's hundreds of readings.
export async function getJobDetail(shopId: number, jobId: number): Promise<JobDetail> {
  const [ctx, header, stored, standing] = await withReads((read) =>
    settleAll([
      jobContextOn(read, shopId, jobId),
      jobHeaderOn(read, shopId, jobId),
      jobReadingsOn(read, shopId, jobId),
      hasStandingReleaseOn(read, jobId),
    ]),
  );
  const { job, engine } = ctx;
  const { customer, templateName: template, flags } = header;
  const readings = jobReadingsFrom(stored.readings, stored.instruments);
  return {
    job: {
      id: job.id,
      code: job.code,
      title: job.title,
      status: job.status,
      unitSystem: job.unitSystem,
      dueDate: job.dueDate ?? null,
      notes: job.notes ?? null,
      specRevision: job.specRevision,
      locked: isJobLocked(job),
      lockedAt: job.lockedAt ? new Date(job.lockedAt).toISOString() : null,
      hasStandingRelease: !!standing,
      templateId: job.templateId ?? null,
      templateName: template,
      limitCount: ctx.spec.length,
      commonPracticeCount: ctx.spec.filter((l) => l.commonPractice).length,
      hasBuildPlan: !!job.buildPlan,
      finishedSizes: {
        bore: job.finishedBore ?? null,
        mainJournal: job.finishedMainJournal ?? null,
        rodJournal: job.finishedRodJournal ?? null,
      },
      planBore: parseStoredPlan(job.buildPlan)?.bore ?? null,
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
      nominalMainJournal: engine.nominalMainJournal ?? null,
      nominalRodJournal: engine.nominalRodJournal ?? null,
      blockMaterial: engine.blockMaterial,
      headMaterial: engine.headMaterial ?? null,
      pistonMaterial: engine.pistonMaterial ?? null,
      blockSerial: engine.blockSerial ?? null,
      crankSerial: engine.crankSerial ?? null,
      headSerials: engine.headSerials ?? null,
      fuel: engine.fuel ?? null,
    },
    flags,
    summary: summarise(ctx, readings),
  };
}
