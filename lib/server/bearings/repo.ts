import "server-only";
import type { InferAttributes, InferCreationAttributes, Transaction } from "sequelize";
import type { BearingGradeTable, BearingPoint, BearingShell } from "@/models";
import type { JsonObject } from "@/lib/schemas/json";
import { models } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";

// Bearing selection's one door to the database: a job's shells on the shelf, its bearing points
// (housing bores and saved choices) and the shop's grade tables. Plain objects out; every query is
// scoped by the shop.

export type ShellRow = InferAttributes<BearingShell>;
export type ShellFields = Omit<
  InferCreationAttributes<BearingShell>,
  "id" | "shopId" | "jobId" | "createdAt" | "updatedAt"
>;
export type PointRow = InferAttributes<BearingPoint>;
export type PointFields = Partial<
  Omit<InferCreationAttributes<BearingPoint>, "id" | "shopId" | "jobId" | "point" | "createdAt" | "updatedAt">
>;
export type GradeTableRow = InferAttributes<BearingGradeTable>;

const plain = <T extends object>(row: { get(o: { plain: true }): T }): T => row.get({ plain: true });

export async function listShells(shopId: number, jobId: number, t?: Transaction): Promise<ShellRow[]> {
  const rows = await models().BearingShell.findAll({
    where: { shopId, jobId },
    order: [
      ["role", "ASC"],
      ["series", "ASC"],
      ["id", "ASC"],
    ],
    transaction: t,
  });
  return rows.map((r) => plain<ShellRow>(r));
}

export async function getShellOrThrow(t: Transaction, shopId: number, jobId: number, id: number): Promise<ShellRow> {
  const row = await models().BearingShell.findOne({ where: { id, shopId, jobId }, transaction: t });
  if (!row) throw notFound("Shell set");
  return plain<ShellRow>(row);
}

export async function insertShell(
  t: Transaction,
  shopId: number,
  jobId: number,
  fields: ShellFields,
): Promise<ShellRow> {
  const row = await models().BearingShell.create({ ...fields, shopId, jobId }, { transaction: t });
  return plain<ShellRow>(row);
}

export async function updateShell(t: Transaction, id: number, fields: ShellFields): Promise<void> {
  await models().BearingShell.update(fields, { where: { id }, transaction: t });
}

export async function deleteShell(t: Transaction, id: number): Promise<void> {
  await models().BearingShell.destroy({ where: { id }, transaction: t });
}

export async function listPoints(shopId: number, jobId: number, t?: Transaction): Promise<PointRow[]> {
  const rows = await models().BearingPoint.findAll({
    where: { shopId, jobId },
    order: [["id", "ASC"]],
    transaction: t,
  });
  return rows.map((r) => plain<PointRow>(r));
}

/** Writes the named fields of one point, making its row the first time. */
export async function savePoint(
  t: Transaction,
  shopId: number,
  jobId: number,
  point: string,
  fields: PointFields,
): Promise<void> {
  const { BearingPoint } = models();
  const [count] = await BearingPoint.update(fields, { where: { shopId, jobId, point }, transaction: t });
  if (count === 0) {
    const found = await BearingPoint.findOne({ where: { shopId, jobId, point }, transaction: t });
    if (!found) await BearingPoint.create({ ...fields, shopId, jobId, point }, { transaction: t });
  }
}

/** Points whose saved choice names this shell set (a set in use is not deleted). */
export async function pointsUsingShell(t: Transaction, jobId: number, shellId: number): Promise<string[]> {
  const { BearingPoint } = models();
  const rows = await BearingPoint.findAll({ where: { jobId }, transaction: t });
  return rows.filter((r) => r.upperShellId === shellId || r.lowerShellId === shellId).map((r) => r.point);
}

export async function listGradeTables(shopId: number): Promise<GradeTableRow[]> {
  const rows = await models().BearingGradeTable.findAll({ where: { shopId }, order: [["name", "ASC"]] });
  return rows.map((r) => plain<GradeTableRow>(r));
}

/** Saves a grade table by name: a table imported again under the same name replaces the old one. */
export async function saveGradeTable(
  t: Transaction,
  shopId: number,
  name: string,
  document: JsonObject,
): Promise<{ id: number; before: JsonObject | null }> {
  const { BearingGradeTable } = models();
  const found = await BearingGradeTable.findOne({ where: { shopId, name }, transaction: t, lock: t.LOCK.UPDATE });
  if (found) {
    const before = found.document;
    await found.update({ document }, { transaction: t });
    return { id: found.id, before };
  }
  const row = await BearingGradeTable.create({ shopId, name, document }, { transaction: t });
  return { id: row.id, before: null };
}

export async function deleteGradeTable(t: Transaction, shopId: number, id: number): Promise<GradeTableRow> {
  const { BearingGradeTable } = models();
  const row = await BearingGradeTable.findOne({ where: { shopId, id }, transaction: t });
  if (!row) throw notFound("Grade table");
  const out = plain<GradeTableRow>(row);
  await row.destroy({ transaction: t });
  return out;
}
