// From what was typed (keypad, keyboard or a gauge's keystrokes) to a reading ready to save,
// or a message that says what to fix. Nothing here throws at the machinist: every refusal is
// returned as words, and the typed text stays on screen.
import {
  dialDiameter,
  gaugeRefusal,
  implausibleReason,
  isDialBoreGauge,
  READING_PRECISION,
  storedFigureProblem,
  takesDialBoreGauge,
  type Lubricant,
  type Station,
} from "@/lib/domain";
import type { BenchInstrument, JobPack } from "@/lib/schemas/sync";
import type { NewReading } from "./readings";

export type Parsed = { value: number } | { error: string };

/** Characters an entry may hold; a comma is taken as the decimal point (some gauges send one). */
export function cleanTyped(text: string): string {
  return text.replace(",", ".").replace(/[^0-9.+-]/g, "");
}

export function parseEntry(text: string, what = "the value"): Parsed {
  const t = cleanTyped(text.trim());
  if (t === "") return { error: `Type ${what} first` };
  if (!/^[+-]?(\d+\.?\d*|\.\d+)$/.test(t)) return { error: `'${text}' is not a number; type ${what} like 4.0302` };
  const value = Number(t);
  // A value, a setting size and a dial reading are all kept to the same places: the server refuses more.
  const problem = storedFigureProblem(value, READING_PRECISION.value, what[0].toUpperCase() + what.slice(1));
  return problem ? { error: problem } : { value };
}

/** Stations a dial bore gauge measures, where dial mode applies; one setting size per section. */
export function dialGroup(station: Station): string | undefined {
  return takesDialBoreGauge(station.characteristic) ? station.section : undefined;
}

export interface EntryContext {
  pack: JobPack;
  station: Station;
  instrument?: BenchInstrument;
  /** Dial mode: the setting size the gauge was zeroed on, in the station's unit. */
  dialSetting?: number;
  lubricant?: Lubricant;
  supersedes?: string;
}

export type Built = { reading: NewReading } | { error: string };

/** The reading the typed text stands for, checked for physical sense before any verdict. */
export function buildReading(text: string, ctx: EntryContext): Built {
  const { station, pack, instrument } = ctx;
  const dial = ctx.dialSetting !== undefined && isDialBoreGauge(instrument);
  const parsed = parseEntry(text, dial ? "the dial reading" : "the value");
  if ("error" in parsed) return parsed;
  if (station.torque && !ctx.lubricant)
    return { error: "Pick the lubricant used on the threads before saving the torque" };
  let value = parsed.value;
  if (dial) {
    try {
      value = dialDiameter({
        setting: ctx.dialSetting!,
        deviation: parsed.value,
        plusMeansSmaller: instrument!.dialPlusMeansSmaller,
      });
    } catch (err) {
      return { error: err instanceof Error ? err.message : String(err) };
    }
  }
  const why = implausibleReason(station.id, value, station.unit, pack.shape);
  if (why) return { error: why };
  // The same rule and words as the server's check at upload: a gauge that measures the station
  // and whose range holds the value, or which one to pick.
  const wrongGauge = gaugeRefusal({ stationId: station.id, value, unit: station.unit }, instrument, pack.instruments);
  if (wrongGauge) return { error: wrongGauge };
  return {
    reading: {
      jobId: pack.job.id,
      stationId: station.id,
      value,
      unit: station.unit,
      entryMode: dial ? "dial" : "direct",
      ...(dial ? { dialSetting: ctx.dialSetting, dialDeviation: parsed.value } : {}),
      ...(instrument ? { instrumentId: instrument.id } : {}),
      ...(station.torque && ctx.lubricant ? { lubricant: ctx.lubricant } : {}),
      ...(ctx.supersedes ? { supersedes: ctx.supersedes } : {}),
    },
  };
}
