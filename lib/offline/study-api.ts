// The tablet's gauge studies and the server: the gauges to pick from (kept for offline), and the
// preview and save of a finished run. A run never leaves the tablet's database until the server
// answered that it saved it.
import { api, ApiError } from "@/lib/client/api";
import type { BenchGaugesReply, StudyGauge } from "@/lib/schemas/bench-gauges";
import type { BenchDb } from "./db";
import { getMeta, setMeta } from "./meta";
import type { StudyDraft } from "./study-draft-shape";

const GAUGES_KEY = "studyGauges";

/** The shop's gauges: from the server when it answers (kept), else the last list or the job packs'. */
export async function studyGauges(db: BenchDb): Promise<{ gauges: StudyGauge[]; offline: boolean }> {
  try {
    const { instruments } = await api<BenchGaugesReply>("/api/bench/gauges", { cache: "no-store" });
    await setMeta(db, GAUGES_KEY, instruments);
    return { gauges: instruments, offline: false };
  } catch (err) {
    if (err instanceof ApiError && err.status < 500 && err.status !== 429) throw err;
    const kept = await getMeta<StudyGauge[]>(db, GAUGES_KEY);
    if (kept) return { gauges: kept, offline: true };
    const packs = await db.jobs.toArray();
    const fromPack = packs.sort((a, b) => b.refreshedAt.localeCompare(a.refreshedAt))[0]?.pack.instruments ?? [];
    return { gauges: fromPack.filter((g) => g.active).map((g) => ({ ...g, master: null })), offline: true };
  }
}

/** What the server takes: only what was measured; it works out every figure itself. */
export function studyBody(draft: StudyDraft): Record<string, unknown> {
  if (draft.kind === "type1") return { kind: "type1", reference: draft.reference, readings: draft.readings };
  return {
    kind: "grr",
    appraisers: draft.design?.appraisers ?? [],
    measurements: draft.measurements,
    ...(draft.design?.tolerance ? { tolerance: draft.design.tolerance } : {}),
  };
}

/** A request's failure in words for the machinist; the run stays on the tablet either way. */
export function failureWords(err: unknown, doing: string): string {
  if (err instanceof ApiError) {
    if (err.status === 401) return `Signed out: sign in again to ${doing}; the run stays on this tablet`;
    if (err.status >= 500 || err.status === 429)
      return `The server could not ${doing} just now (${err.status}); try again in a moment. The run stays here`;
    const fields = Object.values(err.fields ?? {}).flat();
    return [err.message, ...fields].join(". ");
  }
  return `No connection to the server: ${doing} needs it. The run stays on this tablet; try again when online`;
}

export const postStudy = <T>(gaugeId: number, draft: StudyDraft, preview: boolean, extra: object = {}) =>
  api<T>(`/api/gauges/${gaugeId}/studies${preview ? "/preview" : ""}`, {
    method: "POST",
    json: { ...studyBody(draft), ...extra },
  });
