// Which reading is current at each station (rule of this product). Readings are never edited:
// a correction, a second reading that confirms an out-of-spec figure, or a skip after a figure
// is a NEW reading whose `supersedes` names the one it replaces. The tablet, the server's flags
// and verdicts, the desk, the release checklist and the build record all ask this one function,
// so they always agree on what a station currently says.
//
// - A reading that another reading supersedes is history, never current, wherever the chain is.
// - A skip is a reading like any other: when it is the station's current reading, the station has
//   no current value (an earlier figure it superseded no longer counts).
// - Two readings that nothing supersedes (two tablets offline at the same station): the later
//   `takenAt` wins, then the larger id, so the answer never depends on the order rows arrive in.

export interface ChainedReading {
  id: string;
  stationId: string;
  /** When it was taken (ISO text on the tablet and the wire, a Date from the database). */
  takenAt: string | Date;
  /** The reading this one replaces. */
  supersedes?: string | null;
  /** Set when the server already said which reading replaces this one. */
  supersededBy?: string | null;
  skipped?: boolean | null;
}

export interface CurrentOptions<R> {
  /**
   * Whether a reading's `supersedes` link counts; every reading's does unless told otherwise. The
   * tablet keeps readings the server refused (to show why): a refused reading replaces nothing.
   */
  replaces?: (r: R) => boolean;
}

const millis = (t: string | Date) => (typeof t === "string" ? Date.parse(t) : t.getTime());

/** True when `a` is the later of two readings nothing supersedes (time taken, then id). */
export function takenLater(a: ChainedReading, b: ChainedReading): boolean {
  const d = millis(a.takenAt) - millis(b.takenAt);
  return d !== 0 ? d > 0 : a.id > b.id;
}

/** Ids of the readings another reading (or the server) says are replaced. */
export function supersededIds<R extends ChainedReading>(
  readings: readonly R[],
  options: CurrentOptions<R> = {},
): Set<string> {
  const out = new Set<string>();
  for (const r of readings) {
    if (r.supersedes && (options.replaces?.(r) ?? true)) out.add(r.supersedes);
    if (r.supersededBy) out.add(r.id);
  }
  return out;
}

/**
 * For each reading another one replaces, the id of the reading that replaces it (the later by
 * time taken then id, when two readings name the same one): what the tablet and the flag page
 * show as "corrected by".
 */
export function correctedBy<R extends ChainedReading>(readings: readonly R[]): Map<string, string> {
  const by = new Map<string, R>();
  for (const r of readings) {
    if (!r.supersedes) continue;
    const had = by.get(r.supersedes);
    if (!had || takenLater(r, had)) by.set(r.supersedes, r);
  }
  return new Map([...by].map(([id, r]) => [id, r.id]));
}

/** The current reading of each station that has one, skips included, keyed by station id. */
export function currentReadings<R extends ChainedReading>(
  readings: readonly R[],
  options: CurrentOptions<R> = {},
): Map<string, R> {
  const pick = currentPicker<R>(supersededIds(readings, options));
  for (const r of readings) pick.offer(r);
  return pick.current;
}

/**
 * currentReadings' rule for readings offered one at a time, once the ids that other readings
 * replace are known: the server reads a job's history as a stream and holds only each station's
 * current reading so far (a job's CSV export, in constant memory).
 */
export function currentPicker<R extends ChainedReading>(gone: ReadonlySet<string>) {
  const current = new Map<string, R>();
  return {
    offer(r: R): void {
      if (gone.has(r.id)) return;
      const had = current.get(r.stationId);
      if (!had || takenLater(r, had)) current.set(r.stationId, r);
    },
    /** Each station's current reading among those offered so far. */
    current,
  };
}

/** A reading that carries a figure: not a skip, with a value. */
export const hasValue = (r: { skipped?: boolean | null; value?: number | null }): boolean =>
  !r.skipped && r.value !== null && r.value !== undefined;

/** The current readings that carry a figure (what verdicts, derived values and maps use). */
export function currentValues<R extends ChainedReading & { value: number | null }>(
  readings: readonly R[],
  options: CurrentOptions<R> = {},
): R[] {
  return [...currentReadings(readings, options).values()].filter(hasValue);
}
