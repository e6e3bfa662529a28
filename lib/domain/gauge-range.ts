// A gauge's measuring range (what it can read: a 20–150 lbf·ft torque wrench, a 4–5 in outside
// micrometer) and the one rule, asked by the tablet before it stores a reading and by the server
// at upload, that says whether a reading may name a gauge: a kind that measures the station
// (gauges.ts) and a range that holds the value. A refusal says which gauge to pick instead.
import { CHARACTERISTICS, parseStationId } from "./stations";
import {
  GAUGE_KIND_WORDS,
  USUAL_GAUGES,
  gaugeKindOf,
  instrumentKindWords,
  gaugeSuits,
  type GaugeFacts,
} from "./gauges";
import { PLAUSIBLE_RANGES } from "./plausible-range";
import type { QuantityKind, RawCharacteristic } from "./types";
import { cleanDecimal, convertMeasure, quantityOfUnit } from "./units";
import { unitWords } from "./words";

/** The range a gauge reads, in its own unit; a gauge registered before ranges were kept has none. */
export interface GaugeRange {
  rangeMin?: number | null;
  rangeMax?: number | null;
}
/** A gauge as the rule sees it: what it is, what it reads, its name for the words. */
export type RangedGauge = GaugeFacts & GaugeRange & { label: string; serial?: string; active?: boolean };

const rangeOf = (g: GaugeRange): { min: number; max: number } | undefined =>
  g.rangeMin == null || g.rangeMax == null ? undefined : { min: g.rangeMin, max: g.rangeMax };

/** "20–150 lbf·ft"; empty when no range is on file. */
export function gaugeRangeWords(g: GaugeRange & { unit: string }): string {
  const r = rangeOf(g);
  return r ? `${r.min}–${r.max} ${unitWords(g.unit)}` : "";
}

/** True when the value (in `unit`) lies in the gauge's range, both ends included; true with no range on file. */
export function rangeHolds(g: GaugeRange & { unit: string }, value: number, unit: string): boolean {
  const r = rangeOf(g);
  if (!r) return true;
  const inGaugeUnit = convertMeasure(value, unit, g.unit);
  if (inGaugeUnit === undefined) return false;
  // Cleaned of float noise, so a value exactly on an end (4 in on a 4–5 in micrometer) is held.
  const v = cleanDecimal(inGaugeUnit);
  return v >= r.min && v <= r.max;
}

const article = (word: string) => (/^[aeiou]/i.test(word) ? "an" : "a");
const nameOf = (g: RangedGauge) => `'${g.label}'${g.serial ? ` (${g.serial})` : ""}`;
const charWords = (c: RawCharacteristic) => CHARACTERISTICS[c].label.split(",")[0].toLowerCase();

/** The gauge kinds that measure a characteristic, in words: "dial bore gauge or bore gauge". */
export const gaugeKindsWords = (c: RawCharacteristic): string =>
  USUAL_GAUGES[c].map((k) => GAUGE_KIND_WORDS[k].toLowerCase()).join(" or ");

/** What a reading tells the rule: where, what value, in which unit. */
export interface GaugeUse {
  stationId: string;
  value: number;
  unit: string;
}

/** The active gauges of the list that a reading may name: suitable kind, range holding the value. */
export function gaugesHolding<G extends RangedGauge>(use: GaugeUse, gauges: readonly G[]): G[] {
  const { characteristic } = parseStationId(use.stationId);
  if (!characteristic) return [];
  return gauges.filter(
    (g) => g.active !== false && gaugeSuits(g, characteristic) && rangeHolds(g, use.value, use.unit),
  );
}

/**
 * Why a reading may not name this gauge (none, one of a kind that does not measure the station, or
 * one whose range does not hold the value), ending with which gauge to pick from `offered`;
 * undefined when it may. A skip names no gauge and is never asked about.
 */
