import "server-only";
import { UniqueConstraintError, type Transaction } from "sequelize";
import type { UnitSystem } from "@/lib/schemas/enums";
import type { Consequences } from "@/lib/domain";
import type { ChangePreview, CustomerRecord, CustomerValues, JobEditValues, JobValues } from "@/lib/schemas/job";
import type { Actor } from "@/lib/schemas/session";
import type { Customer } from "@/models";
import { recordAudit } from "@/lib/server/log/repo";
import { recordChange } from "@/lib/server/sync/repo";
import { getSequelize, models } from "@/lib/server/core/db";
import { AppError, notFound } from "@/lib/server/core/errors";
import { assertJobEditable } from "@/lib/server/jobs/editable";
import { rejudgeOnSizeChange, sizeColumns, sizesOf } from "@/lib/server/job-edit/sizes";
import { assertConfirmed, countConsequences, previewChange } from "@/lib/server/jobs/consequences";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { retriedTransaction } from "@/lib/server/core/cluster";

// Creating and editing jobs and customers from the desk: the feature's only door to the
// database. Every write is one transaction with its audit event; a job's status change also goes
// on the change feed so tablets see it.
const blank = (s: string | null | undefined) => (s === undefined || s === null || s.trim() === "" ? null : s.trim());

const reshapeCustomer = (c: Customer): CustomerRecord => ({
  id: c.id,
  name: c.name,
  email: c.email ?? null,
  phone: c.phone ?? null,
});

export async function listCustomers(shopId: number): Promise<CustomerRecord[]> {
  return (await models().Customer.findAll({ where: { shopId }, order: [["name", "ASC"]] })).map(reshapeCustomer);
}

async function insertCustomer(t: Transaction, actor: Actor, v: CustomerValues): Promise<Customer> {
  const c = await models().Customer.create(
    { shopId: actor.shopId, name: v.name.trim(), email: blank(v.email), phone: blank(v.phone) },
    { transaction: t },
  );
  await recordAudit(t, {
    shopId: actor.shopId,
    userId: actor.userId,
    action: "customer.create",
    entityType: "customer",
    entityId: c.id,
    after: reshapeCustomer(c),
  });
  return c;
}

export async function createCustomer(actor: Actor, v: CustomerValues): Promise<CustomerRecord> {
  return getSequelize().transaction(async (t) => reshapeCustomer(await insertCustomer(t, actor, v)));
}

async function customerFor(t: Transaction, actor: Actor, pick: JobValues["customer"]): Promise<Customer> {
  if (pick.mode === "new") return insertCustomer(t, actor, pick);
  const c = await models().Customer.findOne({ where: { id: pick.id, shopId: actor.shopId }, transaction: t });
  if (!c)
    throw new AppError("invalid", "Some fields need fixing", {
      "customer.id": ["That customer is not in this shop; pick one from the list"],
    });
  return c;
}

function engineFields(e: JobValues["engine"], unitSystem: UnitSystem) {
  return {
    description: e.description,
    cylinders: e.cylinders,
    layout: e.layout,
    mains: e.mains,
    valvesPerCylinder: e.valvesPerCylinder,
    ringsPerPiston: e.ringsPerPiston,
    boltsPerRod: e.boltsPerRod,
    unitSystem,
    nominalBore: e.nominalBore,
    nominalStroke: e.nominalStroke,
    nominalMainJournal: e.nominalMainJournal ?? null,
    nominalRodJournal: e.nominalRodJournal ?? null,
    blockMaterial: e.blockMaterial,
    headMaterial: e.headMaterial ?? null,
    pistonMaterial: e.pistonMaterial ?? null,
    blockSerial: blank(e.blockSerial),
    crankSerial: blank(e.crankSerial),
    headSerials: blank(e.headSerials),
    fuel: e.fuel ?? null,
  };
}

function jobFields(v: JobEditValues) {
  return {
    code: v.code,
    title: v.title,
    unitSystem: v.unitSystem,
    status: v.status,
    dueDate: blank(v.dueDate),
    notes: blank(v.notes),
  };
}

function duplicateCode(err: unknown, code: string): never {
  if (err instanceof UniqueConstraintError) {
    throw new AppError("conflict", `Job code ${code} is already used in this shop`, {
      code: [`${code} is taken; pick another code`],
    });
  }
  throw err;
}

/** Copies the template's limits into the job's own snapshot, in the template's order. */
async function snapshotLimits(t: Transaction, templateId: number, jobId: number): Promise<number> {
  const { JobLimit, SpecLimit } = models();
  const limits = await SpecLimit.findAll({
    where: { templateId },
    order: [
      ["sortOrder", "ASC"],
      ["id", "ASC"],
    ],
    transaction: t,
  });
  await JobLimit.bulkCreate(
    limits.map((l, i) => {
      const { id: _id, templateId: _tid, createdAt: _c, updatedAt: _u, ...rest } = l.get({ plain: true });
      return { ...rest, jobId, sortOrder: i };
    }),
    { transaction: t },
  );
  return limits.length;
}

