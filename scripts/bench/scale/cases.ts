// The office queries bench:scale times: each screen's server function (what its API route calls)
// and, beside it, the raw SQL a hand-tuned query on the same indexes runs to fetch the same rows.
import type { Connection } from "mariadb";
import type { Actor } from "@/lib/schemas/session";
import { FLAG_SORTS, flagListQuerySchema, type FlagListQuery } from "@/lib/schemas/flag";
import { boardQuerySchema } from "@/lib/schemas/job-board";
import { auditQuerySchema } from "@/lib/schemas/audit";
import { listFlags } from "@/lib/server/flags/list";
import { listJobBoard } from "@/lib/server/board/board";
import { listBenchJobs } from "@/lib/server/bench/pack";
import { getJobDetail } from "@/lib/server/jobs/detail";
import { jobMaps } from "@/lib/server/readings/maps";
import { queryAudit } from "@/lib/server/log/query";
import { COUNT_AHEAD } from "@/lib/server/log/repo";
import { syncFeed } from "@/lib/server/sync/feed";
import { readingsCsv } from "@/lib/server/readings/csv-export-stream";
import type { Case } from "./timing";

export type Subject = {
  shopId: number;
  machinist: Actor;
  jobId: number;
  heldJobs: number[];
  /** The middle half of the shop's audit trail in UTC days, [from, to]. */
  auditDays: [string, string];
};

const STATES: Record<FlagListQuery["state"], string> = {
  open: "f.state = 'open'",
  disposed: "f.state = 'disposed'",
  active: "f.state IN ('open', 'disposed')",
  closed: "f.state = 'closed'",
  all: "1",
};
// Each sort's keys in the order of its index (migration 20261205010000), and the direction that
// walks it forwards; the other direction walks it backwards, every key turned.
const FLAG_KEYS: Record<FlagListQuery["sort"], { forward: FlagListQuery["dir"]; keys: string[] }> = {
  age: { forward: "desc", keys: ["f.judged_at ASC"] },
  job: { forward: "asc", keys: ["f.job_code ASC", "f.station_id ASC"] },
  station: { forward: "asc", keys: ["f.station_id ASC"] },
  value: { forward: "asc", keys: ["f.value ASC"] },
  deviation: { forward: "asc", keys: ["f.deviation ASC"] },
  verdict: { forward: "desc", keys: ["f.verdict DESC", "f.judged_at ASC"] },
  reason: { forward: "desc", keys: ["f.reason DESC", "f.judged_at ASC"] },
  state: { forward: "desc", keys: ["f.state DESC", "f.judged_at ASC"] },
};
const turn = (key: string) => (key.endsWith(" ASC") ? key.replace(/ ASC$/, " DESC") : key.replace(/ DESC$/, " ASC"));

function flagOrder(q: FlagListQuery): string {
  const { forward, keys } = FLAG_KEYS[q.sort];
  const all = [...keys, "f.id ASC"];
  return (q.dir === forward ? all : all.map(turn)).join(", ");
}

function rawFlagPage(shopId: number, q: FlagListQuery) {
  const where = [`f.shop_id = ${shopId}`, STATES[q.state]];
  if (q.job) where.push(`f.job_id = ${q.job}`);
  if (q.verdict) where.push(`f.verdict = '${q.verdict}'`);
  if (q.reason) where.push(`f.reason = '${q.reason}'`);
  const w = where.join(" AND ");
  return async (c: Connection) =>
    Promise.all([
      c.query(`SELECT COUNT(*) AS n FROM flags f WHERE ${w}`),
      c.query(
        `SELECT f.*, j.code, j.title, j.status, j.unit_system, j.locked_at, u.name AS disposer,
           r.taken_at, r.instrument_id, r.taken_by, i.label, i.serial, i.calibration_due, t.name AS taker
         FROM flags f LEFT JOIN jobs j ON j.id = f.job_id LEFT JOIN users u ON u.id = f.disposed_by
           LEFT JOIN readings r ON r.id = f.reading_id LEFT JOIN instruments i ON i.id = r.instrument_id
           LEFT JOIN users t ON t.id = r.taken_by
         WHERE ${w} ORDER BY ${flagOrder(q)} LIMIT ${q.pageSize} OFFSET 0`,
      ),
    ]);
}

function flagCases(s: Subject): Case[] {
  const variants: [string, Record<string, string>][] = [
    ["default (active, oldest first)", {}],
    ...FLAG_SORTS.filter((x) => x !== "age").map((sort): [string, Record<string, string>] => [
      `sort ${sort}`,
      { sort },
    ]),
    ...(["open", "disposed", "closed", "all"] as const).map((state): [string, Record<string, string>] => [
      `state ${state}`,
      { state },
    ]),
    ["verdict out_of_spec", { verdict: "out_of_spec" }],
    ["verdict marginal", { verdict: "marginal" }],
    ["reason marginal", { reason: "marginal" }],
    ["reason gauge_past_due", { reason: "gauge_past_due" }],
    ["one job, all states", { job: String(s.jobId), state: "all" }],
  ];
  return variants.map(([label, params]) => {
    const q = flagListQuerySchema.parse(params);
    return { name: `flag queue: ${label}`, app: () => listFlags(s.shopId, q), raw: rawFlagPage(s.shopId, q) };
  });
}

