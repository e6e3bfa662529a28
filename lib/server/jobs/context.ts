import "server-only";
import { Op, literal, type Transaction } from "sequelize";
import { EXPANSION_COEFFICIENTS, type EngineShape, type SpecLimit } from "@/lib/domain";
import { Engine, Job, JobLimit } from "@/models";
import { getSequelize } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";

// The one edge where database rows become the domain core's shapes:
// Engine → EngineShape, JobLimit → SpecLimit. Sync, re-evaluation, review, release and the
// build record all go through here.
type LimitRow = Pick<
  JobLimit,
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
  return out as unknown as SpecLimit;
}

export function toEngineShape(engine: Engine, jobUnitSystem: "in" | "mm"): EngineShape {
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
    unitSystem: jobUnitSystem === "mm" ? "metric" : "inch",
    materials,
    nominalSizes: { bore: engine.nominalBore },
  };
}

export type JobContext = { job: Job; engine: Engine; shape: EngineShape; spec: SpecLimit[] };

/** A job of this shop with its engine shape and its own limit snapshot; 404 for any other shop. */
export async function loadJobContext(shopId: number, jobId: number, t?: Transaction): Promise<JobContext> {
  getSequelize();
  // All three at once (inside a transaction they share its connection and go out in one round
  // trip); the engine is found through this shop's job, so nothing of another shop is read.
  // (Op.eq is needed: a bare literal as a where value becomes the whole condition.)
  const engineOfJob = literal(
    `(SELECT engine_id FROM jobs WHERE id = ${Number(jobId)} AND shop_id = ${Number(shopId)})`,
  );
  const [job, engine, limits] = await Promise.all([
    Job.findOne({ where: { id: jobId, shopId }, transaction: t }),
    Engine.findOne({ where: { id: { [Op.eq]: engineOfJob } }, transaction: t }),
    JobLimit.findAll({
      where: { jobId },
      order: [
        ["sortOrder", "ASC"],
        ["id", "ASC"],
      ],
      transaction: t,
    }),
  ]);
  if (!job) throw notFound("Job");
  if (!engine) throw notFound("Engine");
  return { job, engine, shape: toEngineShape(engine, job.unitSystem), spec: limits.map(toSpecLimit) };
}
