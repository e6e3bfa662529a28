import "server-only";
import { benchRoute, correctedBy } from "@/lib/domain";
import type { BenchJobSummary, JobPack } from "@/lib/schemas/sync";
import type { Actor } from "@/lib/schemas/session";
import { recipeInputs, toBenchFlag } from "@/lib/server/bench/flag-view";
import { flagsOfJobs, jobWithNames, namesOf, openBenchJobs, toHeader } from "@/lib/server/bench/repo";
import { progressOf } from "@/lib/server/board/progress";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { chosenBearings } from "@/lib/server/bearings/bench";
import { AppError, notFound } from "@/lib/server/core/errors";
import { readingsOfJobs } from "@/lib/server/readings/repo";
import { shopInstruments } from "@/lib/server/readings/gauge-repo";
import { toServerReading } from "@/lib/server/readings/server-reading";
import { currentCursor } from "@/lib/server/sync/repo";

// What the tablet stores to work a job offline (GET /api/bench/jobs/:id), and the list it picks from.

function routeOf(shape: Parameters<typeof benchRoute>[0], code: string) {
  try {
    return benchRoute(shape);
  } catch (err) {
    throw new AppError(
      "bad_request",
      `Job ${code}'s engine cannot be measured as entered: ${(err as Error).message}. Ask the lead to fix the engine.`,
    );
  }
}

export async function listBenchJobs(actor: Actor): Promise<BenchJobSummary[]> {
  const jobs = await openBenchJobs(actor.shopId);
  // Required-station progress as the desk board counts it (lib/domain/progress.ts), from the kept
  // counts (lib/server/board/progress.ts); an engine that cannot be laid out shows 0 of 0 and its
  // pack explains what is wrong.
  const progress = await progressOf(
    actor.shopId,
    jobs.map((j) => j.id),
  );
  return jobs.map((j) => ({
    ...toHeader(j),
    ...namesOf(j),
    progress: progress.get(j.id) ?? null,
    openFlags: j.openFlags,
  }));
}

export async function jobPack(actor: Actor, jobId: number): Promise<JobPack> {
  // The cursor first: anything committed after it is numbered after it, and the feed sends it.
  const cursor = await currentCursor(actor.shopId);
  const named = await jobWithNames(actor.shopId, jobId);
  if (!named) throw notFound("Job");
  const ctx = await loadJobContext(actor.shopId, jobId);
  const route = routeOf(ctx.shape, ctx.job.code);
  const [instruments, readings, flags, bearings] = await Promise.all([
    shopInstruments(actor.shopId),
    readingsOfJobs([jobId]),
    flagsOfJobs([jobId], { unclosedOnly: true }),
    chosenBearings(actor.shopId, jobId),
  ]);
  const corrections = correctedBy(readings);
  return {
    job: { ...toHeader(ctx.job), ...namesOf(named) },
    shape: ctx.shape,
    spec: ctx.spec,
    route,
    instruments: instruments.map(({ shopId: _s, ...i }) => i),
    readings: readings.map((r) => toServerReading(r, corrections.get(r.id) ?? null)),
    flags: flags.map((f) => toBenchFlag(f, recipeInputs(ctx.shape))),
    bearings,
    cursor,
  };
}
