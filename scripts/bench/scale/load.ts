// The bulk loader of bench:scale: a busy hosted service's history (benchmark data only) of about
// 1,000,000 readings over about 4,000 V8 jobs in 20 shops. Each kind of job (variants.ts) is first
// lived once through the real server code (templates.ts: the ingest of POST /api/sync, the lead's
// decisions), and its rows are then copied job by job (clone.ts) with multi-row INSERTs
// (writer.ts): readings with their verdicts, flags, decisions, audit events and change-feed rows
// exactly as the server wrote them, apart from ids and times. tests/integration/scale-loader.test.ts
// shows a copy equals what the ingest writes for the same readings.
import mariadb, { type Connection } from "mariadb";
import { loadavg } from "node:os";
import { getSequelize } from "@/lib/server/core/db";
import { TABLES, cloneJob, readTemplate, type Ids, type Row, type Template } from "./clone";
import { actorsOf, createShops, createV8Job, gaugeMap, peopleMap, type BenchShop } from "./fixture";
import { isSignEvent, sealReleases } from "./seal";
import { runVariant } from "./templates";
import { VARIANTS, statusAt, type Variant } from "./variants";
import { ownerUrl } from "./owner";
import { BulkWriter } from "./writer";

export { ownerUrl };

export type LoadOptions = {
  /** Readings to reach in all (templates included); the job count follows. */
  readings?: number;
  shops?: number;
  /** The variants to use (all by default); a test passes one. */
  variants?: Variant[];
  log?: (line: string) => void;
};
export type LoadSummary = {
  shops: BenchShop[];
  jobs: number;
  readings: number;
  templates: { variant: Variant; jobId: number; shopId: number }[];
  ms: number;
};

const DAY = 86_400_000;
const HISTORY_DAYS = 3 * 365; // the oldest job was measured three years ago
const load = () => `load ${loadavg()[0].toFixed(1)}`;

async function maxId(conn: Connection, table: string): Promise<number> {
  const [row] = await conn.query(`SELECT COALESCE(MAX(id), 0) AS id FROM ${table}`);
  return Number(row.id);
}

/** Lives each variant once on a job of its own (in shop `variant.id mod shops`). */
async function makeTemplates(conn: Connection, shops: BenchShop[], variants: Variant[], log: (s: string) => void) {
  const templates = new Map<number, Template & { shop: BenchShop }>();
  const endAt = Date.now() - 60_000;
  for (const v of variants) {
    const shop = shops[v.id % shops.length];
    const jobId = await createV8Job(shop, `T-${v.id + 1}`);
    const before = await maxId(conn, "audit_events");
    await runVariant(conn, actorsOf(shop), jobId, v, endAt);
    const t = await readTemplate(conn, jobId, endAt, [before, await maxId(conn, "audit_events")]);
    templates.set(v.id, { ...t, shop });
    log(`  template ${v.id + 1}/${variants.length} (${v.status}, ${t.rows.readings.length} readings) [${load()}]`);
  }
  return templates;
}

type Slot = { shop: BenchShop; index: number; k: number; n: number; template: Template & { shop: BenchShop } };

/** The jobs per shop that bring the readings to `target`, each with the variant of its place in time. */
function plan(
  shops: BenchShop[],
  variants: Variant[],
  templates: Map<number, Template & { shop: BenchShop }>,
  target: number,
) {
  const pick = (s: number, k: number, n: number) => {
    const status = statusAt(k, n);
    const fits = variants.filter((v) => v.status === status);
    const v = (fits.length ? fits : variants)[(s * 7 + k * 3) % (fits.length || variants.length)];
    return templates.get(v.id)!;
  };
  const already = [...templates.values()].reduce((n, t) => n + t.rows.readings.length, 0);
  const slots = (n: number): Slot[] =>
    shops.flatMap((shop, index) =>
      Array.from({ length: n }, (_, k) => ({ shop, index, k, n, template: pick(index, k, n) })),
    );
  const total = (ss: Slot[]) => ss.reduce((sum, s) => sum + s.template.rows.readings.length, already);
  let n = 1;
  while (total(slots(n)) < target) n = Math.max(n + 1, Math.floor(n * 1.1));
  while (n > 1 && total(slots(n - 1)) >= target) n--;
  return slots(n);
}

