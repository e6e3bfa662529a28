// Copies one template job (every row the real server code wrote for it) to another job of the
// same or another shop: new ids for the job, its engine, limits, readings, flags, decisions, audit
// events and change-feed rows, the shop's own people, and every time moved by the same offset.
// Everything else (figures, verdicts, flags' states, audit words) stays exactly as written.
import { randomUUID } from "node:crypto";
import type { Connection } from "mariadb";

export type Row = Record<string, unknown>;
export const TABLES = [
  "engines",
  "jobs",
  "job_limits",
  "readings",
  "flags",
  "flag_dispositions",
  "releases",
  "audit_events",
  "sync_changes",
] as const;
export type Table = (typeof TABLES)[number];
export type Rows = Record<Table, Row[]>;

export type Template = { jobId: number; shopId: number; endAt: number; rows: Rows };

/** Where a copy goes: its shop, customer, the shop's person for each template person, its time. */
export type Target = {
  shopId: number;
  customerId: number;
  code: string;
  title: string;
  users: Map<number, number>;
  gauges: Map<number, number>;
  /** The name the copy's inspector signs with (a release's typed signature). */
  signerName: string;
  endAt: number;
};

/** The next explicit id of each table (the loader is the only writer while it runs). */
export type Ids = Record<Exclude<Table, "readings">, number>;

/** Every row the template job owns; `audit` is the id range of the events written while it ran. */
export async function readTemplate(
  conn: Connection,
  jobId: number,
  endAt: number,
  audit: [number, number],
): Promise<Template> {
  const q = (sql: string, args: unknown[]) => conn.query({ sql, dateStrings: false }, args) as Promise<Row[]>;
  const [job] = await q("SELECT * FROM jobs WHERE id = ?", [jobId]);
  const flags = await q("SELECT * FROM flags WHERE job_id = ? ORDER BY id", [jobId]);
  const rows: Rows = {
    engines: await q("SELECT * FROM engines WHERE id = ?", [job.engine_id]),
    jobs: [job],
    job_limits: await q("SELECT * FROM job_limits WHERE job_id = ? ORDER BY id", [jobId]),
    readings: await q("SELECT * FROM readings WHERE job_id = ? ORDER BY received_at, taken_at, id", [jobId]),
    flags,
    flag_dispositions: flags.length
      ? await q("SELECT * FROM flag_dispositions WHERE flag_id IN (?) ORDER BY id", [flags.map((f) => f.id)])
      : [],
    audit_events: await q("SELECT * FROM audit_events WHERE id > ? AND id <= ? ORDER BY id", audit),
    releases: await q("SELECT * FROM releases WHERE job_id = ? ORDER BY id", [jobId]),
    sync_changes: await q("SELECT * FROM sync_changes WHERE job_id = ? ORDER BY id", [jobId]),
  };
  return { jobId, shopId: Number(job.shop_id), endAt, rows };
}

const USER_COLUMNS = ["taken_by", "disposed_by", "user_id", "voided_by", "inspector_id"];
// Keys inside audit JSON naming a row by its number.
const JSON_KEYS: Record<string, "job" | "flag" | "disposition" | "release" | "user"> = {
  jobId: "job",
  releaseId: "release",
  flagId: "flag",
  dispositionId: "disposition",
  userId: "user",
  disposedBy: "user",
  takenBy: "user",
};
const ISO = /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d(\.\d+)?Z$/;

type Maps = {
  job: Map<number, number>;
  flag: Map<number, number>;
  disposition: Map<number, number>;
  release: Map<number, number>;
  user: Map<number, number>;
  /** Words naming the copy: its code, its signer. */
  words: Record<string, string>;
  reading: Map<string, string>;
  offset: number;
};

function mapJson(value: unknown, m: Maps, key = ""): unknown {
  if (typeof value === "string" && key in m.words) return m.words[key];
  if (typeof value === "string") {
    if (m.reading.has(value)) return m.reading.get(value);
    if (ISO.test(value)) return new Date(Date.parse(value) + m.offset).toISOString();
    return value;
  }
  if (typeof value === "number") {
    const kind = JSON_KEYS[key];
    return kind ? (m[kind].get(value) ?? value) : value;
  }
  if (Array.isArray(value)) return value.map((v) => mapJson(v, m));
  if (value && typeof value === "object")
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, mapJson(v, m, k)]));
  return value;
}

