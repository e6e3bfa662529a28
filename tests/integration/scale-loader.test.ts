// The bulk loader of bench:scale (scripts/bench/scale/load.ts) copies rows instead of sending
// every reading through the ingest. This shows a copied job, in another shop, holds exactly the
// rows the real ingest and the lead's decisions write for the same readings: the same columns,
// figures, verdicts, flags, decisions, audit events and change-feed rows, apart from ids and times.
// Benchmark data only (scripts/bench/scale/variants.ts, invented figures).
import { createHash } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import mariadb, { type Connection } from "mariadb";
import { loadScale, ownerUrl } from "../../scripts/bench/scale/load";
import { actorsOf, createV8Job } from "../../scripts/bench/scale/fixture";
import { runVariant } from "../../scripts/bench/scale/templates";
import { VARIANTS } from "../../scripts/bench/scale/variants";
import { verifyRelease } from "@/lib/server/release/hash-verify";
import { recordFile } from "@/lib/server/record/stored";

type Row = Record<string, unknown>;
const TIMES = [
  ...["created_at", "updated_at", "received_at", "taken_at", "disposed_at", "closed_at", "locked_at", "judged_at"],
  ...["signed_at", "voided_at", "record_stored_at"],
];
const ISO = /^\d{4}-\d\d-\d\dT[\d:.]+Z$/;

let conn: Connection;
afterAll(async () => conn?.end());

/** Every row of one job, with ids replaced by their place (R3, F1, …) and times left out. */
async function picture(jobId: number) {
  const q = (sql: string, args: unknown[]) => conn.query(sql, args) as Promise<Row[]>;
  const [job] = await q("SELECT * FROM jobs WHERE id = ?", [jobId]);
  const readings = await q("SELECT * FROM readings WHERE job_id = ? ORDER BY taken_at", [jobId]);
  const flags = await q("SELECT * FROM flags WHERE job_id = ? ORDER BY id", [jobId]);
  const releases = await q("SELECT * FROM releases WHERE job_id = ? ORDER BY id", [jobId]);
  const decisions = flags.length
    ? await q("SELECT * FROM flag_dispositions WHERE flag_id IN (?) ORDER BY id", [flags.map((f) => f.id)])
    : [];
  const users = await q("SELECT id, role, email FROM users WHERE shop_id = ?", [job.shop_id]);
  const gauges = await q("SELECT id, serial FROM instruments WHERE shop_id = ?", [job.shop_id]);
  const ids = new Map<string, string>([[`job:${jobId}`, "JOB"]]);
  readings.forEach((r, i) => ids.set(`reading:${r.id}`, `R${i}`));
  flags.forEach((f, i) => ids.set(`flag:${f.id}`, `F${i}`));
  decisions.forEach((d, i) => ids.set(`disposition:${d.id}`, `D${i}`));
  releases.forEach((r, i) => ids.set(`release:${r.id}`, `S${i}`));
  // A person by role and number (machinist2@…), a gauge by its serial: the same in every bench shop.
  users.forEach((u) => ids.set(`user:${u.id}`, String(u.email).split("@")[0]));
  gauges.forEach((g) => ids.set(`gauge:${g.id}`, String(g.serial)));
  const name = (kind: string, v: unknown) => (v == null ? v : (ids.get(`${kind}:${v}`) ?? `unknown ${kind} ${v}`));
  const json = (v: unknown, key = ""): unknown => {
    // A release's hash is over the job's own rows (ids, times): checked below against its release.
    if (key === "hash") return "hash";
    if (key === "jobCode") return v === job.code ? "the job's code" : `another code ${String(v)}`;
    if (typeof v === "string") return ISO.test(v) ? "time" : (ids.get(`reading:${v}`) ?? v);
    if (typeof v === "number" && /^(jobId|flagId|dispositionId|userId|disposedBy|takenBy)$/.test(key)) {
      const kind = { jobId: "job", flagId: "flag", dispositionId: "disposition" }[key] ?? "user";
      return name(kind, v);
    }
    if (Array.isArray(v)) return v.map((x) => json(x));
    if (key === "digests") return "digests";
    if (v && typeof v === "object") return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, json(x, k)]));
    return v;
  };
  const plain = (r: Row, named: Record<string, string>): Row =>
    Object.fromEntries(
      Object.entries(r)
        .filter(([k]) => !TIMES.includes(k) && k !== "shop_id")
        .map(([k, v]) => [k, named[k] ? name(named[k], v) : v]),
    );
  const entity = (type: unknown) =>
    ({ job: "job", job_limits: "job", flag: "flag", reading: "reading", release: "release" })[String(type)];
  // Audit events of this job: on the job, its flags, its readings.
  const audits = (await q("SELECT * FROM audit_events WHERE shop_id = ? ORDER BY id", [job.shop_id])).filter((a) =>
    ids.has(`${entity(a.entity_type)}:${a.entity_id}`),
  );
  const changes = await q("SELECT * FROM sync_changes WHERE job_id = ? ORDER BY id", [jobId]);
  const takenAt = new Map(readings.map((r) => [r.id, (r.taken_at as Date).getTime()]));
  const judgedAt = (f: Row) => {
    const at = (f.judged_at as Date).getTime();
    if (f.reading_id != null) return at === takenAt.get(f.reading_id) ? "its reading's time" : "another time";
    return at === (f.created_at as Date).getTime() ? "its own time" : "another time";
  };
  return {
    job: { status: job.status, locked: job.locked_at !== null, unit: job.unit_system, bore: job.finished_bore },
    limits: (await q("SELECT * FROM job_limits WHERE job_id = ? ORDER BY sort_order", [jobId])).map((l) =>
      plain({ ...l, id: null }, { job_id: "job" }),
    ),
    readings: readings.map((r) =>
      plain(r, { id: "reading", supersedes: "reading", job_id: "job", taken_by: "user", instrument_id: "gauge" }),
    ),
    flags: flags.map((f) => ({
      ...plain(f, {
        id: "flag",
        job_id: "job",
        reading_id: "reading",
        closed_by_reading_id: "reading",
        disposed_by: "user",
      }),
      job_code: f.job_code === job.code ? "the job's code" : f.job_code,
      judged_at: judgedAt(f),
    })),
    decisions: decisions.map((d) => plain(d, { id: "disposition", flag_id: "flag", user_id: "user" })),
    releases: releases.map((r) => ({
      ...plain(r, { id: "release", job_id: "job", inspector_id: "user", voided_by: "user" }),
      // Each is checked on its own below: the copy's own hash, its own record stored when sealed.
      hash: "hash",
      record_key: null,
      record_sha256: null,
      record_bytes: null,
      checklist: json(typeof r.checklist === "string" ? JSON.parse(r.checklist) : r.checklist),
    })),
    audits: audits.map((a) => ({
      ...plain({ ...a, id: null }, { user_id: "user", job_id: "job" }),
      entity_id: name(entity(a.entity_type)!, a.entity_id),
      before: json(typeof a.before === "string" ? JSON.parse(a.before) : a.before),
      after: json(typeof a.after === "string" ? JSON.parse(a.after) : a.after),
    })),
    changes: changes.map((c) => ({
      ...plain({ ...c, id: null }, { job_id: "job" }),
      entity_id: name(entity(c.entity)!, c.entity_id),
    })),
  };
}

