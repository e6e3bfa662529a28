import "server-only";
import { fn, col, Op, type Transaction } from "sequelize";
import {
  LIMIT_FIELDS,
  compactLimit,
  type LimitValueField,
  type LimitValues,
  type TemplateRecord,
  type TemplateSummary,
  type TemplateValues,
} from "@/lib/schemas/spec";
import type { JobLimit, SpecLimit, SpecTemplate } from "@/models";
import type { Actor } from "@/lib/schemas/session";
import { recordAudit } from "@/lib/server/log/repo";
import { getSequelize, models } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";
import { toSpecLimit } from "@/lib/server/jobs/context";
import { commonPracticeMarks } from "@/lib/schemas/common-practice";

// The shop's spec sheet templates: the feature's one door to the database, plain objects out.
// A template edit never reaches a job: jobs keep the snapshot they took when they were created
// (their limits are edited on the job).

/** A stored limit (template or job) as the schema's values, with empty fields left out. */
export function limitValuesOf(row: SpecLimit | JobLimit): LimitValues {
  return compactLimit(toSpecLimit(row) as LimitValues);
}

/**
 * The columns of one limit row from schema values. Only the fields of the limit's own type are
 * kept (a figure left over from another type would read as part of the limit); the rest are NULL.
 */
export function limitRow(l: LimitValues, sortOrder: number, commonPractice: boolean) {
  const used = new Set<string>(LIMIT_FIELDS[l.limitType]);
  const pick = <K extends LimitValueField>(k: K) => (used.has(k) ? (l[k] ?? null) : null);
  const iso = pick("isoClass");
  return {
    characteristic: l.characteristic,
    stationPattern: l.stationPattern.trim(),
    limitType: l.limitType,
    unit: l.unit,
    min: pick("min"),
    max: pick("max"),
    nominal: pick("nominal"),
    tolPlus: pick("tolPlus"),
    tolMinus: pick("tolMinus"),
    perInchMin: pick("perInchMin"),
    perInchMax: pick("perInchMax"),
    isoClass: typeof iso === "string" ? iso.trim() || null : null,
    required: l.required,
    gaugeKind: l.gaugeKind ?? null,
    label: l.label?.trim() || null,
    sortOrder,
    commonPractice,
  };
}

export async function listTemplates(shopId: number): Promise<TemplateSummary[]> {
  const { SpecLimit, SpecTemplate } = models();
  const rows = await SpecTemplate.findAll({
    where: { shopId },
    order: [
      ["archived", "ASC"],
      ["name", "ASC"],
    ],
  });
  const counts = rows.length
    ? ((await SpecLimit.findAll({
        where: { templateId: { [Op.in]: rows.map((r) => r.id) } },
        attributes: ["templateId", [fn("COUNT", col("id")), "n"]],
        group: ["templateId"],
        raw: true,
      })) as unknown as { templateId: number; n: number | string }[])
    : [];
  const byId = new Map(counts.map((c) => [c.templateId, Number(c.n)]));
  return rows.map((t) => ({
    id: t.id,
    name: t.name,
    engineKind: t.engineKind,
    buildKind: t.buildKind,
    unitSystem: t.unitSystem,
    version: t.version,
    archived: t.archived,
    limitCount: byId.get(t.id) ?? 0,
    updatedAt: t.updatedAt.toISOString(),
  }));
}

async function findOrThrow(shopId: number, id: number, t?: Transaction): Promise<SpecTemplate> {
  const row = await models().SpecTemplate.findOne({
    where: { id, shopId },
    transaction: t,
    ...(t ? { lock: t.LOCK.UPDATE } : {}),
  });
  if (!row) throw notFound("Spec sheet");
  return row;
}

async function recordOf(row: SpecTemplate, t?: Transaction): Promise<TemplateRecord> {
  const limits = await models().SpecLimit.findAll({
    where: { templateId: row.id },
    order: [
      ["sortOrder", "ASC"],
      ["id", "ASC"],
    ],
    transaction: t,
  });
  return {
    id: row.id,
    name: row.name,
    engineKind: row.engineKind,
    buildKind: row.buildKind,
    unitSystem: row.unitSystem,
    notes: row.notes ?? null,
    limits: limits.map(limitValuesOf),
    version: row.version,
    archived: row.archived,
    updatedAt: row.updatedAt.toISOString(),
  };
}

export async function getTemplate(shopId: number, id: number): Promise<TemplateRecord> {
  return recordOf(await findOrThrow(shopId, id));
}

const headerOf = (v: TemplateValues) => ({
  name: v.name,
  engineKind: v.engineKind,
  buildKind: v.buildKind,
  unitSystem: v.unitSystem,
  notes: v.notes?.trim() || null,
});

/** Replaces a sheet's limits; `previous` (null for a new sheet) decides which keep their mark. */
async function writeLimits(t: Transaction, templateId: number, limits: LimitValues[], previous: LimitValues[] | null) {
  const { SpecLimit } = models();
  const marks = commonPracticeMarks(limits, previous);
  await SpecLimit.destroy({ where: { templateId }, transaction: t });
  await SpecLimit.bulkCreate(
    limits.map((l, i) => ({ ...limitRow(l, i, marks[i]), templateId })),
    { transaction: t },
  );
}

export async function createTemplate(
  actor: Actor,
  v: TemplateValues,
  action = "spec_template.create",
): Promise<TemplateRecord> {
  return getSequelize().transaction(async (t) => {
    const row = await models().SpecTemplate.create({ shopId: actor.shopId, ...headerOf(v) }, { transaction: t });
    await writeLimits(t, row.id, v.limits, null);
    const after = await recordOf(row, t);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action,
      entityType: "spec_template",
      entityId: row.id,
      after,
    });
    return after;
  });
}

export async function updateTemplate(actor: Actor, id: number, v: TemplateValues): Promise<TemplateRecord> {
  return getSequelize().transaction(async (t) => {
    const row = await findOrThrow(actor.shopId, id, t);
    const before = await recordOf(row, t);
    await row.update({ ...headerOf(v), version: row.version + 1 }, { transaction: t });
    await writeLimits(t, row.id, v.limits, before.limits);
    const after = await recordOf(row, t);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "spec_template.update",
      entityType: "spec_template",
      entityId: id,
      before,
      after,
    });
    return after;
  });
}

/** Archiving hides a sheet from new jobs; jobs that copied it keep their own limits. */
export async function setTemplateArchived(actor: Actor, id: number, archived: boolean): Promise<TemplateRecord> {
  return getSequelize().transaction(async (t) => {
    const row = await findOrThrow(actor.shopId, id, t);
    const before = { archived: row.archived };
    await row.update({ archived }, { transaction: t });
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: archived ? "spec_template.archive" : "spec_template.restore",
      entityType: "spec_template",
      entityId: id,
      before,
      after: { archived },
    });
    return recordOf(row, t);
  });
}

/** How many jobs started from this template (shown so nobody expects an edit to reach them). */
export async function jobsFromTemplate(shopId: number, id: number): Promise<number> {
  return models().Job.count({ where: { shopId, templateId: id } });
}