const json = (v: unknown, m: Maps) =>
  v === null || v === undefined ? v : JSON.stringify(mapJson(typeof v === "string" ? JSON.parse(v) : v, m));

/** The rows of `t` for `target`, with fresh ids taken from `ids`. */
export function cloneJob(t: Template, target: Target, ids: Ids): Rows {
  const r = t.rows;
  const jobId = ids.jobs++;
  const engineId = ids.engines++;
  const m: Maps = {
    job: new Map([[t.jobId, jobId]]),
    flag: new Map(r.flags.map((f) => [Number(f.id), ids.flags++])),
    disposition: new Map(r.flag_dispositions.map((d) => [Number(d.id), ids.flag_dispositions++])),
    release: new Map(r.releases.map((x) => [Number(x.id), ids.releases++])),
    user: target.users,
    words: { jobCode: target.code, typedSignature: target.signerName },
    reading: new Map(r.readings.map((x) => [String(x.id), randomUUID()])),
    offset: target.endAt - t.endAt,
  };
  const shift = (v: unknown) => (v instanceof Date ? new Date(v.getTime() + m.offset) : v);
  const common = (row: Row): Row => {
    const out: Row = {};
    for (const [k, v] of Object.entries(row)) out[k] = shift(v);
    if ("shop_id" in row) out.shop_id = target.shopId;
    if ("job_id" in row) out.job_id = jobId;
    for (const c of USER_COLUMNS) if (row[c] != null) out[c] = m.user.get(Number(row[c])) ?? row[c];
    if (row.instrument_id != null) out.instrument_id = target.gauges.get(Number(row.instrument_id));
    return out;
  };
  const reading = (id: unknown) => (id == null ? id : m.reading.get(String(id)));
  const entityId = (type: unknown, id: unknown) => {
    if (type === "job" || type === "job_limits") return String(m.job.get(Number(id)) ?? id);
    if (type === "flag") return String(m.flag.get(Number(id)) ?? id);
    if (type === "release") return String(m.release.get(Number(id)) ?? id);
    if (type === "reading") return m.reading.get(String(id)) ?? id;
    return id;
  };
  const job = r.jobs[0];
  return {
    engines: r.engines.map((e) => ({ ...common(e), id: engineId, customer_id: target.customerId })),
    jobs: [
      {
        ...common(job),
        id: jobId,
        engine_id: engineId,
        customer_id: target.customerId,
        code: target.code,
        title: target.title,
        context_revision: 0, // the insert trigger gives the copy its own
      },
    ],
    job_limits: r.job_limits.map((l) => ({ ...common(l), id: ids.job_limits++ })),
    readings: r.readings.map((x) => ({ ...common(x), id: reading(x.id), supersedes: reading(x.supersedes) })),
    flags: r.flags.map((f) => ({
      ...common(f),
      id: m.flag.get(Number(f.id)),
      job_code: target.code,
      reading_id: reading(f.reading_id),
      closed_by_reading_id: reading(f.closed_by_reading_id),
    })),
    flag_dispositions: r.flag_dispositions.map((d) => ({
      ...common(d),
      id: m.disposition.get(Number(d.id)),
      flag_id: m.flag.get(Number(d.flag_id)),
    })),
    // The hash and its per-item digests are the template's until sealReleases() takes the copy's
    // own and stores the copy's own record file (seal-worker.ts).
    releases: r.releases.map((x) => ({
      ...common(x),
      id: m.release.get(Number(x.id)),
      signed_name: target.signerName,
      record_key: null,
      record_sha256: null,
      record_bytes: null,
      record_stored_at: null,
    })),
    audit_events: r.audit_events.map((a) => ({
      ...common(a),
      id: ids.audit_events++,
      job_id: a.job_id == null ? null : jobId,
      entity_id: entityId(a.entity_type, a.entity_id),
      before: json(a.before, m),
      after: json(a.after, m),
    })),
    sync_changes: r.sync_changes.map((c) => ({
      ...common(c),
      id: ids.sync_changes++,
      entity_id: entityId(c.entity, c.entity_id),
    })),
  };
}
