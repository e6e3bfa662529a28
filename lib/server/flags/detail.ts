import "server-only";
import { correctedBy, currentValues, deriveReadings, isJobLocked, stationWords, type DerivedValue } from "@/lib/domain";
import type { DerivedFigure, DispositionEntry, FlagDetail, HistoryReading, Photo } from "@/lib/schemas/flag";
import { toListItem } from "@/lib/server/flags/list";
import { dispositionRows, getFlagOrThrow, userNames } from "@/lib/server/flags/repo";
import { toRaw, type InstrumentInfo } from "@/lib/server/sync/ingest-evaluate";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { jobReadings } from "@/lib/server/readings/repo";
import { findInstruments } from "@/lib/server/readings/gauge-repo";
import type { StoredReading } from "@/lib/schemas/readings";
import { listAttachments } from "@/lib/server/uploads/repo";

// One flag opened: the readings of its station(s) with the correction chain and photos, the
// derived values it feeds (computed by the core from the job's current readings, exactly as
// reconciliation does), and every decision taken on it.

const iso = (d: Date) => new Date(d).toISOString();

function derivedOf(
  current: StoredReading[],
  instruments: Map<number, InstrumentInfo>,
  ctx: Awaited<ReturnType<typeof loadJobContext>>,
): DerivedValue[] {
  const raws = current.map((r) => toRaw(r, r.instrumentId ? instruments.get(r.instrumentId) : undefined));
  try {
    return deriveReadings(raws, ctx.shape, ctx.spec);
  } catch {
    return []; // an engine shape the core refuses has no derived values
  }
}

function toFigure(d: DerivedValue): DerivedFigure {
  return {
    key: d.key,
    label: d.label,
    value: d.value ?? null,
    unit: d.limits?.unit ?? d.unit,
    min: d.limits?.min ?? null,
    max: d.limits?.max ?? null,
    verdict: d.verdict ?? null,
    missing: d.missing,
  };
}

type HistoryInput = {
  all: StoredReading[];
  current: Set<string>;
  instruments: Map<number, InstrumentInfo>;
  names: Map<number, string>;
  photos: Map<string, Photo[]>;
  flaggedId: string | null;
};

function history(stationId: string, h: HistoryInput): HistoryReading[] {
  const corrections = correctedBy(h.all);
  return h.all
    .filter((r) => r.stationId === stationId)
    .map((r) => {
      const g = r.instrumentId ? h.instruments.get(r.instrumentId) : undefined;
      return {
        id: r.id,
        value: r.value,
        unit: r.unit,
        verdict: r.verdict,
        verdictNote: r.verdictNote,
        skipped: r.skipped,
        skipReason: r.skipReason,
        note: r.note,
        takenAt: iso(r.takenAt),
        takenBy: h.names.get(r.takenBy) ?? null,
        gauge: g ? { id: g.id, label: g.label, serial: g.serial, calibrationDue: g.calibrationDue } : null,
        supersedes: r.supersedes,
        supersededBy: corrections.get(r.id) ?? null,
        current: h.current.has(r.id),
        flagged: r.id === h.flaggedId,
        photos: h.photos.get(r.id) ?? [],
      };
    });
}

async function photosOf(shopId: number, readingIds: string[]): Promise<Map<string, Photo[]>> {
  const out = new Map<string, Photo[]>();
  for (const a of await listAttachments(shopId, "reading", readingIds)) {
    const list = out.get(a.ownerId) ?? [];
    list.push({ id: a.id, name: a.originalName, contentType: a.contentType, url: a.url, thumbUrl: a.thumbUrl });
    out.set(a.ownerId, list);
  }
  return out;
}

async function dispositionsOf(flagId: number): Promise<DispositionEntry[]> {
  return (await dispositionRows(flagId)).map((d) => ({
    id: d.id,
    disposition: d.disposition,
    operation: d.operation ?? null,
    reason: d.reason ?? null,
    by: d.user?.name ?? `user ${d.userId}`,
    at: iso(d.createdAt),
  }));
}

export async function getFlagDetail(shopId: number, flagId: number): Promise<FlagDetail> {
  const f = await getFlagOrThrow(shopId, flagId);
  const ctx = await loadJobContext(shopId, f.jobId);
  const all = await jobReadings(undefined, f.jobId);
  const current = currentValues(all);
  const instruments = await findInstruments(
    undefined,
    shopId,
    all.flatMap((r) => (r.instrumentId ? [r.instrumentId] : [])),
  );
  const derived = derivedOf(current, instruments, ctx);
  const own = f.derivedKey ? derived.find((d) => d.key === f.derivedKey) : undefined;
  const stationIds = f.readingId ? [f.stationId] : (own?.inputs ?? []);
  const atStations = all.filter((r) => stationIds.includes(r.stationId));
  const [names, photos, dispositions] = await Promise.all([
    userNames(atStations.map((r) => r.takenBy)),
    photosOf(
      shopId,
      atStations.map((r) => r.id),
    ),
    dispositionsOf(f.id),
  ]);
  const h: HistoryInput = {
    all,
    current: new Set(current.map((r) => r.id)),
    instruments,
    names,
    photos,
    flaggedId: f.readingId ?? null,
  };
  const fed = f.readingId ? derived.filter((d) => d.inputs.includes(f.stationId)) : own ? [own] : [];
  const job = f.job;
  return {
    flag: { ...toListItem(f), closedByReadingId: f.closedByReadingId ?? null },
    job: {
      id: job.id,
      code: job.code,
      title: job.title,
      status: job.status,
      unitSystem: job.unitSystem,
      locked: isJobLocked(job),
    },
    stations: stationIds.map((s) => ({ stationId: s, words: stationWords(s), readings: history(s, h) })),
    derived: fed.map(toFigure),
    dispositions,
  };
}
