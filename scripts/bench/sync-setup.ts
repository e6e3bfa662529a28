// The bench:sync fixture: a migrated throwaway database with one invented shop, a machinist,
// V8 jobs with the demo street spec, and the two ways of writing readings that are compared.
import { randomUUID } from "node:crypto";
import mariadb from "mariadb";
import { POST } from "@/app/api/sync/route";
import { closeSequelize, getSequelize } from "@/lib/server/core/db";
import { migrateUp } from "@/lib/server/core/migrate";
import { appOrigin } from "@/lib/server/core/origin";
import { SESSION_COOKIE } from "@/lib/server/core/session";
import { openSession } from "@/lib/server/sessions/lifecycle";
import { setSqlTrace } from "@/lib/server/core/sql-driver";
import { Customer, Engine, Job, JobLimit, Shop, User } from "@/models";
import { READING_COLUMNS } from "@/lib/schemas/readings";
import type { PushReadingInput } from "@/lib/schemas/sync";
import { STREET_V8_INCH } from "../seed/demo-specs";
import { createDemoGauges } from "./bench-gauges";

const COLUMNS = [...Object.values(READING_COLUMNS), "created_at", "updated_at"];
type Row = Record<string, unknown>;

async function fixture(jobs: number) {
  const sequelize = getSequelize();
  await migrateUp(sequelize);
  const shop = await Shop.create({
    name: "Bench shop (benchmark data)",
    slug: `bench-${randomUUID().slice(0, 6)}`,
    unitSystem: "in",
  });
  const user = await User.create({
    shopId: shop.id,
    name: "Bench machinist",
    email: "bench@bench.example",
    passwordHash: "x",
    role: "machinist",
  });
  const customer = await Customer.create({ shopId: shop.id, name: "Bench customer" });
  const engine = await Engine.create({
    shopId: shop.id,
    customerId: customer.id,
    description: "Benchmark V8",
    cylinders: 8,
    layout: "v",
    mains: 5,
    unitSystem: "in",
    nominalBore: 4.03,
    nominalStroke: 3.48,
    blockMaterial: "greyCastIron",
  });
  const jobIds: number[] = [];
  for (let i = 0; i < jobs; i++) {
    const job = await Job.create({
      shopId: shop.id,
      customerId: customer.id,
      engineId: engine.id,
      code: `B-${i + 1}`,
      title: `Bench job ${i + 1}`,
      unitSystem: "in",
      status: "measuring",
      finishedBore: 4.03,
      finishedMainJournal: 2.449,
      finishedRodJournal: 2.099,
    });
    await JobLimit.bulkCreate(STREET_V8_INCH.map((l, k) => ({ ...l, jobId: job.id, sortOrder: k })) as never[]);
    jobIds.push(job.id);
  }
  const gauges = await createDemoGauges(shop.id);
  const cookie = `${SESSION_COOKIE}=${(await openSession({ id: user.id, shopId: shop.id, role: "machinist", name: user.name })).cookie}`;
  return { jobIds, cookie, gauges };
}

/**
 * With TW_BENCH_TRACE=1: wall time per kind of SQL statement, from Sequelize's benchmark logging
 * and from the hot path's own driver calls (lib/server/core/sql-driver.ts). Pipelined statements
 * overlap, so their times add up to more than the wall clock.
 */
function traceQueries() {
  const timing = new Map<string, [number, number]>();
  const record = (sql: string, ms: number) => {
    const key = sql
      .replace(/^Execut\w+ \([^)]*\): /, "")
      .replace(/\s+/g, " ")
      .replace(/\d+/g, "N")
      .slice(0, 70);
    const cur = timing.get(key) ?? [0, 0];
    timing.set(key, [cur[0] + 1, cur[1] + ms]);
  };
  if (process.env.TW_BENCH_TRACE) {
    const options = (getSequelize() as unknown as { options: { benchmark?: boolean; logging?: unknown } }).options;
    options.benchmark = true;
    options.logging = (sql: string, ms: number) => record(sql, ms);
    setSqlTrace(record);
  }
  const print = () => {
    for (const [k, [n, ms]] of [...timing].sort((a, b) => b[1][1] - a[1][1]).slice(0, 20))
      console.log(`${ms.toFixed(0).padStart(7)} ms ${String(n).padStart(6)}× ${k}`);
  };
  return { print };
}

export async function setUp(jobs: number) {
  const { jobIds, cookie, gauges } = await fixture(jobs);
  const trace = traceQueries();

  const conn = await mariadb.createConnection(process.env.DATABASE_URL!);

  /** Sends the readings in batches; `clients` tablets at once, each with its own share of the jobs. */
  async function pushAll(readings: PushReadingInput[], batch: number, clients: number) {
    const jobs = [...new Set(readings.map((r) => r.jobId))];
    const tablet = async (c: number) => {
      const mine = readings.filter((r) => jobs.indexOf(r.jobId) % clients === c);
      for (let i = 0; i < mine.length; i += batch) {
        const body = JSON.stringify({ deviceId: `bench-tablet-${c}`, readings: mine.slice(i, i + batch) });
        const req = new Request("http://localhost/api/sync", {
          method: "POST",
          // As the tablet's page sends it: its own origin, a JSON body.
          headers: { cookie, origin: appOrigin(), "content-type": "application/json" },
          body,
        });
        const res = await POST(req);
        if (res.status !== 200) throw new Error(`POST /api/sync answered ${res.status}: ${await res.text()}`);
        await res.arrayBuffer();
      }
    };
    await Promise.all(Array.from({ length: clients }, (_, c) => tablet(c)));
  }

  /** The handler's stored rows of `from` jobs, as new rows (fresh ids) of the `to` jobs. */
  async function rowsLikeMany(from: number[], to: number[]): Promise<Row[]> {
    const map = new Map(from.map((id, i) => [id, to[i]]));
    const rows: Row[] = await conn.query(
      `SELECT ${COLUMNS.join(", ")} FROM readings WHERE job_id IN (?) ORDER BY job_id, taken_at, id`,
      [from],
    );
    return rows.map((r) => ({ ...r, id: randomUUID(), job_id: map.get(Number(r.job_id)), supersedes: null }));
  }

  async function rawInsert(rows: Row[]) {
    if (rows.length === 0) return;
    const tuple = `(${COLUMNS.map(() => "?").join(",")})`;
    const sql = `INSERT INTO readings (${COLUMNS.join(",")}) VALUES ${rows.map(() => tuple).join(",")}`;
    await conn.query(
      sql,
      rows.flatMap((r) => COLUMNS.map((c) => r[c])),
    );
  }

  const globalStatus = async (name: string) => Number((await conn.query("SHOW GLOBAL STATUS LIKE ?", [name]))[0].Value);
  const countIn = async (sql: string, ids: number[]) => Number((await conn.query(sql, [ids]))[0].n);
  return {
    printTrace: trace.print,
    questions: () => globalStatus("Questions"),
    globalStatus,
    jobIds,
    gauges,
    pushAll,
    rowsLike: (from: number, to: number) => rowsLikeMany([from], [to]),
    rowsLikeMany,
    rawInsert,
    countReadings: (ids: number[]) => countIn("SELECT COUNT(*) AS n FROM readings WHERE job_id IN (?)", ids),
    countFlags: (ids: number[]) => countIn("SELECT COUNT(*) AS n FROM flags WHERE job_id IN (?)", ids),
    close: async () => {
      await conn.end();
      await closeSequelize();
    },
  };
}
