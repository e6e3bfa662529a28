// The tablet's view of a job's readings: which reading is current at each station, and the
// instant verdicts and derived values, all from lib/domain (the same core the server uses; the
// server's stored verdict replaces the preview once a reading is synced).
import {
  coreReading,
  currentReadings,
  deriveReadings,
  evaluateReadings,
  type DerivedValue,
  type Evaluation,
  type EvaluationOrError,
  type RawReading,
  type Verdict,
} from "@/lib/domain";
import type { BenchInstrument, JobPack } from "@/lib/schemas/sync";
import type { LocalReading } from "./db";

/** A reading the server refused was never stored: it replaces nothing, though it stays on screen. */
export const TABLET_CHAIN = { replaces: (r: LocalReading) => r.state !== "rejected" };

/** The current reading per station (lib/domain's rule); a refused one can be current, to show why. */
export const currentByStation = (readings: LocalReading[]) => currentReadings(readings, TABLET_CHAIN);

/** The core's input for a kept reading with its gauge's uncertainty; none for a skip. */
export function toRaw(r: LocalReading, instruments: BenchInstrument[]): RawReading | undefined {
  if (r.skipped || r.value === null) return undefined;
  return coreReading(
    { ...r, value: r.value },
    instruments.find((i) => i.id === r.instrumentId),
  );
}

/** Raw readings that count for verdicts and derived values: current, not skipped, not refused. */
export function usableRaw(readings: LocalReading[], instruments: BenchInstrument[]): RawReading[] {
  const out: RawReading[] = [];
  for (const r of currentByStation(readings).values()) {
    if (r.state === "rejected") continue;
    const raw = toRaw(r, instruments);
    if (raw) out.push(raw);
  }
  return out;
}

export interface Preview {
  verdict?: Verdict;
  evaluation?: Evaluation;
  /** Why there is no verdict (no limit, or the core refused the figure), in words. */
  note?: string;
}

/** The verdict to show for a reading: the server's once synced, else the core's preview. */
function previewOf(r: LocalReading, judged: EvaluationOrError | undefined): Preview {
  if (judged === undefined) return {};
  if (typeof judged === "string") return { note: judged };
  const verdict = r.state === "synced" && r.verdict ? r.verdict : judged.verdict;
  return { verdict, evaluation: judged, ...(judged.note ? { note: judged.note } : {}) };
}

/**
 * The preview of each station's current reading (currentByStation), all checked in one batch;
 * `raw` (usableRaw) gives a ring gap its bore. A skip has no preview.
 */
export function previewReadings(
  current: Map<string, LocalReading>,
  pack: JobPack,
  raw: RawReading[],
): Map<string, Preview> {
  const mine: RawReading[] = [];
  for (const r of current.values()) {
    const x = toRaw(r, pack.instruments);
    if (x) mine.push(x);
  }
  const judged = evaluateReadings(mine, pack.shape, pack.spec, { context: raw });
  return new Map([...current].map(([id, r]) => [id, previewOf(r, judged.get(id))]));
}

/** Derived values of the job; with `touching`, only those fed by the stations it accepts (the core computes no others). */
export function derivedFor(
  pack: JobPack,
  readings: LocalReading[],
  touching?: (stationId: string) => boolean,
): DerivedValue[] {
  try {
    return deriveReadings(usableRaw(readings, pack.instruments), pack.shape, pack.spec, touching ? { touching } : {});
  } catch {
    return [];
  }
}
