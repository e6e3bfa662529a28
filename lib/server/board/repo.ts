import "server-only";
import { JOB_STATUSES, OPEN_JOB_STATUSES } from "@/lib/domain";
import type { BoardQuery } from "@/lib/schemas/job-board";
import { getSequelize } from "@/lib/server/core/db";
import { utcDate } from "@/lib/server/core/sql-driver";
import { readRows } from "@/lib/server/core/sql-read";

// The board feature's door to the database: a page of the shop's jobs filtered and sorted in SQL,
// and the kept progress counts (table job_progress, see its migration) with their freshness.
// Revision tokens are UUID_SHORT() values beyond 2^53: they travel as text and are compared in SQL.

export type BoardRow = {
  id: number;
  code: string;
  title: string;
  status: (typeof JOB_STATUSES)[number];
  unitSystem: "in" | "mm";
  dueDate: string | null;
  updatedAt: Date | string;
  customer: string;
  engine: string | null;
  required: number | null;
  done: number | null;
  /** The kept count was taken at the job's present revisions. */
  fresh: number;
  openFlags: number;
  disposedFlags: number;
};

// Reads go through the driver (sql-read.ts): plain rows, no Sequelize query building or casting.

const FRESH = `(p.counted_readings_revision = p.readings_revision AND p.counted_context_revision = j.context_revision)`;
const OPEN_FLAGS = `(SELECT COUNT(*) FROM flags f WHERE f.job_id = j.id AND f.state = 'open')`;
const DISPOSED_FLAGS = `(SELECT COUNT(*) FROM flags f WHERE f.job_id = j.id AND f.state = 'disposed')`;
// As the board has always ranked progress: closed jobs (no count) first, then jobs without
// required stations, then by the share done.
const PROGRESS = `CASE WHEN j.status = 'closed' OR p.required_stations IS NULL THEN -2
  WHEN p.required_stations = 0 THEN -1 ELSE p.required_done / p.required_stations END`;

const ORDER: Record<BoardQuery["sort"], (dir: string) => string> = {
  // A job without a due date comes after every dated one (before them, descending).
  due: (d) => `j.due_date IS NULL ${d}, j.due_date ${d}`,
  code: (d) => `NATURAL_SORT_KEY(j.code) ${d}`,
  customer: (d) => `c.name ${d}`,
  status: (d) => `FIELD(j.status, ${JOB_STATUSES.map((s) => `'${s}'`).join(", ")}) ${d}`,
  progress: (d) => `${PROGRESS} ${d}`,
  flags: (d) => `${OPEN_FLAGS} ${d}, ${DISPOSED_FLAGS} ${d}`,
};

const likeText = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

function whereOf(shopId: number, q: BoardQuery): { sql: string; params: unknown[] } {
  const parts = ["j.shop_id = ?"];
  const params: unknown[] = [shopId];
  if (q.status === "active") {
    parts.push("j.status IN (?)");
    params.push([...OPEN_JOB_STATUSES]);
  } else if (q.status !== "all") {
    parts.push("j.status = ?");
    params.push(q.status);
  }
  if (q.flagged === "1") parts.push(`EXISTS (SELECT 1 FROM flags f WHERE f.job_id = j.id AND f.state = 'open')`);
  if (q.q) {
    parts.push("(j.code LIKE ? OR j.title LIKE ? OR c.name LIKE ? OR e.description LIKE ?)");
    params.push(...Array(4).fill(likeText(q.q)));
  }
  return { sql: parts.join(" AND "), params };
}

const FROM = `jobs j JOIN customers c ON c.id = j.customer_id LEFT JOIN engines e ON e.id = j.engine_id`;

/**
 * One page of the board's rows with their open and awaiting-re-check flags, how many jobs match in
 * all and how many the shop has: two statements side by side, one round trip.
 */
