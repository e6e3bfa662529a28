import "server-only";
import { characteristicWords, stationWords } from "@/lib/domain";
import type { FlagListItem, FlagListQuery, FlagPage, GaugeRef } from "@/lib/schemas/flag";
import { flagPage, type LoadedFlag } from "@/lib/server/flags/repo";

// The lead's flag queue across jobs, as list items (flags/repo.ts filters, sorts and pages it).

const gaugeRef = (g: NonNullable<LoadedFlag["reading"]>["instrument"]): GaugeRef | null =>
  g ? { id: g.id, label: g.label, serial: g.serial, calibrationDue: g.calibrationDue ?? null } : null;

const iso = (d: Date | null | undefined) => (d ? new Date(d).toISOString() : null);

export function toListItem(f: LoadedFlag): FlagListItem {
  return {
    id: f.id,
    jobId: f.jobId,
    jobCode: f.job?.code ?? "",
    jobTitle: f.job?.title ?? "",
    stationId: f.stationId,
    station: stationWords(f.stationId),
    characteristic: f.characteristic,
    characteristicLabel: characteristicWords(f.characteristic),
    derived: !f.readingId,
    value: f.value,
    unit: f.unit,
    limitMin: f.limitMin ?? null,
    limitMax: f.limitMax ?? null,
    deviation: f.deviation ?? null,
    verdict: f.verdict,
    reason: f.reason,
    state: f.state,
    disposition: f.disposition ?? null,
    operation: f.operation ?? null,
    dispositionReason: f.dispositionReason ?? null,
    disposedBy: f.disposer?.name ?? null,
    disposedAt: iso(f.disposedAt),
    closedAt: iso(f.closedAt),
    gauge: gaugeRef(f.reading?.instrument),
    takenBy: f.reading?.taker?.name ?? null,
    takenAt: iso(f.reading?.takenAt),
    createdAt: iso(f.createdAt) as string,
    judgedAt: iso(f.judgedAt ?? f.createdAt) as string,
  };
}

export async function listFlags(shopId: number, q: FlagListQuery): Promise<FlagPage> {
  const { total, rows } = await flagPage(shopId, q);
  return {
    items: rows.map(toListItem),
    total,
    page: q.page,
    pageSize: q.pageSize,
    pageCount: Math.max(1, Math.ceil(total / q.pageSize)),
  };
}
