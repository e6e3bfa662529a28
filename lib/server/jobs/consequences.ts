import "server-only";
import type { Transaction } from "sequelize";
import {
  benchRoute,
  consequenceWords,
  isWideChange,
  requiredStationIds,
  requiredStationsAffected,
  type Consequences,
} from "@/lib/domain";
import type { ChangePreview } from "@/lib/schemas/job";
import { getSequelize } from "@/lib/server/core/db";
import { AppError } from "@/lib/server/core/errors";
import type { JobContext } from "@/lib/server/jobs/context";
import { loadJobContext } from "@/lib/server/jobs/repo";

// What a change that re-judges a job (its limits, its finished sizes) did, counted inside the
// change's own transaction; a preview runs the very change and rolls it back, so the lead reads
// the change's own counts; and a wide change is held back until the number it opens is confirmed.

/** The required stations of the job as it stands (none when the engine has no route). */
function requiredNow(ctx: JobContext): Set<string> {
  try {
    return requiredStationIds(ctx.shape, ctx.spec, benchRoute(ctx.shape));
  } catch {
    return new Set();
  }
}

/** Counts a change from the job's context before it and what reconciling did (nothing when it did not run). */
export async function countConsequences(
  t: Transaction,
  before: JobContext,
  r: { opened: number[]; closed: number[]; verdictChangedStations: string[] } | null,
): Promise<Consequences> {
  if (!r) return { flagsOpened: 0, flagsClosed: 0, verdictsChanged: 0, requiredStations: 0 };
  const after = await loadJobContext(before.job.shopId, before.job.id, t);
  return {
    flagsOpened: r.opened.length,
    flagsClosed: r.closed.length,
    verdictsChanged: r.verdictChangedStations.length,
    requiredStations: requiredStationsAffected(requiredNow(before), requiredNow(after), r.verdictChangedStations),
  };
}

/** Thrown to roll a preview back once its counts are known. */
class PreviewDone extends Error {
  constructor(readonly consequences: Consequences) {
    super("preview rolled back");
  }
}

/** Runs the change in a transaction that is always rolled back, and answers what it would do. */
export async function previewChange(change: (t: Transaction) => Promise<Consequences>): Promise<ChangePreview> {
  try {
    await getSequelize().transaction(async (t) => {
      throw new PreviewDone(await change(t));
    });
  } catch (err) {
    if (!(err instanceof PreviewDone)) throw err;
    const c = err.consequences;
    return { consequences: c, words: consequenceWords(c), wide: isWideChange(c) };
  }
  throw new Error("unreachable: a preview always rolls back");
}

/** Inside the change's transaction: a wide change without the very number it opens confirmed rolls back (409). */
export function assertConfirmed(c: Consequences, confirmedFlagsOpened: number | null | undefined): void {
  if (!isWideChange(c) || confirmedFlagsOpened === c.flagsOpened) return;
  throw new AppError("conflict", `This change ${consequenceWords(c)}. Confirm by typing ${c.flagsOpened}`, {
    confirmedFlagsOpened: [`Type ${c.flagsOpened} to confirm the flags this change opens`],
  });
}
