// One of the processes that seal bench:scale's copied releases (seal.ts starts a few, one a core):
// it takes its share of them (id mod parts), and for each does what a signature does once it
// commits: the hash and per-item digests taken by the server's own functions over the copy's rows
// (its readings, flags, decisions, limits, gauges and signature), exactly as signRelease takes
// them, then the build record rendered and kept in object storage with its SHA-256 on the release
// (storeReleaseRecord, the function a real signature calls). The record prints the hash, so the
// hash goes in first. Prints its progress and CPU time with the load average.
import mariadb, { type Connection } from "mariadb";
import { loadavg } from "node:os";
import { closeSequelize, getSequelize } from "@/lib/server/core/db";
import { storeReleaseRecord } from "@/lib/server/record/stored";
import { itemDigests, releaseHash } from "@/lib/server/release/hash";
import { buildSnapshot, gaugeRecord } from "@/lib/server/release/hash-snapshot";
import { loadJobRecord } from "@/lib/server/release/repo";
import { ownerUrl } from "./owner";

type Release = {
  id: number;
  shop_id: number;
  job_id: number;
  inspector_id: number;
  signed_name: string;
  signed_at: Date;
  checklist: unknown;
};

// Two releases in flight: one renders while the other waits on the database or storage.
const AT_ONCE = 2;
const load = () => `load ${loadavg()[0].toFixed(1)}`;
const parsed = (v: unknown) => (typeof v === "string" ? JSON.parse(v) : v) as Record<string, unknown>;

async function seal(conn: Connection, r: Release): Promise<void> {
  const [shopId, jobId, releaseId] = [Number(r.shop_id), Number(r.job_id), Number(r.id)];
  const record = await loadJobRecord(shopId, jobId);
  const gauges = record.instruments.map(gaugeRecord);
  const signature = { inspectorId: Number(r.inspector_id), signedName: r.signed_name, signedAt: r.signed_at };
  const snapshot = buildSnapshot(record, signature, gauges);
  const hash = releaseHash(snapshot);
  const checklist = { ...parsed(r.checklist), gauges, digests: itemDigests(snapshot) };
  await conn.query("UPDATE releases SET hash = ?, checklist = ? WHERE id = ?", [hash, JSON.stringify(checklist), r.id]);
  await storeReleaseRecord(shopId, jobId, releaseId);
}

async function main() {
  const [from, part, parts] = ["TW_SEAL_FROM", "TW_SEAL_PART", "TW_SEAL_PARTS"].map((k) => Number(process.env[k]));
  const label = `seal ${part + 1}/${parts}`;
  const [t0, cpu] = [performance.now(), process.cpuUsage()];
  getSequelize();
  const conn = await mariadb.createConnection(ownerUrl());
  try {
    const queue = (await conn.query(
      {
        sql: `SELECT id, shop_id, job_id, inspector_id, signed_name, signed_at, checklist FROM releases
              WHERE id >= ? AND MOD(id, ?) = ? ORDER BY id`,
        dateStrings: false,
      },
      [from, parts, part],
    )) as Release[];
    const total = queue.length;
    let done = 0;
    let reported = 0;
    const worker = async () => {
      for (let r = queue.shift(); r; r = queue.shift()) {
        await seal(conn, r);
        if (++done / total >= reported + 0.25 || done === total) {
          reported = Math.floor((done / total) * 4) / 4;
          const s = ((performance.now() - t0) / 1000).toFixed(0);
          console.log(
            `    ${label}: ${done} of ${total} releases hashed and their records stored (${s} s) [${load()}]`,
          );
        }
      }
    };
    await Promise.all(Array.from({ length: AT_ONCE }, worker));
    const used = process.cpuUsage(cpu);
    const each = (used.user + used.system) / 1000 / Math.max(total, 1);
    console.log(`    ${label}: ${each.toFixed(0)} ms of CPU a release in this process [${load()}]`);
  } finally {
    await conn.end();
    await closeSequelize();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
