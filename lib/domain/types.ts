// Shared types of the measurement core. The database layer, the sync API and the tablet all
// store and send these shapes, so every one is plain JSON data: strings, numbers, booleans,
// arrays and plain objects only (no Date, no class instances, no functions, no Map).
// Optional fields are simply left out when unknown; nothing relies on `undefined` surviving JSON.
import type { EngineLayout, LengthUnit, LimitType, MeasureUnit, Verdict } from "./enums";
import type { ExpansionMaterial } from "./thermal";

/** What kind of quantity a characteristic is; decides which units are allowed. */
export type QuantityKind = "length" | "torque";
/** A job's unit system: inch jobs use in and lbf·ft, metric jobs use mm and N·m. */
export type UnitSystem = "inch" | "metric";

/** Every characteristic the core knows. Raw ones are entered at the bench; derived ones are computed. */
export type RawCharacteristic =
  | "bore_diameter"
  | "main_journal_diameter"
  | "rod_journal_diameter"
  | "main_bearing_bore"
  | "rod_bearing_bore"
  | "piston_skirt_diameter"
  | "ring_end_gap"
  | "rod_side_clearance"
  | "crank_end_play"
  | "rod_bolt_free_length"
  | "rod_bolt_loaded_length"
  | "deck_height"
  | "valve_lash"
  | "fastener_torque";
export type DerivedCharacteristic =
  | "main_oil_clearance"
  | "rod_oil_clearance"
  | "piston_to_wall"
  | "bore_taper"
  | "bore_out_of_round"
  | "main_journal_taper"
  | "main_journal_out_of_round"
  | "rod_journal_taper"
  | "rod_journal_out_of_round"
  | "rod_bolt_stretch";
export type CharacteristicId = RawCharacteristic | DerivedCharacteristic;

/** Bench sections; each id is also the first segment of its station ids (see stations.ts). */
export type SectionId =
  | "bore"
  | "deck"
  | "main-brg"
  | "main"
  | "rod"
  | "rod-brg"
  | "skirt"
  | "ring-gap"
  | "end-play"
  | "side"
  | "bolt"
  | "torque"
  | "lash";

export type BoreDepth = "top" | "mid" | "bottom";
/** Bores: A = thrust axis, B = pin axis. Journals: two axes 90° apart. Bearing bores: A square to the cap joint. */
export type Axis = "A" | "B";
export type JournalPosition = "front" | "rear";
/** Inline engines have one deck ("block"); V and flat engines a left and a right bank. */
export type DeckBank = "block" | "left" | "right";
export type DeckCorner = "front" | "rear";
export type BoltState = "free" | "loaded";

/** A station id taken apart (parseStationId); only the fields its section uses are present. */
export interface ParsedStation {
  id: string;
  section: SectionId;
  /** The raw characteristic read there; absent for part ids such as "bore/3" that only name derived values. */
  characteristic?: RawCharacteristic;
  cylinder?: number;
  /** Main journal (and main bearing) number. */
  main?: number;
  /** Crankpin (rod journal) number. */
  journal?: number;
  /** Connecting rod number (rod bearing bore, side clearance, rod bolts). */
  rod?: number;
  depth?: BoreDepth;
  axis?: Axis;
  position?: JournalPosition;
  /** "top", "second", "third" or "oil". */
  ring?: string;
  bolt?: number;
  boltState?: BoltState;
  bank?: DeckBank;
  corner?: DeckCorner;
  /** "int", "exh", or numbered "int1", "exh2" when a cylinder has more than one. */
  valve?: string;
  /** Torque group id, e.g. "main-caps". */
  group?: string;
}

/** Kinds of gauge a spec sheet names (our own names); words and the table of which suits what in gauges.ts. */
export type GaugeKind =
  | "micrometer"
  | "bore-gauge"
  | "dial-bore-gauge"
  | "feeler"
  | "dial-indicator"
  | "stretch-gauge"
  | "deck-gauge"
  | "torque-wrench";

/** Which part of the engine a characteristic is measured on; picks the expansion coefficient. */
export type EnginePart = "block" | "crank" | "rods" | "pistons" | "rodBolts";

/** Lubricant used on a torqued fastener (it changes the preload a torque gives). */
export type Lubricant = "engine-oil" | "moly-paste" | "fastener-lube" | "thread-sealant" | "dry";

/** One characteristic in the catalogue (stations.ts). */
export interface CharacteristicInfo {
  id: CharacteristicId;
  /** Plain-English name for the machinist. */
  label: string;
  section: SectionId;
  kind: QuantityKind;
  derived: boolean;
  /** The part it is measured on, when a temperature correction makes sense. */
  part?: EnginePart;
}

/** One limit of a job's spec sheet, as the lead builder enters it. */
export interface SpecLimit {
  characteristic: CharacteristicId;
  /** Which stations it applies to; grammar and matching rule in limits.ts (e.g. "*", "main/3/*"). */
  stationPattern: string;
  limitType: LimitType;
  unit: MeasureUnit;
  min?: number;
  max?: number;
  nominal?: number;
  /** Magnitudes (≥ 0): the limits are nominal + tolPlus and nominal − tolMinus. */
  tolPlus?: number;
  tolMinus?: number;
  /** Ratios per inch of diameter (0.00075 means 0.00075 in per in, i.e. also mm per mm). */
  perInchMin?: number;
  perInchMax?: number;
  /** ISO 286 tolerance class, e.g. "H7", "g6". */
  isoClass?: string;
  required: boolean;
  gaugeKind?: GaugeKind;
  label?: string;
  /** A starter sheet's typical figure, not yet replaced by the maker's (COMMON_PRACTICE_WORDS). */
  commonPractice?: boolean;
}

