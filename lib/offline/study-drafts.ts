// Gauge studies in progress, kept in the tablet's database per person and kind: every figure is
// stored the moment it is accepted, so a reload, a lost network or a sign-out loses nothing, and a
// shared tablet shows each person only their own run (the same rule as unsent readings).
import type { GrrMeasurement } from "@/lib/domain/gauge-studies/types";
import type { BenchDb, StudyDraftRow } from "./db";
import type { GrrDesign, GrrDraft, StudyDraft, StudyKind, Type1Draft } from "./study-draft-shape";

export const draftId = (userId: number, kind: StudyKind) => `${userId}:${kind}`;

/** The order an R&R study is entered in: trial by trial, each appraiser through every part. */
export function grrEntryOrder(design: GrrDesign): Omit<GrrMeasurement, "value">[] {
  const cells: Omit<GrrMeasurement, "value">[] = [];
  for (let trial = 1; trial <= design.trials; trial++)
    for (let appraiser = 1; appraiser <= design.appraisers.length; appraiser++)
      for (let part = 1; part <= design.parts; part++) cells.push({ appraiser, part, trial });
  return cells;
}

/** The cell the next figure goes to; undefined when every cell is entered (or no design yet). */
export function nextGrrCell(draft: GrrDraft): Omit<GrrMeasurement, "value"> | undefined {
  return draft.design ? grrEntryOrder(draft.design)[draft.measurements.length] : undefined;
}

/** This person's studies in progress on this tablet (none of anyone else's). */
export async function draftsOf(db: BenchDb, userId: number): Promise<StudyDraftRow[]> {
  return db.studyDrafts.where("userId").equals(userId).toArray();
}

export async function draftOf<K extends StudyKind>(
  db: BenchDb,
  userId: number,
  kind: K,
): Promise<Extract<StudyDraft, { kind: K }> | undefined> {
  const row = await db.studyDrafts.get(draftId(userId, kind));
  return row?.draft as Extract<StudyDraft, { kind: K }> | undefined;
}

/** Starts a run (replacing this person's earlier run of the same kind, which the screen asked about). */
export async function startDraft(db: BenchDb, userId: number, draft: StudyDraft, now = new Date()): Promise<void> {
  const at = now.toISOString();
  await db.studyDrafts.put({ id: draftId(userId, draft.kind), userId, draft, startedAt: at, updatedAt: at });
}

/**
 * Changes a run in one transaction. `change` returns the new draft, or words saying why it refuses
 * (the draft is then left exactly as it was).
 */
export async function changeDraft<K extends StudyKind>(
  db: BenchDb,
  userId: number,
  kind: K,
  change: (draft: Extract<StudyDraft, { kind: K }>) => Extract<StudyDraft, { kind: K }> | string,
  now = new Date(),
): Promise<{ draft: Extract<StudyDraft, { kind: K }> } | { error: string }> {
  return db.transaction("rw", db.studyDrafts, async () => {
    const row = await db.studyDrafts.get(draftId(userId, kind));
    if (!row) return { error: "This study is no longer on the tablet; start it again" };
    const next = change(row.draft as Extract<StudyDraft, { kind: K }>);
    if (typeof next === "string") return { error: next };
    await db.studyDrafts.put({ ...row, draft: next, updatedAt: now.toISOString() });
    return { draft: next };
  });
}

/** Adds a reading to a repeatability run; refused past `max` readings. */
export const addType1Reading = (db: BenchDb, userId: number, value: number, max: number) =>
  changeDraft(db, userId, "type1", (d: Type1Draft) =>
    d.readings.length >= max
      ? `The study already has ${max} readings, the most it takes; work out the result or undo one`
      : { ...d, readings: [...d.readings, value] },
  );

/** Puts a figure in the R&R study's next cell. */
export const addGrrValue = (db: BenchDb, userId: number, value: number) =>
  changeDraft(db, userId, "grr", (d: GrrDraft) => {
    const cell = nextGrrCell(d);
    if (!cell) return "Every part has its figures; work out the result or undo the last one";
    return { ...d, measurements: [...d.measurements, { ...cell, value }] };
  });

/** Takes back the last figure of a run. */
export const undoLast = (db: BenchDb, userId: number, kind: StudyKind) =>
  changeDraft(db, userId, kind, (d: StudyDraft) => {
    if (d.kind === "type1")
      return d.readings.length ? { ...d, readings: d.readings.slice(0, -1) } : "There is no reading to undo";
    return d.measurements.length ? { ...d, measurements: d.measurements.slice(0, -1) } : "There is no figure to undo";
  });

/** Forgets a run: after the server saved it, or when its person chose to throw it away. */
export async function discardDraft(db: BenchDb, userId: number, kind: StudyKind): Promise<void> {
  await db.studyDrafts.delete(draftId(userId, kind));
}
