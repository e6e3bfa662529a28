// From what was typed (keypad, keyboard or a gauge's keystrokes) to a reading ready to save,
// or a message that says what to fix. Nothing here throws at the machinist: every refusal is
// returned as words, and the typed text stays on screen.
import { dialDiameter, implausibleReason, type Lubricant, type Station } from "@/lib/domain";
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
  return { value: Number(t) };
}

/** Dial bore gauges and their like: the gauge kinds that read a deviation from a setting size. */
export function isDialGauge(inst?: BenchInstrument): boolean {
  return !!inst && /dial/.test(inst.kind) && /bore/.test(inst.kind);
}

/** Stations measured with a bore gauge, where dial mode applies; one setting size per section. */
export function dialGroup(station: Station): string | undefined {
  return ["bore", "main-brg", "rod-brg"].includes(station.section) ? station.section : undefined;
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
  const dial = ctx.dialSetting !== undefined && isDialGauge(instrument);
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

function kindScore(station: Station, i: BenchInstrument): number {
  const want = (station.gaugeKind ?? "").replace(/-/g, "_");
  if (!want) return 1;
  if (want === "dial_bore_gauge") return /bore/.test(i.kind) ? 0 : 1;
  if (want === "micrometer") return /mic/.test(i.kind) ? 0 : 1;
  return i.kind === want || i.kind.startsWith(want) ? 0 : 1;
}

/** Gauges that suit a station: same kind of quantity, the usual kind first, then the rest. */
export function gaugesFor(station: Station, instruments: BenchInstrument[]): BenchInstrument[] {
  const torque = (u: string) => u === "lbf_ft" || u === "nm";
  const fits = instruments.filter((i) => i.active && torque(i.unit) === station.torque);
  return [...fits].sort((a, b) => kindScore(station, a) - kindScore(station, b) || a.label.localeCompare(b.label));
}

/** The gauge picked for this kind of station, else the shop's usual kind for it; never a guess across kinds. */
export function pickGauge(
  station: Station,
  instruments: BenchInstrument[],
  pickedId?: number,
): BenchInstrument | undefined {
  const options = gaugesFor(station, instruments);
  return options.find((g) => g.id === pickedId) ?? options.find((g) => kindScore(station, g) === 0);
}
