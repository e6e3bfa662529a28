// The check of every reading of a job at once (the maps, a reconciliation, the tablet's route): the
// same Evaluation as evaluateReading (derive.ts) gives each, with what the readings share worked
// out once: the engine checked, its route, each bore's mean (a ring gap's limit scales with it)
// and each spec limit resolved in its context. Per station it only prepares the reading, finds its
// limit and judges it. A property test keeps it equal to evaluateReading station by station.
import { checkEngineShape } from "./bench-route";
import { routeIds } from "./derive";
import { boreMean, joinNotes, limitInputs, prepare, prepareAll, type Prepared } from "./derive-prepare";
import { limitContextFor } from "./job-sizes";
import { findLimit, judge, limitOrNote, type LimitContext } from "./limits";
import type { CharacteristicId, EngineShape, Evaluation, RawReading, ResolvedLimit, SpecLimit } from "./types";

/** A station's evaluation, or the words evaluateReading would throw for it. */
export type EvaluationOrError = Evaluation | string;

export interface EvaluateOptions {
  /** Only the stations this accepts (a reconciliation judges again only what new readings change). */
  only?: (stationId: string) => boolean;
  /**
   * The job's readings a ring gap takes its bore from, when they are not the readings checked (the
   * tablet also checks a reading the server refused, which counts for no bore). Default: those.
   */
  context?: RawReading[];
}

type Found = { limits?: ResolvedLimit; note?: string };

/** What the readings of one job share when each is checked; every part worked out on first need. */
class JobJudging {
  private route?: Set<string>;
  private byStation?: Map<string, RawReading[]>;
  private readonly means = new Map<string, number | undefined>();
  private readonly contexts = new Map<CharacteristicId, Map<number | undefined, LimitContext>>();
  private readonly resolved = new Map<SpecLimit, Map<LimitContext, Found>>();
  private readonly specOf = new Map<CharacteristicId, SpecLimit[]>();

  constructor(
    private readonly engine: EngineShape,
    private readonly spec: SpecLimit[],
    private readonly readings: RawReading[],
  ) {}

  evaluate(reading: RawReading): Evaluation {
    const { engine } = this;
    const p = prepare(reading, engine);
    this.route ??= routeIds(engine);
    if (!this.route.has(reading.stationId)) {
      throw new Error(
        `Station '${reading.stationId}' is not on this engine's route ` +
          `(${engine.cylinders} cylinders, ${engine.mains} mains)`,
      );
    }
    const sizeFrom = limitInputs(reading.stationId);
    const measured = sizeFrom.length ? this.meanOf(sizeFrom) : undefined;
    const found = this.limitsAt(p, reading.stationId, measured);
    const base: Evaluation = found.limits
      ? judge(p.value, p.unit, p.uncertainty, { ...found.limits })
      : { value: p.value, unit: p.unit };
    const note = joinNotes(p.note, found.note, base.note);
    return { ...base, ...(p.correction ? { correction: p.correction } : {}), ...(note ? { note } : {}) };
  }

  /** The mean of the stations' latest usable readings (a bore's, for its ring gaps), once per bore. */
  private meanOf(stations: string[]): number | undefined {
    const key = stations.join(" ");
    if (this.means.has(key)) return this.means.get(key);
    this.byStation ??= groupByStation(this.readings);
    const theirs = stations.flatMap((id) => this.byStation!.get(id) ?? []);
    const mean = boreMean(stations, prepareAll(theirs, this.engine).ok, this.engine);
    this.means.set(key, mean);
    return mean;
  }

  /** limitsFor at the station: the limit found per station, resolved once per limit and context. */
  private limitsAt(p: Prepared, stationId: string, measured: number | undefined): Found {
    const characteristic: CharacteristicId = p.characteristic;
    const context = this.contextOf(characteristic, measured);
    // findLimit over the characteristic's own limits, in the spec's order: the same limit wins.
    let theirs = this.specOf.get(characteristic);
    if (!theirs)
      this.specOf.set(characteristic, (theirs = this.spec.filter((l) => l.characteristic === characteristic)));
    const limit = findLimit(theirs, characteristic, stationId);
    if (!limit) return limitOrNote(undefined, characteristic, stationId, context);
    let byContext = this.resolved.get(limit);
    if (!byContext) this.resolved.set(limit, (byContext = new Map()));
    let found = byContext.get(context);
    if (!found) byContext.set(context, (found = limitOrNote(limit, characteristic, stationId, context)));
    return found;
  }

  /** limitContextFor, one object per characteristic and measured size (so it can key the resolved limits). */
  private contextOf(characteristic: CharacteristicId, measured: number | undefined): LimitContext {
    let bySize = this.contexts.get(characteristic);
    if (!bySize) this.contexts.set(characteristic, (bySize = new Map()));
    let context = bySize.get(measured);
    if (!context) bySize.set(measured, (context = limitContextFor(characteristic, this.engine, measured)));
    return context;
  }
}

/** The readings at each station, in the order given (the latest of them is found as prepareAll does). */
function groupByStation(readings: RawReading[]): Map<string, RawReading[]> {
  const out = new Map<string, RawReading[]>();
  for (const r of readings) {
    const id = r?.stationId;
    if (typeof id !== "string") continue;
    const list = out.get(id);
    if (list) list.push(r);
    else out.set(id, [r]);
  }
  return out;
}

const wordsOf = (err: unknown) => (err instanceof Error ? err.message : String(err));

/**
 * Every reading of a job checked against its spec, the others giving a ring gap its bore: by
 * station, what evaluateReading(reading, engine, spec, options.context ?? readings) returns, or the
 * words it throws.
 * A station read twice gets its last reading in the list; an entry that is not a reading has no
 * station and is left out (it is not a reading a ring gap's bore counts either).
 */
export function evaluateReadings(
  readings: RawReading[],
  engine: EngineShape,
  spec: SpecLimit[],
  options: EvaluateOptions = {},
): Map<string, EvaluationOrError> {
  const out = new Map<string, EvaluationOrError>();
  let judging: JobJudging | undefined;
  let refused: string | undefined;
  try {
    checkEngineShape(engine);
    judging = new JobJudging(engine, spec, options.context ?? readings);
  } catch (err) {
    refused = wordsOf(err);
  }
  for (const r of readings) {
    if (r === null || typeof r !== "object") continue;
    if (options.only && !options.only(r.stationId)) continue;
    if (!judging) {
      out.set(r.stationId, refused!);
      continue;
    }
    try {
      out.set(r.stationId, judging.evaluate(r));
    } catch (err) {
      out.set(r.stationId, wordsOf(err));
    }
  }
  return out;
}
