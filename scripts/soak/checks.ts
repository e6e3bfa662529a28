// What the soak verifies after the run, each node queried directly: the readings stored (count,
// none lost, none twice, every acknowledged one on every node, the same rows on every node), the
// flags against a one-node run of the same readings, and each queued mail delivered exactly once.
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { READING_COLUMNS } from "@/lib/schemas/readings";
import type { NodeHandle } from "./stack";

// Every stored column of a reading, so "the same rows on every node" means the same in each field.
const ALL_COLUMNS = Object.values(READING_COLUMNS).join(", ");

type Row = Record<string, unknown>;
const q = (n: NodeHandle, sql: string, params: unknown[] = []) => n.pool.query(sql, params) as Promise<Row[]>;

export interface Finding {
  what: string;
  ok: boolean;
  detail: string;
}

const finding = (what: string, ok: boolean, detail: string): Finding => ({ what, ok, detail });

/** Readings of the soak's jobs on one node: ids, and a digest of every stored column. */
async function nodeReadings(n: NodeHandle, jobIds: number[]) {
  const rows = await q(n, "SELECT id, job_id, station_id FROM readings WHERE job_id IN (?)", [jobIds]);
  const [digest] = await q(
    n,
    `SELECT COUNT(*) AS n, BIT_XOR(CRC32(CONCAT_WS('|', ${ALL_COLUMNS}))) AS crc FROM readings WHERE job_id IN (?)`,
    [jobIds],
  );
  return { ids: new Set(rows.map((r) => String(r.id))), rows, digest: `${digest.n}/${digest.crc}` };
}

export async function checkReadings(
  nodes: NodeHandle[],
  jobIds: number[],
  sent: string[],
  acknowledged: string[],
  refusedOnTablets: number,
): Promise<Finding[]> {
  const out: Finding[] = [];
  const per = await Promise.all(nodes.map((n) => nodeReadings(n, jobIds)));
  const first = per[0];
  out.push(finding("stored", first.ids.size === sent.length, `${first.ids.size} stored of ${sent.length} sent`));
  const lost = sent.filter((id) => !first.ids.has(id));
  out.push(finding("lost", lost.length === 0, `${lost.length} lost${lost.length ? ` (e.g. ${lost[0]})` : ""}`));
  const sentSet = new Set(sent);
  const stray = [...first.ids].filter((id) => !sentSet.has(id)).length;
  // One reading per station per job in the plan: a second row for a station is a duplicate.
  const byStation = new Map<string, number>();
  for (const r of first.rows)
    byStation.set(`${r.job_id}/${r.station_id}`, (byStation.get(`${r.job_id}/${r.station_id}`) ?? 0) + 1);
  const dup = [...byStation.values()].filter((c) => c > 1).reduce((a, c) => a + c - 1, 0) + stray;
  out.push(finding("duplicated", dup === 0, `${dup} duplicated`));
  out.push(finding("refused", refusedOnTablets === 0, `${refusedOnTablets} refused by the server on the tablets`));
  nodes.forEach((n, i) => {
    const missing = acknowledged.filter((id) => !per[i].ids.has(id)).length;
    out.push(
      finding(`acknowledged on ${n.name}`, missing === 0, `${acknowledged.length - missing}/${acknowledged.length}`),
    );
  });
  if (nodes.length > 1) {
    const same = per.every((p) => p.digest === first.digest);
    out.push(finding("same rows on every node", same, per.map((p, i) => `${nodes[i].name} ${p.digest}`).join(", ")));
  }
  return out;
}

/** Flags of the given jobs keyed by reading id (or job code + derived value), with what they say. */
export async function flagsOf(n: NodeHandle, jobs: Record<string, number>): Promise<Map<string, string>> {
  const codeOf = new Map(Object.entries(jobs).map(([code, id]) => [id, code]));
  const rows = await q(
    n,
    "SELECT job_id, reading_id, derived_key, station_id, verdict, reason, state FROM flags WHERE job_id IN (?)",
    [Object.values(jobs)],
  );
  const out = new Map<string, string>();
  for (const r of rows) {
    const key = r.reading_id ? `reading ${r.reading_id}` : `${codeOf.get(Number(r.job_id))} ${r.derived_key}`;
    const what = `${r.station_id} ${r.verdict} ${r.reason} ${r.state}`;
    out.set(key, out.has(key) ? `${out.get(key)} + ${what}` : what);
  }
  return out;
}

export function compareFlags(cluster: Map<string, string>, oneNode: Map<string, string>): Finding {
  const keys = new Set([...cluster.keys(), ...oneNode.keys()]);
  const differ = [...keys].filter((k) => cluster.get(k) !== oneNode.get(k));
  const example = differ[0] ? ` (e.g. ${differ[0]}: ${cluster.get(differ[0])} vs ${oneNode.get(differ[0])})` : "";
  return finding(
    "flags as one node",
    differ.length === 0 && keys.size > 0,
    `${cluster.size} flags vs ${oneNode.size} on one node, ${differ.length} differ${example}`,
  );
}

/** Waits until the outbox holds nothing unsent (the notifier's passes deliver it), up to `ms`. */
export async function waitForMail(n: NodeHandle, ms: number): Promise<number> {
  const until = Date.now() + ms;
  for (;;) {
    const [r] = await q(n, "SELECT COUNT(*) AS n FROM mail_outbox WHERE sent_at IS NULL");
    if (Number(r.n) === 0 || Date.now() > until) return Number(r.n);
    await new Promise((res) => setTimeout(res, 1000));
  }
}

/** Every sent outbox row in the mail fake exactly once (by the X-Tenthwise-Outbox-Id header). */
export async function checkMail(n: NodeHandle, mailDir: string, unsent: number): Promise<Finding> {
  const rows = await q(n, "SELECT id, kind FROM mail_outbox WHERE sent_at IS NOT NULL");
  const seen = new Map<string, number>();
  for (const f of readdirSync(mailDir).filter((x) => x.endsWith(".eml"))) {
    const head = readFileSync(join(mailDir, f), "utf8").split(/\r?\n\r?\n/)[0];
    const id = /^X-Tenthwise-Outbox-Id:\s*(\d+)/im.exec(head)?.[1] ?? "none";
    seen.set(id, (seen.get(id) ?? 0) + 1);
  }
  const sent = new Set(rows.map((r) => String(r.id)));
  const twice = [...seen].filter(([, c]) => c > 1).length;
  const missing = [...sent].filter((id) => !seen.has(id)).length;
  const unknown = [...seen.keys()].filter((id) => !sent.has(id)).length;
  const kinds = [...new Set(rows.map((r) => String(r.kind)))].join(", ");
  return finding(
    "each mail once",
    twice === 0 && missing === 0 && unknown === 0 && unsent === 0,
    `${sent.size} sent (${kinds || "none"}), ${[...seen.values()].reduce((a, c) => a + c, 0)} in the mail fake; ` +
      `${twice} twice, ${missing} missing, ${unknown} not in the outbox, ${unsent} still queued`,
  );
}
