import "server-only";
import type { Transaction } from "sequelize";
import { consequenceWords, isWideChange, type Consequences } from "@/lib/domain";
import type { StudyConsequences, StudyInput, StudyPreview, StudySaved } from "@/lib/schemas/gauge-studies";
import type { Actor } from "@/lib/schemas/session";
import { retriedTransaction } from "@/lib/server/core/cluster";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import { assertConfirmed, countConsequences } from "@/lib/server/jobs/consequences";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { recordAudit } from "@/lib/server/log/repo";
import { reconcileJob } from "@/lib/server/reconcile/reconcile";
import { grrRow, studyCharacteristics, type1Row } from "./compute";
import {
  gaugeTolerances,
  getStudySettings,
  insertStudy,
  openJobsUsingGauge,
  studyGaugeOrThrow,
  type NewStudyRow,
} from "./repo";

// Saving a study: the core works out its figures, the study is kept, and every open job with
// readings taken with the gauge is judged again with the gauge's new uncertainty (the same
// reconciliation a limits edit runs). The preview runs the very save and rolls it back, so the
// consequences it shows are the save's own.

const NONE: Consequences = { flagsOpened: 0, flagsClosed: 0, verdictsChanged: 0, requiredStations: 0 };

function add(a: Consequences, b: Consequences): Consequences {
  return {
    flagsOpened: a.flagsOpened + b.flagsOpened,
    flagsClosed: a.flagsClosed + b.flagsClosed,
    verdictsChanged: a.verdictsChanged + b.verdictsChanged,
    requiredStations: a.requiredStations + b.requiredStations,
  };
}

async function rowFor(t: Transaction, actor: Actor, instrumentId: number, input: StudyInput): Promise<NewStudyRow> {
  const gauge = await studyGaugeOrThrow(actor.shopId, instrumentId, t);
  if (!gauge.active) {
    throw new AppError("conflict", `${gauge.label} is retired; reactivate it on the gauges page before studying it`);
  }
  const thresholds = await getStudySettings(actor.shopId, t);
  const who = { instrumentId, performedBy: actor.userId };
  if (input.kind === "grr") return { ...grrRow(gauge, input, thresholds), ...who };
  const used = await gaugeTolerances(t, actor.shopId, instrumentId);
  const characteristics = studyCharacteristics(gauge, used, input.characteristics);
  return { ...type1Row(gauge, input, characteristics, thresholds), ...who };
}

/** Judges again each open job the gauge was used on; returns each job's consequences. */
async function rejudgeJobs(t: Transaction, actor: Actor, instrumentId: number): Promise<StudyConsequences["jobs"]> {
  const jobs = await openJobsUsingGauge(t, actor.shopId, instrumentId);
  const out: StudyConsequences["jobs"] = [];
  for (const job of jobs) {
    const before = await loadJobContext(actor.shopId, job.id, t);
    const r = await reconcileJob(t, {
      shopId: actor.shopId,
      jobId: job.id,
      userId: actor.userId,
      cause: "gauge_study",
    });
    const consequences = await countConsequences(t, before, r);
    out.push({ jobId: job.id, code: job.code, consequences, words: consequenceWords(consequences) });
  }
  return out;
}

async function applyStudy(t: Transaction, actor: Actor, instrumentId: number, input: StudyInput) {
  const row = await rowFor(t, actor, instrumentId, input);
  const study = await insertStudy(t, actor.shopId, row);
  const jobs = await rejudgeJobs(t, actor, instrumentId);
  const consequences = jobs.reduce((sum, j) => add(sum, j.consequences), NONE);
  await recordAudit(t, {
    shopId: actor.shopId,
    userId: actor.userId,
    action: "gauge.study.recorded",
    entityType: "instrument",
    entityId: instrumentId,
    after: {
      studyId: study.id,
      kind: study.kind,
      performedOn: study.performedOn,
      dueOn: study.dueOn,
      repeatSd: study.summary.repeatSd,
      bias: study.summary.bias,
      passed: study.passed,
      jobs: jobs.map((j) => ({ code: j.code, words: j.words })),
    },
  });
  const preview: StudyConsequences = {
    consequences,
    words: consequenceWords(consequences),
    wide: isWideChange(consequences),
    jobs,
  };
  return { study, preview };
}

/** Thrown to roll a preview back once its figures are known. */
class PreviewDone extends Error {
  constructor(readonly preview: StudyPreview) {
    super("preview rolled back");
  }
}

/** The study's result and what saving it would do to open jobs, from the very save, rolled back. */
export async function previewStudy(actor: Actor, instrumentId: number, input: StudyInput): Promise<StudyPreview> {
  try {
    await getSequelize().transaction(async (t) => {
      const { study, preview } = await applyStudy(t, actor, instrumentId, input);
      throw new PreviewDone({ study: { ...study, id: null }, ...preview });
    });
  } catch (err) {
    if (err instanceof PreviewDone) return err.preview;
    throw err;
  }
  throw new Error("unreachable: a preview always rolls back");
}

/** Saves the study and judges the open jobs again; a wide change needs `confirmedFlagsOpened` (409 otherwise). */
export async function saveStudy(actor: Actor, instrumentId: number, input: StudyInput): Promise<StudySaved> {
  return retriedTransaction(async (t) => {
    const { study, preview } = await applyStudy(t, actor, instrumentId, input);
    assertConfirmed(preview.consequences, input.confirmedFlagsOpened);
    return { study, ...preview };
  });
}
