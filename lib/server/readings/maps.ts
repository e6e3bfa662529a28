import "server-only";
import {
  AXES,
  BORE_DEPTHS,
  JOURNAL_POSITIONS,
  cleanDecimal,
  convertLength,
  currentValues,
  deckBanks,
  deriveReadings,
  evaluateReadings,
  lengthUnitOf,
  limitContextFor,
  limitsFor,
  parseStationId,
  rodJournalCount,
  type DerivedValue,
  type EngineShape,
  type LengthUnit,
  type RawReading,
  type SpecLimit,
} from "@/lib/domain";
import type { Figure, JobMaps, MapPoint, Profile } from "@/lib/schemas/readings";
import { toRaw } from "@/lib/server/sync/ingest-evaluate";
import { settleAll } from "@/lib/server/core/sql-driver";
import { withReads } from "@/lib/server/core/sql-read";
import { jobContextOn } from "@/lib/server/jobs/repo";
import { jobReadingsOn } from "@/lib/server/readings/repo";

// Bore, journal and deck maps of a job: every current figure judged by the core (evaluateReadings,
// 20 °C correction and the gauge's U included), taper and out-of-round from deriveReadings, all
// expressed in the job's length unit so one chart has one scale.

type Judge = (stationId: string) => MapPoint;
const PROFILE_VALUES = [
  "bore_taper",
  "bore_out_of_round",
  "main_journal_taper",
  "main_journal_out_of_round",
  "rod_journal_taper",
  "rod_journal_out_of_round",
] as const;
/** The stations the maps draw (bores, journals, decks), so the other readings are not judged for nothing. */
const onMaps = (stationId: string) => /^(bore|main|rod|deck)\//.test(stationId);

/** The limit at a station not read yet (findLimit/resolveLimit), so the chart still shows its lines. */
function limitOnly(stationId: string, shape: EngineShape, spec: SpecLimit[]) {
  const p = parseStationId(stationId);
  return p.characteristic
    ? limitsFor(spec, p.characteristic, stationId, limitContextFor(p.characteristic, shape)).limits
    : undefined;
}

function judgeWith(raws: Map<string, RawReading>, shape: EngineShape, spec: SpecLimit[], unit: LengthUnit): Judge {
  const judged = evaluateReadings([...raws.values()], shape, spec, { only: onMaps });
  const inUnit = (x: number | undefined, from: string) =>
    x === undefined ? null : from === unit ? x : cleanDecimal(convertLength(x, from as LengthUnit, unit));
  return (stationId) => {
    const e = judged.get(stationId);
    if (e === undefined) {
      const l = limitOnly(stationId, shape, spec);
      return { value: null, min: inUnit(l?.min, l?.unit ?? unit), max: inUnit(l?.max, l?.unit ?? unit), verdict: null };
    }
    // Not a figure the core can use (its words in e): a gap on the map.
    if (typeof e === "string") return { value: null, min: null, max: null, verdict: null };
    const from = e.limits?.unit ?? e.unit;
    return {
      value: inUnit(e.value, from),
      min: inUnit(e.limits?.min, from),
      max: inUnit(e.limits?.max, from),
      verdict: e.verdict ?? null,
    };
  };
}

function figureOf(d: DerivedValue | undefined, unit: LengthUnit): Figure {
  if (!d) return { value: null, max: null, verdict: null, missing: 0 };
  const from = d.limits?.unit ?? d.unit;
  const conv = (x: number | undefined) =>
    x === undefined ? null : from === unit ? x : cleanDecimal(convertLength(x, from as LengthUnit, unit));
  return { value: conv(d.value), max: conv(d.limits?.max), verdict: d.verdict ?? null, missing: d.missing.length };
}

function profiles(
  prefix: "bore" | "main" | "rod",
  count: number,
  at: readonly string[],
  judge: Judge,
  derived: Map<string, DerivedValue>,
  unit: LengthUnit,
): Profile[] {
  const names = {
    bore: ["bore_taper", "bore_out_of_round", "Cylinder"],
    main: ["main_journal_taper", "main_journal_out_of_round", "Main journal"],
    rod: ["rod_journal_taper", "rod_journal_out_of_round", "Rod journal"],
  }[prefix];
  return Array.from({ length: count }, (_, i) => {
    const n = i + 1;
    const rows = at.map((spot) => ({
      at: spot,
      A: judge(`${prefix}/${n}/${spot}/${AXES[0]}`),
      B: judge(`${prefix}/${n}/${spot}/${AXES[1]}`),
    }));
    return {
      n,
      label: `${names[2]} ${n}`,
      rows,
      taper: figureOf(derived.get(`${names[0]}@${prefix}/${n}`), unit),
      outOfRound: figureOf(derived.get(`${names[1]}@${prefix}/${n}`), unit),
    };
  });
}

export async function jobMaps(shopId: number, jobId: number): Promise<JobMaps> {
  // The context, the readings and their gauges at once on one connection (one round trip).
  const [ctx, { readings: all, instruments }] = await withReads((read) =>
    settleAll([jobContextOn(read, shopId, jobId), jobReadingsOn(read, shopId, jobId)]),
  );
  const current = currentValues(all);
  const raws = new Map(
    current.map((r) => [r.stationId, toRaw(r, r.instrumentId ? instruments.get(r.instrumentId) : undefined)]),
  );
  const unit = lengthUnitOf(ctx.shape);
  let derived: DerivedValue[];
  try {
    derived = deriveReadings([...raws.values()], ctx.shape, ctx.spec, { characteristics: PROFILE_VALUES });
  } catch {
    derived = []; // an engine shape the core refuses: the maps show no taper or out-of-round
  }
  const byKey = new Map(derived.map((d) => [d.key, d]));
  const judge = judgeWith(raws, ctx.shape, ctx.spec, unit);
  return {
    job: { id: ctx.job.id, code: ctx.job.code, title: ctx.job.title },
    unit,
    corrected: current.some((r) => r.partTempC !== null),
    bores: profiles("bore", ctx.shape.cylinders, BORE_DEPTHS, judge, byKey, unit),
    mains: profiles("main", ctx.shape.mains, JOURNAL_POSITIONS, judge, byKey, unit),
    rods: profiles("rod", rodJournalCount(ctx.shape), JOURNAL_POSITIONS, judge, byKey, unit),
    deck: deckBanks(ctx.shape.layout).flatMap((bank) =>
      (["front", "rear"] as const).map((corner) => ({ bank, corner, point: judge(`deck/${bank}/${corner}`) })),
    ),
  };
}