export function gaugeRefusal(
  use: GaugeUse,
  gauge: RangedGauge | undefined,
  offered: readonly RangedGauge[],
): string | undefined {
  const { characteristic } = parseStationId(use.stationId);
  if (!characteristic) return undefined;
  const figure = `${use.value} ${unitWords(use.unit)}`;
  let why: string;
  if (!gauge) why = "No gauge is named for this reading.";
  else if (!gaugeSuits(gauge, characteristic)) {
    const kind = instrumentKindWords(gauge.kind).toLowerCase();
    why = `${nameOf(gauge)} is ${article(kind)} ${kind}; it cannot measure a ${charWords(characteristic)}.`;
  } else if (!rangeHolds(gauge, use.value, use.unit))
    why = `${nameOf(gauge)} reads ${gaugeRangeWords(gauge)}; ${figure} is outside its range.`;
  else return undefined;
  const fits = gaugesHolding(use, offered);
  const list = fits.length
    ? fits
        .slice(0, 3)
        .map((g) => `${nameOf(g)}${rangeOf(g) ? ` ${gaugeRangeWords(g)}` : ""}`)
        .join("; ")
    : "none on file holds it, so ask the admin to register one under Gauges";
  const kinds = gaugeKindsWords(characteristic);
  return `${why} Pick ${article(kinds)} ${kinds} whose range holds ${figure}: ${list}`;
}

/** Which figure of a gauge's range is wrong, and what to fix. */
export type GaugeRangeProblem = { field: "rangeMin" | "rangeMax"; message: string };

const CANONICAL = { length: "mm", torque: "nm" } as const;
const both = (x: number, kind: QuantityKind) => {
  const other = kind === "length" ? "in" : "lbf_ft";
  const converted = cleanDecimal(Number(convertMeasure(x, CANONICAL[kind], other)!.toPrecision(4)));
  return `${x} ${unitWords(CANONICAL[kind])} (${converted} ${unitWords(other)})`;
};

/**
 * Whether a gauge's range is a real one, by the core's plausible ranges (plausible-range.ts): it
 * starts at zero or above, ends above its start, reads nothing larger than any station of its
 * quantity can be, and holds some real value of a station its kind measures.
 */
export function gaugeRangeProblem(kind: string, unit: string, min: number, max: number): GaugeRangeProblem | undefined {
  const u = unitWords(unit);
  if (min < 0) return { field: "rangeMin", message: "The range starts at zero or above; enter the smallest it reads" };
  if (!(max > min)) return { field: "rangeMax", message: `The top of the range must be above its start (${min} ${u})` };
  const quantity = quantityOfUnit(unit);
  if (!quantity) return undefined; // the unit itself is refused on its own field
  const canon = (x: number) => cleanDecimal(convertMeasure(x, unit, CANONICAL[quantity])!);
  const all = (Object.keys(PLAUSIBLE_RANGES) as RawCharacteristic[]).filter(
    (c) => CHARACTERISTICS[c].kind === quantity,
  );
  const top = Math.max(...all.map((c) => PLAUSIBLE_RANGES[c].max));
  if (canon(max) > top)
    return {
      field: "rangeMax",
      message:
        `${max} ${u} is more than any engine station measures (${both(top, quantity)} at most); ` +
        "check the decimal point and the unit",
    };
  const gaugeKind = gaugeKindOf(kind);
  const served = all.filter((c) => gaugeKind && USUAL_GAUGES[c].includes(gaugeKind));
  const holdsSome = served.some((c) => canon(min) <= PLAUSIBLE_RANGES[c].max && canon(max) >= PLAUSIBLE_RANGES[c].min);
  if (served.length && !holdsSome) {
    const lo = Math.min(...served.map((c) => PLAUSIBLE_RANGES[c].min));
    const hi = Math.max(...served.map((c) => PLAUSIBLE_RANGES[c].max));
    const what = served.map(charWords).join(", ");
    return {
      field: "rangeMin",
      message:
        `A ${GAUGE_KIND_WORDS[gaugeKind!].toLowerCase()} measures ${what}: ` +
        `real ones are ${both(lo, quantity)} to ${both(hi, quantity)}; ` +
        `${min}–${max} ${u} holds none of them. Check the decimal point and the unit`,
    };
  }
  return undefined;
}