/** A limit turned into plain numbers, in `unit` (the SpecLimit's unit). */
export interface ResolvedLimit {
  unit: MeasureUnit;
  min?: number;
  max?: number;
  nominal?: number;
}

/** Sizes of an engine (design) or of a job (finished), in the engine's length unit. */
export interface NominalSizes {
  bore?: number;
  mainJournal?: number;
  rodJournal?: number;
}

/** Materials by part; ids are keys of EXPANSION_COEFFICIENTS (thermal.ts), e.g. "greyCastIron". */
export type PartMaterials = Partial<Record<EnginePart, ExpansionMaterial>>;

export interface EngineShape {
  cylinders: number;
  layout: EngineLayout;
  mains: number;
  valvesPerCylinder: number;
  /** Default 2. */
  boltsPerRod?: number;
  /** Default 3 (top, second, oil). */
  ringsPerPiston?: number;
  unitSystem: UnitSystem;
  /** Crankpins. Default: cylinders for inline and flat, cylinders / 2 for a V (two rods a pin). */
  rodJournals?: number;
  /** Crankpin of each rod, rod 1 first. Default: inline/flat rod n on pin n; V rods 1–2 on pin 1, 3–4 on pin 2… */
  rodJournalMap?: number[];
  /** Torque groups to log; default in bench-route.ts (TORQUE_GROUPS). */
  torqueGroups?: string[];
  materials?: PartMaterials;
  nominalSizes?: NominalSizes;
  /**
   * The sizes this job machines to (a bore after overboring, a journal after undersize grinding),
   * as the job states them; job-size limits and per-inch rules follow them (job-sizes.ts).
   */
  finishedSizes?: NominalSizes;
}

/** One figure entered at the bench. */
export interface RawReading {
  stationId: string;
  value: number;
  unit: MeasureUnit;
  /** Temperature of the part when measured, °C. */
  temperatureC?: number;
  /** Temperature of the gauge (and its setting master), °C; when absent the part-only correction is used. */
  gaugeTemperatureC?: number;
  /** Expanded uncertainty U (k = 2) of this reading, in `unit`. */
  uncertainty?: number;
  /** ISO 8601 time; when a station has several readings the latest wins. */
  takenAt?: string;
  /** Torque entries: the lubricant used on the threads and under the head. */
  lubricant?: Lubricant;
  /** Material of the part, overriding the engine's materials (key of EXPANSION_COEFFICIENTS). */
  material?: ExpansionMaterial;
}

/** One place on the engine where a figure is taken (see the station id grammar in stations.ts). */
export interface Station {
  id: string;
  characteristic: RawCharacteristic;
  section: SectionId;
  /** Words for the machinist, from describeStation. */
  label: string;
  kind: QuantityKind;
  unit: MeasureUnit;
  /** True for torque entries, which also need a lubricant. */
  torque: boolean;
  gaugeKind?: GaugeKind;
}

export interface RouteSection {
  id: SectionId;
  label: string;
  count: number;
  stations: Station[];
}

export interface BenchRoute {
  sections: RouteSection[];
  total: number;
}

/** How a length was brought to 20 °C before use (values in the reading's unit). */
export interface ThermalCorrection {
  stationId: string;
  measured: number;
  corrected: number;
  partTempC: number;
  alphaPart: number;
  material: ExpansionMaterial;
  gaugeTempC?: number;
}

/** The result of checking one figure against its limit. */
export interface Evaluation {
  /** Absent when the spec has no limit for this characteristic and station, or it cannot be resolved. */
  verdict?: Verdict;
  limits?: ResolvedLimit;
  /** Value compared with the limits, in the limits' unit (after any 20 °C correction). */
  value: number;
  unit: MeasureUnit;
  /** Value − nominal (or − mid-tolerance), in `unit`; absent for one-sided limits. */
  deviation?: number;
  /** Expanded uncertainty U (k = 2) used for the guard band, in `unit`. */
  uncertainty?: number;
  correction?: ThermalCorrection;
  /** Why there is no verdict (no limit, or what the limit still needs). */
  note?: string;
}

/** A value computed from raw readings, with what it was computed from. */
export interface DerivedValue extends Partial<Omit<Evaluation, "correction" | "unit">> {
  /** `${characteristic}@${stationId}`; unique within one job. */
  key: string;
  characteristic: DerivedCharacteristic;
  stationId: string;
  label: string;
  unit: LengthUnit;
  /** Station ids the value is computed from. */
  inputs: string[];
  /** Inputs without a usable reading yet; when non-empty there is no value (limits are still given when known). */
  missing: string[];
  /** Inputs that were brought to 20 °C before the value was computed. */
  corrections?: ThermalCorrection[];
}