describe("bench:scale's bulk loader", () => {
  it("writes for a copied job exactly the rows the ingest writes for the same readings", async () => {
    // A finished, signed job: both passes, flags decided every way (machine again, measure again,
    // accept), the inspector's release.
    const variant = VARIANTS.find((v) => v.status === "closed" && v.secondPass && v.settle)!;
    const loaded = await loadScale({ shops: 2, readings: 700, variants: [variant] });
    conn = await mariadb.createConnection(ownerUrl());
    const other = loaded.shops[1];
    const [copy] = await conn.query("SELECT id FROM jobs WHERE shop_id = ? AND code LIKE 'B-%' ORDER BY id", [
      other.id,
    ]);
    expect(copy).toBeDefined();

    // The same readings (same figures, gauges and decisions; fresh ids) sent through the ingest.
    const direct = await createV8Job(other, "DIRECT-1");
    await runVariant(conn, actorsOf(other), direct, variant, Date.now() - 3_600_000);

    const copied = await picture(Number(copy.id));
    const ingested = await picture(direct);
    expect(copied.readings.length).toBeGreaterThan(300);
    expect(copied.flags.length).toBeGreaterThan(3);
    expect(copied.decisions.length).toBeGreaterThan(3);
    expect(new Set(copied.readings.map((r) => r.verdict))).toContain("out_of_spec");
    expect(copied.audits.map((a) => (a as Row).action)).toContain("readings.sync");
    expect(copied.changes.length).toBeGreaterThanOrEqual(copied.readings.length);
    const text = JSON.stringify(copied, (_k, v) => (typeof v === "bigint" ? String(v) : v));
    expect(text).not.toContain("unknown");
    expect(copied).toEqual(ingested);

    // The copy is signed: its own hash verifies, the sign event names it, and its record is served.
    expect(copied.releases).toHaveLength(1);
    for (const jobId of [Number(copy.id), direct])
      expect((await verifyRelease(other.id, jobId)).status, `job ${jobId}`).toBe("match");
    const [signed] = await conn.query(
      `SELECT r.hash, JSON_VALUE(a.after, '$.hash') AS told FROM releases r JOIN audit_events a
         ON a.entity_type = 'release' AND a.entity_id = r.id AND a.action = 'release.sign' WHERE r.job_id = ?`,
      [copy.id],
    );
    expect(signed.told).toBe(signed.hash);
    // Its own record was stored when it was sealed, as at a signature, and is handed out as those bytes.
    const keptSql = "SELECT record_key AS k, record_sha256 AS sha, record_bytes AS n FROM releases WHERE job_id = ?";
    const [stored] = await conn.query(keptSql, [copy.id]);
    const key = new RegExp(`^${other.id}/records/release-\\d+-${String(stored.sha).slice(0, 16)}\\.pdf$`);
    expect(stored.k).toMatch(key);
    const file = await recordFile(other.id, Number(copy.id));
    expect(file.kept).toBe(true);
    expect(file.pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(file.sha256).toBe(createHash("sha256").update(file.pdf).digest("hex"));
    expect([file.sha256, file.pdf.length]).toEqual([stored.sha, Number(stored.n)]);
    const [after] = await conn.query(keptSql, [copy.id]);
    expect(after.k).toBe(stored.k); // served from storage, not drawn and stored again
  }, 300_000);
});
