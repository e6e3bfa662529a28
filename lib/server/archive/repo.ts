import "server-only";
import { QueryTypes } from "sequelize";
import { getSequelize } from "@/lib/server/core/db";
import { recordAudit } from "@/lib/server/log/repo";

// The shop archive's one door to the database: pages of rows of one shop, read in key order, so
// an export of any size holds one page in memory at a time. Plain rows out (column aliases as keys).

export type Row = Record<string, unknown>;

/** One file's query: what to select, from where, the shop column, and the unique key to page on. */
export type PagedQuery = {
  select: string;
  from: string;
  shopColumn: string;
  /** Columns ordering the rows uniquely, e.g. ["x.job_id", "x.taken_at", "x.id"]. */
  key: string[];
};

/** (a > ?) OR (a = ? AND b > ?) OR …: the rows after `after` in key order, written so an index serves it. */
function after(key: string[], values: unknown[]): { sql: string; params: unknown[] } {
  const parts: string[] = [];
  const params: unknown[] = [];
  key.forEach((column, i) => {
    const equal = key.slice(0, i).map((c) => `${c} = ?`);
    parts.push(`(${[...equal, `${column} > ?`].join(" AND ")})`);
    params.push(...values.slice(0, i + 1));
  });
  return { sql: `(${parts.join(" OR ")})`, params };
}

export async function pageRows(q: PagedQuery, shopId: number, from: unknown[] | null, limit: number): Promise<Row[]> {
  const where = [`${q.shopColumn} = ?`];
  const params: unknown[] = [shopId];
  if (from) {
    const a = after(q.key, from);
    where.push(a.sql);
    params.push(...a.params);
  }
  const sql = `SELECT ${q.select} FROM ${q.from} WHERE ${where.join(" AND ")} ORDER BY ${q.key.join(", ")} LIMIT ${limit}`;
  return getSequelize().query<Row>(sql, { type: QueryTypes.SELECT, replacements: params });
}

/** The download itself is in the trail: who took the shop's data, and when. */
export async function recordArchiveDownload(shopId: number, userId: number, files: string[]): Promise<void> {
  await recordAudit(null, {
    shopId,
    userId,
    action: "shop.archive",
    entityType: "shop",
    entityId: shopId,
    after: { files },
  });
}

export type ArchiveShopRow = { id: number; name: string; slug: string; unitSystem: string };

export async function findArchiveShop(shopId: number): Promise<ArchiveShopRow | null> {
  const [row] = await getSequelize().query<ArchiveShopRow>(
    "SELECT id, name, slug, unit_system AS unitSystem FROM shops WHERE id = ?",
    { type: QueryTypes.SELECT, replacements: [shopId] },
  );
  return row ?? null;
}
