import "server-only";
import { EXPANSION_COEFFICIENTS, type EngineShape, type NominalSizes, type SpecLimit } from "@/lib/domain";
import type { EngineRow, JobLimitRow, JobRow } from "@/lib/server/jobs/repo";

// The one edge where database rows become the domain core's shapes:
// Engine (+ the job's units and finished sizes) → EngineShape, JobLimit → SpecLimit. Sync, re-evaluation, review, release and the
// build record all go through here.
type LimitRow = Pick<
  JobLimitRow,
  | "characteristic"
  | "stationPattern"
  | "limitType"
  | "unit"
  | "min"
  | "max"
  | "nominal"
  | "tolPlus"
  | "tolMinus"
  | "perInchMin"
  | "perInchMax"
  | "isoClass"
  | "required"
  | "gaugeKind"
  | "label"
  | "commonPractice"
>;

const isMaterial = (m: string | null | undefined): m is keyof typeof EXPANSION_COEFFICIENTS =>
  !!m && m in EXPANSION_COEFFICIENTS;

export function toSpecLimit(row: LimitRow): SpecLimit {
  const out: Record<string, unknown> = {
    characteristic: row.characteristic,
    stationPattern: row.stationPattern,
    limitType: row.limitType,
    unit: row.unit,
    required: row.required,
  };
  for (const k of ["min", "max", "nominal", "tolPlus", "tolMinus", "perInchMin", "perInchMax"] as const) {
    const v = row[k];
    if (v !== null && v !== undefined) out[k] = Number(v);
  }
  if (row.isoClass) out.isoClass = row.isoClass;
  if (row.gaugeKind) out.gaugeKind = row.gaugeKind;
  if (row.label) out.label = row.label;
  if (row.commonPractice) out.commonPractice = true;
  return out as unknown as SpecLimit;
}

type EngineFields = Pick<
  EngineRow,
  | "cylinders"
  | "layout"
  | "mains"
  | "valvesPerCylinder"
  | "boltsPerRod"
  | "ringsPerPiston"
  | "blockMaterial"
  | "pistonMaterial"
  | "nominalBore"
  | "nominalMainJournal"
  | "nominalRodJournal"
>;
type JobFields = Pick<JobRow, "unitSystem"> &
  Partial<Pick<JobRow, "finishedBore" | "finishedMainJournal" | "finishedRodJournal">>;

/** Sizes the row states, with the empty ones left out (the core treats absent as "not stated"). */
function sizes(bore: number | null | undefined, main: number | null | undefined, rod: number | null | undefined) {
  const out: NominalSizes = {};
  if (typeof bore === "number" && bore > 0) out.bore = bore;
  if (typeof main === "number" && main > 0) out.mainJournal = main;
  if (typeof rod === "number" && rod > 0) out.rodJournal = rod;
  return out;
}

/** The job's engine as the core sees it, with the job's units and the finished sizes it states. */
export function toEngineShape(engine: EngineFields, job: JobFields): EngineShape {
  const materials: EngineShape["materials"] = {};
  if (isMaterial(engine.blockMaterial)) materials.block = engine.blockMaterial;
  if (isMaterial(engine.pistonMaterial)) materials.pistons = engine.pistonMaterial;
  return {
    cylinders: engine.cylinders,
    layout: engine.layout,
    mains: engine.mains,
    valvesPerCylinder: engine.valvesPerCylinder,
    boltsPerRod: engine.boltsPerRod,
    ringsPerPiston: engine.ringsPerPiston,
    unitSystem: job.unitSystem === "mm" ? "metric" : "inch",
    materials,
    nominalSizes: sizes(engine.nominalBore, engine.nominalMainJournal, engine.nominalRodJournal),
    finishedSizes: sizes(job.finishedBore, job.finishedMainJournal, job.finishedRodJournal),
  };
}

/** A job of this shop with its engine, the engine's shape and the job's own limit snapshot (repo.ts loads it). */
export type JobContext = { job: JobRow; engine: EngineRow; shape: EngineShape; spec: SpecLimit[] };
