import "server-only";
import { bearingPoints, isJobLocked, type LengthUnit } from "@/lib/domain";
import type { BearingsView, PointView, ShellView } from "@/lib/schemas/bearings";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { loadJobReadings } from "@/lib/server/jobs/readings";
import { shopInstruments } from "@/lib/server/readings/gauge-repo";
import { listPoints, listShells, type PointRow, type ShellRow } from "@/lib/server/bearings/repo";
import {
  derivedClearances,
  journalFigures,
  judged,
  measuredClearance,
  pointWindow,
  windowTarget,
} from "@/lib/server/bearings/journals";

// The lead's selection page, the tablet's pack and the build record read a job's bearings here.

export function shellView(s: ShellRow, points: PointRow[]): ShellView {
  const used = {
    upper: points.filter((p) => p.upperShellId === s.id).length,
    lower: points.filter((p) => p.lowerShellId === s.id).length,
  };
  return {
    id: s.id,
    series: s.series,
    role: s.role,
    step: s.step,
    stepAmount: s.stepAmount ?? null,
    grade: s.grade ?? null,
    wallSource: s.wallSource ?? null,
    wall: s.wall ?? null,
    wallMin: s.wallMin ?? null,
    wallMax: s.wallMax ?? null,
    wallUpper: s.wallUpper ?? null,
    wallLower: s.wallLower ?? null,
    wallGaugeId: s.wallGaugeId ?? null,
    halvesUpper: s.halvesUpper,
    halvesLower: s.halvesLower,
    used,
    unit: s.unit,
  };
}

export async function getBearingsView(shopId: number, jobId: number): Promise<BearingsView> {
  const ctx = await loadJobContext(shopId, jobId);
  const [readings, shells, saved, gauges] = await Promise.all([
    loadJobReadings(shopId, jobId),
    listShells(shopId, jobId),
    listPoints(shopId, jobId),
    shopInstruments(shopId),
  ]);
  const unit: LengthUnit = ctx.job.unitSystem;
  const derived = derivedClearances(readings.raws, ctx.shape, ctx.spec);
  const points = bearingPoints(ctx.shape).map((p): PointView => {
    const row = saved.find((s) => s.point === p.point);
    const journal = journalFigures(readings.raws, p.journalPart, unit);
    const mean = journal.values.length ? journal.values.reduce((a, b) => a + b, 0) / journal.values.length : undefined;
    const limits = pointWindow(ctx.spec, ctx.shape, p, mean);
    const thrust = row?.thrust ?? false;
    return {
      point: p.point,
      label: p.label,
      role: p.kind === "rod" ? "rod" : thrust ? "thrust" : "main",
      journalPart: p.journalPart,
      journal: journal.values.length
        ? { min: Math.min(...journal.values), max: Math.max(...journal.values), count: journal.values.length }
        : null,
      housingBore: row?.housingBore ?? null,
      housingGaugeId: row?.housingGaugeId ?? null,
      thrust,
      housingCode: row?.housingCode ?? null,
      journalCode: row?.journalCode ?? null,
      window: limits ? { min: limits.min ?? null, max: limits.max ?? null, target: windowTarget(limits) } : null,
      upperShellId: row?.upperShellId ?? null,
      lowerShellId: row?.lowerShellId ?? null,
      byHand: row?.byHand ?? false,
      predicted:
        row?.predictedClearance != null ? judged(row.predictedClearance, row.predictedU ?? null, unit, limits) : null,
      measured: measuredClearance(derived, p),
    };
  });
  return {
    job: {
      id: ctx.job.id,
      code: ctx.job.code,
      title: ctx.job.title,
      unit,
      locked: isJobLocked(ctx.job),
      status: ctx.job.status,
    },
    shells: shells.map((s) => shellView(s, saved)),
    points,
    gauges: gauges.filter((g) => g.active !== false).map((g) => ({ id: g.id, label: `${g.label} (${g.kind})` })),
  };
}
