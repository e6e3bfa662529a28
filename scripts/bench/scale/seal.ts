// A copied release signs its own job: the hash and per-item digests are taken again, by the
// server's own functions, over the copy's rows (its readings, flags, decisions, limits, gauges and
// signature), exactly as signRelease takes them, so the desk's "verify" answers "matches" for a
// copy as for the template. The audit trail is append-only, so each copy's release.sign event is
// held back (isSignEvent) and written here, naming the copy's own hash.
import type { Connection } from "mariadb";
import { itemDigests, releaseHash } from "@/lib/server/release/hash";
import { buildSnapshot, gaugeRecord } from "@/lib/server/release/hash-snapshot";
import { loadJobRecord } from "@/lib/server/release/repo";
import type { Row } from "./clone";
import type { BulkWriter } from "./writer";

const AT_ONCE = 4;

export const isSignEvent = (a: Row) => a.action === "release.sign";

const parsed = (v: unknown) => (typeof v === "string" ? JSON.parse(v) : v) as Record<string, unknown>;

async function seal(conn: Connection, r: Row, event: Row | undefined): Promise<Row> {
  const record = await loadJobRecord(Number(r.shop_id), Number(r.job_id));
  const gauges = record.instruments.map(gaugeRecord);
  const signature = {
    inspectorId: Number(r.inspector_id),
    signedName: String(r.signed_name),
    signedAt: r.signed_at as Date,
  };
  const snapshot = buildSnapshot(record, signature, gauges);
  const hash = releaseHash(snapshot);
  const checklist = { ...parsed(r.checklist), gauges, digests: itemDigests(snapshot) };
  await conn.query("UPDATE releases SET hash = ?, checklist = ? WHERE id = ?", [hash, JSON.stringify(checklist), r.id]);
  if (!event) throw new Error(`No release.sign event was copied for release ${String(r.id)}`);
  return { ...event, after: JSON.stringify({ ...parsed(event.after), hash }) };
}

/** Takes each copied release's own hash, a few at a time, and writes its release.sign event. */
export async function sealReleases(conn: Connection, releases: Row[], signEvents: Row[], writer: BulkWriter) {
  const eventOf = new Map(signEvents.map((a) => [String(a.entity_id), a]));
  const queue = [...releases];
  const sealed: Row[] = [];
  const worker = async () => {
    for (let r = queue.shift(); r; r = queue.shift()) sealed.push(await seal(conn, r, eventOf.get(String(r.id))));
  };
  await Promise.all(Array.from({ length: AT_ONCE }, worker));
  await writer.add("audit_events", sealed);
  await writer.finish(["audit_events"]);
}
