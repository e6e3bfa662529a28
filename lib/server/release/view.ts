import "server-only";
import {
  JOB_STATUSES,
  canReopen,
  characteristicWords,
  currentReadings,
  isJobLocked,
  stationWords,
  type Verdict,
} from "@/lib/domain";
import type { FlagSummary, ReadingCounts, ReleaseJobSummary, ReleaseView } from "@/lib/schemas/release";
import type { Actor } from "@/lib/schemas/session";
import { listJobs } from "@/lib/server/jobs/repo";
import { checklistOf } from "@/lib/server/release/checklist";
import { listReleases, loadJobRecord, userNames, type FlagRow, type JobRecord } from "@/lib/server/release/repo";
import { toReleaseRecord } from "@/lib/server/release/sign";

// What the inspector's release page shows: the checklist, counts of the readings by verdict, the
// flags with their decisions, every release of the job (void ones too), and what this user may do.

function counts(record: JobRecord): ReadingCounts {
  const current = [...currentReadings(record.readings).values()];
  const out: ReadingCounts = {
    current: current.length,
    superseded: record.readings.length - current.length,
    skipped: 0,
    in_spec: 0,
    marginal: 0,
    out_of_spec: 0,
    unjudged: 0,
  };
  for (const r of current) {
    if (r.skipped) out.skipped += 1;
    else if (r.verdict) out[r.verdict as Verdict] += 1;
    else out.unjudged += 1;
  }
  return out;
}

function flagSummary(f: FlagRow, names: Map<number, string>): FlagSummary {
  return {
    id: f.id,
    station: stationWords(f.stationId),
    what: characteristicWords(f.characteristic),
    verdict: f.verdict,
    reason: f.reason,
    state: f.state,
    disposition: f.disposition ?? null,
    operation: f.operation ?? null,
    dispositionReason: f.dispositionReason ?? null,
    disposedByName: f.disposedBy ? (names.get(f.disposedBy) ?? null) : null,
    disposedAt: f.disposedAt ? new Date(f.disposedAt).toISOString() : null,
    closedAt: f.closedAt ? new Date(f.closedAt).toISOString() : null,
    value: `${f.value} ${f.unit}`,
  };
}

export async function releaseView(actor: Actor, jobId: number): Promise<ReleaseView> {
  const record = await loadJobRecord(actor.shopId, jobId);
  const releases = await listReleases(jobId);
  const names = await userNames(actor.shopId, [
    ...record.flags.map((f) => f.disposedBy),
    ...releases.flatMap((r) => [r.inspectorId, r.voidedBy]),
  ]);
  const checklist = checklistOf(record);
  const { job } = record;
  const standing = releases.find((r) => !r.voidedAt) ?? null;
  const locked = isJobLocked(job);
  const latest = standing ?? releases[0] ?? null;
  return {
    job: {
      id: job.id,
      code: job.code,
      title: job.title,
      status: job.status,
      lockedAt: job.lockedAt ? new Date(job.lockedAt).toISOString() : null,
      customer: record.customerName,
      engine: record.engineDescription,
      unitSystem: job.unitSystem,
    },
    checklist,
    counts: counts(record),
    flags: record.flags.map((f) => flagSummary(f, names)),
    releases: releases.map((r) => toReleaseRecord(r, names)),
    can: {
      sign: actor.role === "inspector" && checklist.complete && !locked && !standing,
      reopen: canReopen(actor.role, { ...job, hasStandingRelease: !!standing }),
    },
    links: {
      pdf: `/api/record/${job.id}/pdf`,
      verify: latest ? `/verify?job=${encodeURIComponent(job.code)}&hash=${latest.hash}` : null,
    },
  };
}

/** Jobs an inspector looks at, each with whether it is ready, what blocks it, and its release. */
export async function releaseJobs(shopId: number): Promise<ReleaseJobSummary[]> {
  const jobs = await listJobs(
    shopId,
    JOB_STATUSES.filter((s) => s !== "closed"),
  );
  const out: ReleaseJobSummary[] = [];
  for (const j of jobs) {
    const record = await loadJobRecord(shopId, j.id);
    const checklist = checklistOf(record);
    const standing = (await listReleases(j.id)).find((r) => !r.voidedAt);
    out.push({
      id: j.id,
      code: j.code,
      title: j.title,
      status: j.status,
      customer: j.customer,
      engine: j.engine,
      dueDate: j.dueDate,
      complete: checklist.complete,
      unmet: checklist.unmet.length,
      release: standing ? { signedAt: standing.signedAt.toISOString(), hash: standing.hash } : null,
    });
  }
  return out;
}