export async function boardRows(
  shopId: number,
  q: BoardQuery,
): Promise<{ rows: BoardRow[]; total: number; shopJobs: number }> {
  const where = whereOf(shopId, q);
  const dir = q.dir === "desc" ? "DESC" : "ASC";
  const [rows, [count]] = await Promise.all([
    readRows<BoardRow>(
      `SELECT j.id, j.code, j.title, j.status, j.unit_system AS unitSystem, j.due_date AS dueDate,
         j.updated_at AS updatedAt, c.name AS customer, e.description AS engine,
         p.required_stations AS required, p.required_done AS done, COALESCE(${FRESH}, 0) AS fresh,
         ${OPEN_FLAGS} AS openFlags, ${DISPOSED_FLAGS} AS disposedFlags
       FROM ${FROM} LEFT JOIN job_progress p ON p.job_id = j.id
       WHERE ${where.sql} ORDER BY ${ORDER[q.sort](dir)}, j.id ${dir} LIMIT ? OFFSET ?`,
      [...where.params, q.pageSize, (q.page - 1) * q.pageSize],
    ),
    readRows<{ n: number; shopJobs: number }>(
      `SELECT COUNT(*) AS n, (SELECT COUNT(*) FROM jobs WHERE shop_id = ?) AS shopJobs FROM ${FROM} WHERE ${where.sql}`,
      [shopId, ...where.params],
    ),
  ]);
  return {
    rows: rows.map((r) => ({
      ...r,
      updatedAt: utcDate(r.updatedAt)!,
      fresh: Number(r.fresh),
      openFlags: Number(r.openFlags),
      disposedFlags: Number(r.disposedFlags),
    })),
    total: Number(count.n),
    shopJobs: Number(count.shopJobs),
  };
}

/** Jobs of the shop that are not closed and whose kept progress is missing or stale. */
export async function staleProgressJobs(shopId: number, statuses: readonly string[]): Promise<number[]> {
  const rows = await readRows<{ id: number }>(
    `SELECT j.id FROM jobs j LEFT JOIN job_progress p ON p.job_id = j.id
     WHERE j.shop_id = ? AND j.status IN (?) AND NOT COALESCE(${FRESH}, 0)`,
    [shopId, statuses],
  );
  return rows.map((r) => Number(r.id));
}

export type ProgressTokens = { jobId: number; context: string; readings: string };

/** The revision tokens of these jobs (of the shop) as they stand before counting. */
export async function progressTokens(shopId: number, jobIds: number[]): Promise<ProgressTokens[]> {
  if (!jobIds.length) return [];
  return readRows<ProgressTokens>(
    `SELECT j.id AS jobId, CAST(j.context_revision AS CHAR) AS context,
       CAST(COALESCE(p.readings_revision, 0) AS CHAR) AS readings
     FROM jobs j LEFT JOIN job_progress p ON p.job_id = j.id WHERE j.shop_id = ? AND j.id IN (?)`,
    [shopId, jobIds],
  );
}

export type CountedProgress = ProgressTokens & { required: number | null; done: number | null };

/**
 * Keeps counts taken at `readings` and `context`; a row whose readings token moved meanwhile (a
 * reading arrived while counting) is left as it is, so it stays stale and is counted again.
 */
export async function storeProgress(counted: CountedProgress[]): Promise<void> {
  if (!counted.length) return;
  const same = "readings_revision = VALUES(counted_readings_revision)";
  const keep = (c: string) => `${c} = IF(${same}, VALUES(${c}), ${c})`;
  await getSequelize().query(
    `INSERT INTO job_progress (job_id, readings_revision, counted_readings_revision, counted_context_revision,
       required_stations, required_done) VALUES ${counted.map(() => "(?, ?, ?, ?, ?, ?)").join(", ")}
     ON DUPLICATE KEY UPDATE ${["required_stations", "required_done", "counted_context_revision"].map(keep).join(", ")},
       ${keep("counted_readings_revision")}`,
    {
      replacements: counted.flatMap((c) => [c.jobId, c.readings, c.readings, c.context, c.required, c.done]),
    },
  );
}

export type KeptProgress = { jobId: number; required: number | null; done: number | null; fresh: number };

/** The kept counts of these jobs of the shop and whether each is fresh (a job never counted: absent). */
export async function keptProgress(shopId: number, jobIds: number[]): Promise<KeptProgress[]> {
  if (!jobIds.length) return [];
  const rows = await readRows<KeptProgress>(
    `SELECT j.id AS jobId, p.required_stations AS required, p.required_done AS done, COALESCE(${FRESH}, 0) AS fresh
     FROM jobs j JOIN job_progress p ON p.job_id = j.id WHERE j.shop_id = ? AND j.id IN (?)`,
    [shopId, jobIds],
  );
  return rows.map((r) => ({ ...r, jobId: Number(r.jobId), fresh: Number(r.fresh) }));
}
