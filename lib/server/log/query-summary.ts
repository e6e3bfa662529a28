import "server-only";
import { stationWords, verdictInText } from "@/lib/domain";
import type { AuditChange } from "@/lib/schemas/audit";
import { diffJson } from "@/lib/server/log/query-diff";
import { SYNC_ACTION, type SyncAuditAfter } from "@/lib/server/sync/ingest-audit";

// How the audit screen lists an event's content. Most events show their before/after as changed
// fields (audit-query-diff.ts). A sync upload ("readings.sync", one event per job per batch, up to
// a whole batch of readings) would flatten to several lines per reading and be cut short, so it is
// listed one line per reading instead: station → "value unit · verdict · reading id (corrects …)".

function syncChanges(after: SyncAuditAfter): AuditChange[] {
  const head: AuditChange = {
    path: "device",
    label: "Tablet",
    kind: "added",
    before: null,
    after: `${after.deviceId} · ${after.count} reading${after.count === 1 ? "" : "s"}`,
  };
  return [
    head,
    ...after.readings.map((r): AuditChange => {
      const figure = r.skipped || r.value === null ? "skipped" : `${r.value} ${r.unit}`;
      const verdict = r.verdict ? verdictInText(r.verdict) : "no verdict";
      const corrects = r.supersedes ? ` (corrects ${r.supersedes})` : "";
      return {
        path: r.stationId,
        label: stationWords(r.stationId),
        kind: "added",
        before: null,
        after: `${figure} · ${verdict} · reading ${r.id}${corrects}`,
      };
    }),
  ];
}

const isSyncAfter = (v: unknown): v is SyncAuditAfter =>
  !!v &&
  typeof v === "object" &&
  Array.isArray((v as SyncAuditAfter).readings) &&
  typeof (v as SyncAuditAfter).deviceId === "string";

/** The lines the audit screen shows for one event. */
export function eventChanges(
  action: string,
  before: unknown,
  after: unknown,
): { changes: AuditChange[]; truncated: boolean } {
  if (action === SYNC_ACTION && before === null && isSyncAfter(after))
    return { changes: syncChanges(after), truncated: false };
  return diffJson(before, after);
}