// The page's ids inside the filter's index (shop_id, <filter>, id), named as the app names it, newest first,
// then their rows;
// a date range alone walks (shop_id, created_at). The count stops COUNT_AHEAD past the page, as the screen's.
const rawAuditPage =
  (index: string, where: string, args: unknown[], order = "e.id DESC") =>
  (c: Connection) =>
    Promise.all([
      c.query(`SELECT COUNT(*) AS n FROM (SELECT 1 FROM audit_events e WHERE ${where} LIMIT ?) counted`, [
        ...args,
        COUNT_AHEAD + 1,
      ]),
      c.query(
        `SELECT e.*, j.code, u.name FROM (SELECT e.id FROM audit_events e FORCE INDEX (${index})
         WHERE ${where} ORDER BY ${order} LIMIT 25) page
         JOIN audit_events e ON e.id = page.id LEFT JOIN jobs j ON j.id = e.job_id AND j.shop_id = e.shop_id
         LEFT JOIN users u ON u.id = e.user_id AND u.shop_id = e.shop_id ORDER BY ${order}`,
        args,
      ),
    ]);

const jobRows = (c: Connection, jobId: number) =>
  Promise.all([
    c.query(
      `SELECT j.*, e.description, e.cylinders, e.layout, e.mains, e.nominal_bore, e.nominal_stroke, cu.name AS customer
         FROM jobs j JOIN engines e ON e.id = j.engine_id
         JOIN customers cu ON cu.id = j.customer_id WHERE j.id = ?`,
      [jobId],
    ),
    c.query("SELECT * FROM job_limits WHERE job_id = ? ORDER BY sort_order", [jobId]),
    c.query("SELECT * FROM readings WHERE job_id = ?", [jobId]),
  ]);

