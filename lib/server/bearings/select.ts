import "server-only";
import {
  bearingAdviceWords,
  evaluateChoices,
  lengthWords,
  movedJournals,
  selectShells,
  shellSetWords,
  type HandChoice,
  type LengthUnit,
  type MovedJournal,
  type Selection,
} from "@/lib/domain";
import type { ChoiceInput, SelectionAnswer } from "@/lib/schemas/bearings";
import { AppError } from "@/lib/server/core/errors";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { loadJobReadings } from "@/lib/server/jobs/readings";
import { shopInstruments } from "@/lib/server/readings/gauge-repo";
import { listPoints, listShells, type PointRow, type ShellRow } from "@/lib/server/bearings/repo";
import { selectionInput, type PreparedInput } from "@/lib/server/bearings/inputs";

// Running the core's selection on a job, and judging a hand choice against the saved one. Nothing
// here writes: the lead sees the answer (and what a change moves) before saving it.

export type Loaded = { prepared: PreparedInput; shells: ShellRow[]; points: PointRow[]; unit: LengthUnit };

export async function loadSelection(shopId: number, jobId: number): Promise<Loaded> {
  const ctx = await loadJobContext(shopId, jobId);
  const [readings, shells, points, gauges] = await Promise.all([
    loadJobReadings(shopId, jobId),
    listShells(shopId, jobId),
    listPoints(shopId, jobId),
    shopInstruments(shopId),
  ]);
  const byId = new Map(gauges.map((g) => [g.id, g]));
  const prepared = selectionInput(ctx, readings, shells, points, byId);
  return { prepared, shells, points, unit: ctx.job.unitSystem };
}

/** The core refuses input it cannot judge with words saying what to fix: a 422 that says them. */
function coreCall<T>(fn: () => T): T {
  try {
    return fn();
  } catch (err) {
    throw new AppError("invalid", err instanceof Error ? err.message : String(err));
  }
}

/** The saved choice as the core's hand choices, keyed like the journals. */
export function savedHand(l: Loaded): HandChoice[] {
  return [...l.prepared.pointOf].flatMap(([key, point]) => {
    const row = l.points.find((p) => p.point === point);
    if (!row?.upperShellId || !row.lowerShellId) return [];
    return [{ key, upperSetId: String(row.upperShellId), lowerSetId: String(row.lowerShellId) }];
  });
}

export function handOf(l: Loaded, choice: ChoiceInput): HandChoice[] {
  const keyOf = new Map([...l.prepared.pointOf].map(([key, point]) => [point, key]));
  return choice.points.flatMap((c) => {
    const key = keyOf.get(c.point);
    if (!key || !c.upperShellId || !c.lowerShellId) return [];
    return [{ key, upperSetId: String(c.upperShellId), lowerSetId: String(c.lowerShellId) }];
  });
}

function movedWords(m: MovedJournal, l: Loaded): string {
  const set = (id?: string) => l.prepared.input.sets.find((s) => s.id === id);
  const halves = (x: MovedJournal["before"]) => {
    const [u, lo] = [set(x?.upperSetId), set(x?.lowerSetId)];
    if (!u || !lo) return "no halves";
    return u.id === lo.id ? `both ${shellSetWords(u)}` : `upper ${shellSetWords(u)}, lower ${shellSetWords(lo)}`;
  };
  const c = (x: MovedJournal["before"]) => (x?.clearance !== undefined ? lengthWords(x.clearance, l.unit) : "none");
  return `${m.key}: ${halves(m.before)} → ${halves(m.after)}; clearance ${c(m.before)} → ${c(m.after)}`;
}

export function answerOf(l: Loaded, s: Selection, before: Selection, problems: string[] = []): SelectionAnswer {
  return {
    points: s.results.map((r) => ({
      point: l.prepared.pointOf.get(r.key)!,
      upperShellId: r.upper ? Number(r.upper.setId) : null,
      lowerShellId: r.lower ? Number(r.lower.setId) : null,
      predicted:
        r.clearance !== undefined
          ? { value: r.clearance, uncertainty: r.uncertainty ?? null, verdict: r.verdict ?? null }
          : null,
      mixed: r.mixed,
    })),
    advice: [...s.advice.map((a) => bearingAdviceWords(a, l.prepared.input.sets)), ...l.prepared.missing],
    stock: s.stock.map((x) => ({ shellId: Number(x.setId), used: x.used, left: x.left })),
    moved: movedJournals(before, s).map((m) => movedWords(m, l)),
    problems,
  };
}

/** The core's pick for every measured point, compared with the saved choice. */
export async function runSelection(shopId: number, jobId: number): Promise<SelectionAnswer> {
  const l = await loadSelection(shopId, jobId);
  const picked = coreCall(() => selectShells(l.prepared.input));
  const saved = coreCall(() => evaluateChoices(l.prepared.input, savedHand(l)));
  return answerOf(l, picked, saved);
}

/** What a choice (typed or changed by hand) would give and move, without saving it. */
export async function previewChoice(shopId: number, jobId: number, choice: ChoiceInput): Promise<SelectionAnswer> {
  const l = await loadSelection(shopId, jobId);
  return judgeChoice(l, choice);
}

export function judgeChoice(l: Loaded, choice: ChoiceInput): SelectionAnswer {
  const after = coreCall(() => evaluateChoices(l.prepared.input, handOf(l, choice)));
  const saved = coreCall(() => evaluateChoices(l.prepared.input, savedHand(l)));
  const unmeasured = choice.points.filter(
    (c) => (c.upperShellId || c.lowerShellId) && ![...l.prepared.pointOf.values()].includes(c.point),
  );
  const halfOnly = choice.points.filter((c) => !c.upperShellId !== !c.lowerShellId);
  const problems = [
    ...after.problems.map((p) => p.message),
    ...unmeasured.map((c) => `${c.point}: measure its journal and housing before choosing its halves`),
    ...halfOnly.map((c) => `${c.point}: choose both the upper and the lower half, or neither`),
  ];
  return answerOf(l, after, saved, problems);
}
