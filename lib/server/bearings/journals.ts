import "server-only";
import {
  convertLength,
  deriveReadings,
  judge,
  limitContextFor,
  limitsFor,
  type BearingPointInfo,
  type DerivedValue,
  type EngineShape,
  type LengthUnit,
  type RawReading,
  type ResolvedLimit,
  type SpecLimit,
} from "@/lib/domain";
import type { Clearance } from "@/lib/schemas/bearings";

// What the bench has measured about each bearing point, in the job's unit: the journal's current
// diameters, the oil clearance window the job's limits give it, and the measured installed
// clearance once the installed bore is read. Shared by the desk view, the selection run and the record.

const characteristicOf = (p: BearingPointInfo) => (p.kind === "main" ? "main_oil_clearance" : "rod_oil_clearance");

function inUnit(value: number, from: string, to: LengthUnit): number {
  return from === to ? value : convertLength(value, from as LengthUnit, to);
}

/** The journal's current diameters at both ends and both axes, with the gauges' largest U. */
export function journalFigures(raws: RawReading[], part: string, unit: LengthUnit) {
  const mine = raws.filter((r) => r.stationId.startsWith(`${part}/`));
  const values = mine.map((r) => inUnit(r.value, r.unit, unit));
  const u = Math.max(0, ...mine.map((r) => (r.uncertainty ? inUnit(r.uncertainty, r.unit, unit) : 0)));
  return { values, u };
}

/** The point's oil clearance limits from the job's own spec (a per-inch rule scales with its journal). */
export function pointWindow(
  spec: SpecLimit[],
  shape: EngineShape,
  p: BearingPointInfo,
  journalMean: number | undefined,
): ResolvedLimit | undefined {
  const characteristic = characteristicOf(p);
  const context = limitContextFor(characteristic, shape, journalMean);
  return limitsFor(spec, characteristic, `${p.installedPart}/front/A`, context).limits;
}

/** The value the lead aims at: the limit's nominal, else the middle of the window. */
export function windowTarget(l: ResolvedLimit): number | null {
  if (l.nominal !== undefined) return l.nominal;
  if (l.min !== undefined && l.max !== undefined) return Number(((l.min + l.max) / 2).toPrecision(12));
  return null;
}

/** A clearance judged against the point's limits with its U as the guard band. */
export function judged(value: number, u: number | null, unit: LengthUnit, limits?: ResolvedLimit): Clearance {
  const verdict = limits ? (judge(value, unit, u ?? undefined, limits).verdict ?? null) : null;
  return { value, uncertainty: u, verdict };
}

/** The tightest measured installed clearance of the point (of its ends and axes), once read. */
export function measuredClearance(derived: DerivedValue[], p: BearingPointInfo): Clearance | null {
  const mine = derived.filter(
    (d) => d.characteristic === characteristicOf(p) && d.stationId.startsWith(`${p.installedPart}/`),
  );
  const read = mine.filter((d) => typeof d.value === "number" && d.missing.length === 0);
  if (!read.length) return null;
  const tightest = read.reduce((a, b) => (b.value! < a.value! ? b : a));
  return { value: tightest.value!, uncertainty: tightest.uncertainty ?? null, verdict: tightest.verdict ?? null };
}

export function derivedClearances(raws: RawReading[], shape: EngineShape, spec: SpecLimit[]): DerivedValue[] {
  const touching = (id: string) => /^(main|rod)(-brg)?\//.test(id);
  return deriveReadings(raws, shape, spec, { touching });
}
