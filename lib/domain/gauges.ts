// Which gauges suit which station: one table the tablet's default pick, the server's check at
// upload and the spec editor all read.
//
// Two names for a gauge: the instrument kind a shop registers ("outside_mic") and the gauge kind a
// spec sheet names ("micrometer"). INSTRUMENT_KINDS says which gauge kind each instrument is;
// USUAL_GAUGES says which gauge kinds measure each characteristic (common practice, from memory),
// the first being the one a new limit proposes. A reading is taken with a gauge of one of those
// kinds, never another (an outside micrometer cannot measure a bore); gauge-range.ts adds the
// measuring range and the words that say which gauge to pick.
import { CHARACTERISTICS } from "./stations";
import { quantityOfUnit } from "./units";
import type { MeasureUnit } from "./enums";
import type { CharacteristicId, GaugeKind, QuantityKind, RawCharacteristic } from "./types";

/** Every gauge kind a spec sheet may name, with the words shown for it. */
export const GAUGE_KIND_WORDS: Readonly<Record<GaugeKind, string>> = {
  micrometer: "Micrometer",
  "bore-gauge": "Bore gauge",
  "dial-bore-gauge": "Dial bore gauge",
  feeler: "Feeler gauge",
  "dial-indicator": "Dial indicator",
  "stretch-gauge": "Stretch gauge",
  "deck-gauge": "Deck gauge",
  "torque-wrench": "Torque wrench",
};
export const GAUGE_KINDS = Object.keys(GAUGE_KIND_WORDS) as [GaugeKind, ...GaugeKind[]];

/** Instrument kinds a shop registers (our own names), the quantity each reads and its gauge kind. */
export const INSTRUMENT_KINDS = {
  outside_mic: { label: "Outside micrometer", quantity: "length", gaugeKind: "micrometer" },
  inside_mic: { label: "Inside micrometer", quantity: "length", gaugeKind: "bore-gauge" },
  depth_mic: { label: "Depth micrometer", quantity: "length", gaugeKind: "deck-gauge" },
  bore_gauge_dial: { label: "Dial bore gauge", quantity: "length", gaugeKind: "dial-bore-gauge" },
  bore_gauge_digital: { label: "Digital bore gauge", quantity: "length", gaugeKind: "bore-gauge" },
  dial_indicator: { label: "Dial indicator", quantity: "length", gaugeKind: "dial-indicator" },
  feeler: { label: "Feeler gauge set", quantity: "length", gaugeKind: "feeler" },
  stretch_gauge: { label: "Rod-bolt stretch gauge", quantity: "length", gaugeKind: "stretch-gauge" },
  deck_gauge: { label: "Deck height gauge", quantity: "length", gaugeKind: "deck-gauge" },
  torque_wrench: { label: "Torque wrench", quantity: "torque", gaugeKind: "torque-wrench" },
} as const satisfies Record<string, { label: string; quantity: QuantityKind; gaugeKind: GaugeKind }>;
export type InstrumentKind = keyof typeof INSTRUMENT_KINDS;
export const INSTRUMENT_KIND_IDS = Object.keys(INSTRUMENT_KINDS) as [InstrumentKind, ...InstrumentKind[]];

// A bore (cylinder or installed bearing) is measured with a bore gauge, dial or digital, or an
// inside micrometer; a journal or a skirt with an outside micrometer.
const BORE: readonly GaugeKind[] = ["dial-bore-gauge", "bore-gauge"];
export const USUAL_GAUGES: Readonly<Record<RawCharacteristic, readonly GaugeKind[]>> = {
  bore_diameter: BORE,
  main_journal_diameter: ["micrometer"],
  rod_journal_diameter: ["micrometer"],
  main_bearing_bore: BORE,
  rod_bearing_bore: BORE,
  piston_skirt_diameter: ["micrometer"],
  ring_end_gap: ["feeler"],
  rod_side_clearance: ["feeler", "dial-indicator"],
  crank_end_play: ["dial-indicator", "feeler"],
  rod_bolt_free_length: ["stretch-gauge"],
  rod_bolt_loaded_length: ["stretch-gauge"],
  deck_height: ["deck-gauge"],
  valve_lash: ["feeler"],
  fastener_torque: ["torque-wrench"],
};

/** The gauge kind a new limit proposes for a characteristic (none for a computed one). */
export function usualGaugeKind(characteristic: CharacteristicId): GaugeKind | undefined {
  return (USUAL_GAUGES as Partial<Record<CharacteristicId, readonly GaugeKind[]>>)[characteristic]?.[0];
}

/** The name shown for a registered instrument kind; a kind this table does not know, as stored but spaced. */
export function instrumentKindWords(instrumentKind: string): string {
  const known = (INSTRUMENT_KINDS as Record<string, { label: string } | undefined>)[instrumentKind];
  return known?.label ?? instrumentKind.replace(/_/g, " ");
}

/** The gauge kind of a registered instrument kind; undefined for a kind this table does not know. */
export function gaugeKindOf(instrumentKind: string): GaugeKind | undefined {
  return (INSTRUMENT_KINDS as Record<string, { gaugeKind: GaugeKind } | undefined>)[instrumentKind]?.gaugeKind;
}

/** What a gauge must tell to be matched to a station. */
export interface GaugeFacts {
  kind: string;
  /** The unit it reads; decides the quantity (length or torque). */
  unit: MeasureUnit | string;
}

/**
 * How a gauge suits a characteristic: 0, 1, … its place among the kinds that measure it; undefined
 * when it is of another kind (an outside micrometer on a bore) or reads another quantity, which is
 * refused.
 */
export function gaugeRank(gauge: GaugeFacts, characteristic: RawCharacteristic): number | undefined {
  if (quantityOfUnit(gauge.unit) !== CHARACTERISTICS[characteristic].kind) return undefined;
  const at = USUAL_GAUGES[characteristic].indexOf(gaugeKindOf(gauge.kind) as GaugeKind);
  return at < 0 ? undefined : at;
}

/** True when the gauge is of a kind that measures the characteristic (and reads its quantity). */
export const gaugeSuits = (gauge: GaugeFacts, characteristic: RawCharacteristic): boolean =>
  gaugeRank(gauge, characteristic) !== undefined;

/** True when the gauge is a dial bore gauge: it reads a deviation from a setting size. */
export const isDialBoreGauge = (gauge: GaugeFacts | undefined): boolean =>
  !!gauge && gaugeKindOf(gauge.kind) === "dial-bore-gauge";

/** True when a dial bore gauge usually measures the characteristic (so dial mode applies there). */
export const takesDialBoreGauge = (characteristic: RawCharacteristic): boolean =>
  USUAL_GAUGES[characteristic].includes("dial-bore-gauge");

/** A gauge the tablet may offer: what it is, its name, whether it is in use. */
export type OfferedGauge = GaugeFacts & { label: string; active: boolean };

/** The active gauges that can measure a characteristic, in the table's order of kinds, then by name. */
export function gaugesFor<G extends OfferedGauge>(characteristic: RawCharacteristic, gauges: readonly G[]): G[] {
  const ranked = gauges.flatMap((g) => {
    const rank = g.active ? gaugeRank(g, characteristic) : undefined;
    return rank === undefined ? [] : [{ g, rank }];
  });
  ranked.sort((a, b) => (a.rank === b.rank ? a.g.label.localeCompare(b.g.label) : a.rank < b.rank ? -1 : 1));
  return ranked.map((r) => r.g);
}
