import "server-only";
import type { GradeFile } from "@/lib/schemas/bearing-grades";
import type { JsonObject } from "@/lib/schemas/json";
import type { Actor } from "@/lib/schemas/session";
import { gradeTableSchema } from "@/lib/schemas/bearing-grades";
import { getSequelize } from "@/lib/server/core/db";
import { recordAudit } from "@/lib/server/log/repo";
import { deleteGradeTable, listGradeTables, saveGradeTable } from "@/lib/server/bearings/repo";

// A shop's factory grade tables, imported from our documented JSON (lib/schemas/bearing-grades.ts).
// A table imported again under the same name replaces the old one; the audit keeps both.

export type GradeTableView = { id: number; name: string; table: JsonObject; updatedAt: string };

export async function listGrades(shopId: number): Promise<GradeTableView[]> {
  const rows = await listGradeTables(shopId);
  // A stored table is read back through the schema: one that no longer passes is still listed, as stored.
  return rows.map((r) => {
    const parsed = gradeTableSchema.safeParse(r.document);
    return {
      id: r.id,
      name: r.name,
      table: parsed.success ? (parsed.data as unknown as JsonObject) : r.document,
      updatedAt: r.updatedAt.toISOString(),
    };
  });
}

export async function importGrades(actor: Actor, file: GradeFile): Promise<number> {
  return getSequelize().transaction(async (t) => {
    for (const table of file.tables) {
      const doc = table as unknown as JsonObject;
      const { id, before } = await saveGradeTable(t, actor.shopId, table.name, doc);
      await recordAudit(t, {
        shopId: actor.shopId,
        userId: actor.userId,
        action: before ? "bearings.grades_replace" : "bearings.grades_import",
        entityType: "bearing_grade_table",
        entityId: id,
        before,
        after: doc,
      });
    }
    return file.tables.length;
  });
}

export async function removeGrades(actor: Actor, id: number): Promise<void> {
  await getSequelize().transaction(async (t) => {
    const row = await deleteGradeTable(t, actor.shopId, id);
    await recordAudit(t, {
      shopId: actor.shopId,
      userId: actor.userId,
      action: "bearings.grades_remove",
      entityType: "bearing_grade_table",
      entityId: id,
      before: row.document,
    });
  });
}
