import "server-only";
import {
  bearingPoints,
  convertLength,
  gaugeUncertainty,
  type BearingJournal,
  type BearingPointInfo,
  type ClearanceWindow,
  type LengthUnit,
  type SelectionInput,
  type ShellSet,
} from "@/lib/domain";
import type { JobContext } from "@/lib/server/jobs/context";
import type { JobReadings } from "@/lib/server/jobs/readings";
import type { InstrumentInfo } from "@/lib/server/sync/ingest-evaluate";
import type { PointRow, ShellRow } from "@/lib/server/bearings/repo";
import { journalFigures, pointWindow, windowTarget } from "@/lib/server/bearings/journals";

// The one edge where a job's stored shells, housing bores and bench readings become the core's
// SelectionInput. A point is left out, with words saying what it still needs, until its journal
// and housing are measured; journals are keyed by their label ("Main 3"), the words advice uses.

// The gauge's whole budget (certificate, resolution, its study), the same U its readings' verdicts use.
const uOf = (g: InstrumentInfo | undefined, unit: LengthUnit) => (g && gaugeUncertainty(g, unit)) ?? 0;

export function shellSetOf(s: ShellRow, gauges: Map<number, InstrumentInfo>): ShellSet {
  const step: ShellSet["step"] = { kind: s.step };
  if (s.stepAmount != null) step.amount = s.stepAmount;
  if (s.grade) step.grade = s.grade;
  let wall: ShellSet["wall"];
  if (s.wallSource === "nominal" && s.wall != null) wall = { source: "nominal", thickness: s.wall };
  if (s.wallSource === "range" && s.wallMin != null && s.wallMax != null)
    wall = { source: "range", min: s.wallMin, max: s.wallMax };
  if (s.wallSource === "measured" && s.wallUpper != null && s.wallLower != null) {
    const gaugeU = uOf(s.wallGaugeId ? gauges.get(s.wallGaugeId) : undefined, s.unit);
    wall = { source: "measured", upper: s.wallUpper, lower: s.wallLower, gaugeU };
  }
  return {
    id: String(s.id),
    series: s.series,
    role: s.role,
    step,
    ...(wall ? { wall } : {}),
    onHand: { upper: s.halvesUpper, lower: s.halvesLower },
    unit: s.unit,
  };
}

export type PreparedInput = {
  input: SelectionInput;
  /** Journal key → point id ("Main 3" → "main/3"). */
  pointOf: Map<string, string>;
  /** What points still need before the core can choose for them. */
  missing: string[];
};

function journalOf(p: BearingPointInfo, row: PointRow | undefined, r: JobReadings, unit: LengthUnit) {
  const figures = journalFigures(r.raws, p.journalPart, unit);
  if (!figures.values.length) return { missing: `${p.label}: measure its journal (${p.journalPart}) on the bench` };
  if (row?.housingBore == null) return { missing: `${p.label}: enter its housing bore, measured without shells` };
  const journal: BearingJournal = {
    key: p.label,
    role: p.kind === "rod" ? "rod" : row.thrust ? "thrust" : "main",
    diameters: figures.values,
    journalU: figures.u,
    housingBore: row.housingBore,
    housingU: uOf(row.housingGaugeId ? r.instruments.get(row.housingGaugeId) : undefined, unit),
    ...(row.housingCode ? { housingCode: row.housingCode } : {}),
    ...(row.journalCode ? { journalCode: row.journalCode } : {}),
    unit,
  };
  return { journal };
}

function windowOf(ctx: JobContext, p: BearingPointInfo, j: BearingJournal, unit: LengthUnit): ClearanceWindow | null {
  const mean = j.diameters.reduce((a, b) => a + b, 0) / j.diameters.length;
  const l = pointWindow(ctx.spec, ctx.shape, p, mean);
  if (!l || l.min === undefined || l.max === undefined) return null;
  const to = (x: number) => (l.unit === unit ? x : convertLength(x, l.unit as LengthUnit, unit));
  return { min: to(l.min), max: to(l.max), target: to(windowTarget(l)!), unit };
}

export function selectionInput(
  ctx: JobContext,
  readings: JobReadings,
  shells: ShellRow[],
  points: PointRow[],
  gauges: Map<number, InstrumentInfo>,
): PreparedInput {
  const unit: LengthUnit = ctx.job.unitSystem;
  const journals: BearingJournal[] = [];
  const pointOf = new Map<string, string>();
  const missing: string[] = [];
  const windows: SelectionInput["windows"] = {};
  for (const p of bearingPoints(ctx.shape)) {
    const got = journalOf(
      p,
      points.find((x) => x.point === p.point),
      readings,
      unit,
    );
    if (!got.journal) {
      missing.push(got.missing!);
      continue;
    }
    const role = got.journal.role;
    windows[role] ??= windowOf(ctx, p, got.journal, unit) ?? undefined;
    journals.push(got.journal);
    pointOf.set(got.journal.key, p.point);
  }
  for (const role of ["main", "rod"] as const) {
    if (journals.some((j) => j.role === role || (role === "main" && j.role === "thrust")) && !windows[role]) {
      missing.push(`The job's limits give no ${role} oil clearance window (min and max); add one on the limits page`);
    }
  }
  return { input: { journals, sets: shells.map((s) => shellSetOf(s, gauges)), windows }, pointOf, missing };
}