export function cases(s: Subject): Case[] {
  const board = boardQuerySchema.parse({});
  const audit = auditQuerySchema.parse({});
  const auditJob = auditQuerySchema.parse({ job: String(s.jobId) });
  const [from, to] = s.auditDays;
  const auditDays = auditQuerySchema.parse({ from, to });
  // A date range with another filter walks the filter's index and checks each event's date.
  const auditFlagDays = auditQuerySchema.parse({ entity: "flag", from, to });
  const active = "'intake', 'measuring', 'review', 'released'";
  return [
    ...flagCases(s),
    {
      name: "jobs board: first page (active, by due date)",
      app: () => listJobBoard(s.shopId, board),
      raw: (c) =>
        Promise.all([
          c.query(
            `SELECT COUNT(*) AS n, (SELECT COUNT(*) FROM jobs WHERE shop_id = ?) AS shop_jobs
               FROM jobs j WHERE j.shop_id = ? AND j.status IN (${active})`,
            [s.shopId, s.shopId],
          ),
          c.query(
            `SELECT j.id, j.code, j.title, j.status, j.due_date, cu.name, e.description, p.*,
                 (SELECT COUNT(*) FROM flags f WHERE f.job_id = j.id AND f.state = 'open') AS open_flags,
                 (SELECT COUNT(*) FROM flags f WHERE f.job_id = j.id AND f.state = 'disposed') AS disposed_flags
               FROM jobs j JOIN customers cu ON cu.id = j.customer_id LEFT JOIN engines e ON e.id = j.engine_id
               LEFT JOIN job_progress p ON p.job_id = j.id
              WHERE j.shop_id = ? AND j.status IN (${active})
              ORDER BY j.due_date IS NULL, j.due_date, j.id LIMIT 25`,
            [s.shopId],
          ),
        ]),
    },
    {
      name: "bench job list (machinist)",
      app: () => listBenchJobs(s.machinist),
      raw: async (c) => {
        const jobs: { id: number }[] = await c.query(
          `SELECT j.*, e.description, e.cylinders, e.layout, e.mains, e.nominal_bore, e.nominal_stroke, cu.name AS customer
         FROM jobs j JOIN engines e ON e.id = j.engine_id
             JOIN customers cu ON cu.id = j.customer_id
            WHERE j.shop_id = ? AND j.status IN ('intake', 'measuring', 'review') AND j.locked_at IS NULL
            ORDER BY j.due_date, j.id`,
          [s.shopId],
        );
        const ids = jobs.length ? jobs.map((j) => j.id) : [0];
        return Promise.all([
          c.query("SELECT * FROM job_progress WHERE job_id IN (?)", [ids]),
          c.query("SELECT job_id, COUNT(*) AS n FROM flags WHERE job_id IN (?) AND state <> 'closed' GROUP BY job_id", [
            ids,
          ]),
        ]);
      },
    },
    {
      name: "job page (a finished V8)",
      app: () => getJobDetail(s.shopId, s.jobId),
      raw: (c) =>
        Promise.all([
          jobRows(c, s.jobId),
          c.query("SELECT state, COUNT(*) AS n FROM flags WHERE job_id = ? GROUP BY state", [s.jobId]),
          c.query("SELECT * FROM releases WHERE job_id = ? AND voided_at IS NULL", [s.jobId]),
        ]),
    },
    {
      name: "maps of a job",
      app: () => jobMaps(s.shopId, s.jobId),
      raw: (c) =>
        Promise.all([jobRows(c, s.jobId), c.query("SELECT * FROM instruments WHERE shop_id = ?", [s.shopId])]),
    },
    {
      name: "audit trail: first page",
      app: () => queryAudit(s.shopId, audit),
      raw: rawAuditPage("audit_events_shop_order", "e.shop_id = ?", [s.shopId]),
    },
    {
      name: "audit trail: one job",
      app: () => queryAudit(s.shopId, auditJob),
      raw: rawAuditPage("audit_events_shop_job", "e.shop_id = ? AND e.job_id = ?", [s.shopId, s.jobId]),
    },
    {
      name: "audit trail: date range (middle half)",
      app: () => queryAudit(s.shopId, auditDays),
      raw: rawAuditPage(
        "audit_events_shop_created",
        "e.shop_id = ? AND e.created_at >= ? AND e.created_at < DATE_ADD(?, INTERVAL 1 DAY)",
        [s.shopId, `${from} 00:00:00.000`, to],
        "e.created_at DESC, e.id DESC",
      ),
    },
    {
      name: "audit trail: flag events in the date range",
      app: () => queryAudit(s.shopId, auditFlagDays),
      raw: rawAuditPage(
        "audit_events_shop_entity",
        "e.shop_id = ? AND e.entity_type = 'flag' AND e.created_at >= ? AND e.created_at < DATE_ADD(?, INTERVAL 1 DAY)",
        [s.shopId, `${from} 00:00:00.000`, to],
      ),
    },
    {
      name: "sync feed: catch-up of 5 held jobs",
      app: () => syncFeed(s.shopId, "0", s.heldJobs),
      raw: async (c) => {
        const rows: { job_id: number; entity: string; entity_id: string }[] = await c.query(
          `SELECT seq, job_id, entity, entity_id FROM sync_changes FORCE INDEX (sync_changes_job_seq)
            WHERE job_id IN (?) AND shop_id = ? AND seq > 0 ORDER BY seq LIMIT 1000`,
          [s.heldJobs, s.shopId],
        );
        const of = (e: string) => rows.filter((r) => r.entity === e).map((r) => r.entity_id);
        const limitJobs = rows.filter((r) => r.entity === "job_limits").map((r) => r.job_id);
        return Promise.all([
          c.query(
            {
              sql: "SELECT * FROM jobs j JOIN engines e ON e.id = j.engine_id WHERE j.shop_id = ? AND j.id IN (?)",
              nestTables: true,
            },
            [s.shopId, s.heldJobs],
          ),
          c.query("SELECT * FROM job_limits WHERE job_id IN (?) ORDER BY job_id, sort_order, id", [
            limitJobs.concat(0),
          ]),
          c.query("SELECT * FROM readings WHERE job_id IN (?) AND id IN (?)", [s.heldJobs, of("reading").concat("-")]),
          // A reading's corrections (always of its own job).
          c.query(
            "SELECT id, station_id, supersedes, taken_at FROM readings WHERE job_id IN (?) AND supersedes IS NOT NULL",
            [s.heldJobs],
          ),
          c.query("SELECT * FROM flags WHERE job_id IN (?) AND id IN (?) ORDER BY id", [
            s.heldJobs,
            of("flag").concat("0"),
          ]),
        ]);
      },
    },
    {
      name: "CSV export of a job",
      // The whole file, as the download writes it.
      app: async () => {
        const { lines } = await readingsCsv(s.shopId, s.jobId);
        let bytes = 0;
        for await (const l of lines()) bytes += l.length;
        return bytes;
      },
      raw: (c) =>
        Promise.all([
          jobRows(c, s.jobId),
          c.query(
            `SELECT f.*, d.disposition AS d_kind, d.operation AS d_operation, d.reason AS d_reason,
               d.user_id AS d_user, d.created_at AS d_at FROM flags f LEFT JOIN flag_dispositions d ON d.flag_id = f.id
              WHERE f.job_id = ? ORDER BY f.id, d.id`,
            [s.jobId],
          ),
        ]),
    },
  ];
}