export async function createJob(actor: Actor, v: JobValues): Promise<{ id: number }> {
  const { Engine, Job, SpecTemplate } = models();
  return retriedTransaction(async (t) => {
    const template = await SpecTemplate.findOne({
      where: { id: v.templateId, shopId: actor.shopId, archived: false },
      transaction: t,
    });
    if (!template)
      throw new AppError("invalid", "Some fields need fixing", {
        templateId: ["Pick a spec sheet of this shop (archived ones cannot start a job)"],
      });
    const customer = await customerFor(t, actor, v.customer);
    const engine = await Engine.create(
      { shopId: actor.shopId, customerId: customer.id, ...engineFields(v.engine, v.unitSystem) },
      { transaction: t },
    );
    const sizes = sizeColumns(v, v.engine);
    const job = await Job.create(
      {
        shopId: actor.shopId,
        customerId: customer.id,
        engineId: engine.id,
        templateId: template.id,
        ...jobFields(v),
        ...sizes,
      },
      { transaction: t },
    ).catch((err) => duplicateCode(err, v.code));
    const limitCount = await snapshotLimits(t, template.id, job.id);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "job.create",
      entityType: "job",
      entityId: job.id,
      after: {
        ...jobFields(v),
        ...sizes,
        customerId: customer.id,
        engine: engineFields(v.engine, v.unitSystem),
        templateId: template.id,
        template: template.name,
        limitCount,
      },
    });
    await recordChange(t, { shopId: actor.shopId, jobId: job.id, entity: "job", entityId: job.id });
    return { id: job.id };
  });
}

/** What saving this edit would do (a changed finished size re-judges), counted by the very edit, rolled back. */
export function previewJobEdit(actor: Actor, jobId: number, v: JobEditValues): Promise<ChangePreview> {
  return previewChange((t) => applyJobEdit(t, actor, jobId, v));
}

/** Saves the edit; one that opens more than a handful of flags needs that number confirmed (409 otherwise). */
export async function updateJob(actor: Actor, jobId: number, v: JobEditValues): Promise<{ id: number }> {
  return retriedTransaction(async (t) => {
    assertConfirmed(await applyJobEdit(t, actor, jobId, v), v.confirmedFlagsOpened);
    return { id: jobId };
  });
}

async function applyJobEdit(t: Transaction, actor: Actor, jobId: number, v: JobEditValues): Promise<Consequences> {
  const { Engine, Job, Reading } = models();
  const job = await Job.findOne({ where: { id: jobId, shopId: actor.shopId }, transaction: t, lock: t.LOCK.UPDATE });
  if (!job) throw notFound("Job");
  assertJobEditable(job);
  const contextBefore = await loadJobContext(actor.shopId, jobId, t);
  const engine = await Engine.findByPk(job.engineId, { transaction: t });
  if (!engine) throw notFound("Engine");
  if (v.unitSystem !== job.unitSystem && (await Reading.count({ where: { jobId }, transaction: t })) > 0) {
    throw new AppError("conflict", "This job already has readings, so its unit system stays as it is", {
      unitSystem: [`Readings were taken in ${job.unitSystem}; keep ${job.unitSystem}`],
    });
  }
  const customer = await customerFor(t, actor, v.customer);
  const sizesBefore = sizesOf(job, engine);
  const sizes = sizeColumns(v, v.engine, sizesBefore);
  const before = {
    ...jobFields(job as unknown as JobEditValues),
    ...sizeColumns({} as JobEditValues, engine, sizesBefore),
    customerId: job.customerId,
    engine: engineFields(engine as unknown as JobValues["engine"], engine.unitSystem),
  };
  await engine.update({ ...engineFields(v.engine, v.unitSystem), customerId: customer.id }, { transaction: t });
  await job
    .update({ ...jobFields(v), ...sizes, customerId: customer.id }, { transaction: t })
    .catch((err) => duplicateCode(err, v.code));
  const after = { ...jobFields(v), ...sizes, customerId: customer.id, engine: engineFields(v.engine, v.unitSystem) };
  await recordAudit(t, {
    shopId: actor.shopId,
    userId: actor.userId,
    action: before.status !== v.status ? "job.status" : "job.update",
    entityType: "job",
    entityId: job.id,
    before,
    after,
  });
  const rejudged = await rejudgeOnSizeChange(t, actor, job.id, sizesBefore, sizesOf(job, engine));
  await recordChange(t, { shopId: actor.shopId, jobId: job.id, entity: "job", entityId: job.id });
  return countConsequences(t, contextBefore, rejudged);
}