async function nextIds(conn: Connection): Promise<Ids> {
  const ids = {} as Ids;
  for (const t of TABLES) if (t !== "readings") ids[t] = (await maxId(conn, t)) + 1;
  return ids;
}

export async function loadScale(opts: LoadOptions = {}): Promise<LoadSummary> {
  const t0 = performance.now();
  const log = opts.log ?? (() => {});
  const variants = opts.variants ?? VARIANTS;
  getSequelize();
  const conn = await mariadb.createConnection(ownerUrl());
  try {
    const shops = await createShops(opts.shops ?? 20);
    log(`  ${shops.length} shops made; living ${variants.length} kinds of job through the real ingest`);
    const templates = await makeTemplates(conn, shops, variants, log);
    const slots = plan(shops, variants, templates, opts.readings ?? 1_000_000);
    log(`  copying to ${slots.length} jobs (${slots[0]?.n ?? 0} per shop) [${load()}]`);
    const ids = await nextIds(conn);
    const firstCopiedRelease = ids.releases;
    // Copies of rows the server wrote and checked: the keys they point to exist by construction.
    await conn.query("SET SESSION foreign_key_checks = 0, unique_checks = 0");
    const writer = new BulkWriter(conn);
    const now = Date.now();
    let readings = [...templates.values()].reduce((n, t) => n + t.rows.readings.length, 0);
    let reported = 0;
    const signEvents: Row[] = [];
    for (const [i, s] of slots.entries()) {
      const ageDays = ((s.n - s.k) / s.n) * HISTORY_DAYS;
      const rows = cloneJob(
        s.template,
        {
          shopId: s.shop.id,
          customerId: s.shop.customerIds[s.k % s.shop.customerIds.length],
          code: `B-${String(s.k + 1).padStart(5, "0")}`,
          title: `Street V8 rebuild ${s.k + 1} of shop ${s.index + 1}`,
          users: peopleMap(s.template.shop, s.shop),
          gauges: gaugeMap(s.template.shop, s.shop),
          signerName: s.shop.people.find((p) => p.role === "inspector")!.name,
          endAt: now - Math.max(ageDays * DAY, 2 * 3_600_000),
        },
        ids,
      );
      // A copied release's sign event names its hash, taken once its rows are in (seal.ts).
      signEvents.push(...rows.audit_events.filter(isSignEvent));
      rows.audit_events = rows.audit_events.filter((a) => !isSignEvent(a));
      for (const t of TABLES) await writer.add(t, rows[t]);
      readings += rows.readings.length;
      if (i + 1 === slots.length || (i + 1) / slots.length >= reported + 0.1) {
        reported = Math.floor(((i + 1) / slots.length) * 10) / 10;
        const seconds = ((performance.now() - t0) / 1000).toFixed(0);
        log(`  ${i + 1} jobs, ${readings.toLocaleString("en-US")} readings (${seconds} s) [${load()}]`);
      }
    }
    await writer.finish(TABLES);
    const sealing = performance.now();
    const sealed = await sealReleases(conn, firstCopiedRelease, signEvents, writer);
    log(
      `  ${sealed.releases} copied releases sealed with their own hash and stored record (PDF, SHA-256) in ` +
        `${((performance.now() - sealing) / 1000).toFixed(0)} s by ${sealed.processes} processes [${load()}]`,
    );
    await conn.query("SET SESSION foreign_key_checks = 1, unique_checks = 1");
    return {
      shops,
      jobs: slots.length + templates.size,
      readings,
      templates: [...templates.entries()].map(([id, t]) => ({
        variant: variants.find((v) => v.id === id)!,
        jobId: t.jobId,
        shopId: t.shopId,
      })),
      ms: performance.now() - t0,
    };
  } finally {
    await conn.end();
  }
}
