// The shapes of gauge capability studies, shared by the core's statistics, the server that keeps
// studies, the tablet that runs them and the desk that shows them. Every figure is in the gauge's
// unit unless its name says otherwise.

/** Thresholds a shop sets for a gauge to pass a study (defaults: common practice). */
export interface StudyThresholds {
  /** Least Cg and Cgk a repeatability study must reach (common practice: 1.33). */
  minCg: number;
  minCgk: number;
  /** Largest gauge resolution as a percentage of the tolerance T (common practice: 5). */
  maxResolutionPct: number;
  /** Largest %GRR against tolerance an R&R study may show (common practice: 10 good, 30 at most). */
  maxGrrPct: number;
  /** Months a study stays current before it is due again. */
  validMonths: number;
}

/** The reference a repeatability study measures: a setting master or gauge block, from its certificate. */
export interface StudyReference {
  value: number;
  /** Expanded uncertainty of the reference at `coverageK` (normally 2). */
  expandedU: number;
  coverageK: number;
}

/** One characteristic the gauge is used for, with the tolerance T = upper − lower it must judge. */
export interface StudyCharacteristic {
  characteristic: string;
  tolerance: number;
}

export interface Type1Input {
  /** 25 to 50 readings of the reference, in the order taken. */
  readings: readonly number[];
  reference: StudyReference;
  /** The gauge's smallest step. */
  resolution: number;
  characteristics: readonly StudyCharacteristic[];
  thresholds: StudyThresholds;
}

/** A study's verdict for one characteristic; `reasons` says in words why it failed (empty on a pass). */
export interface CharacteristicCapability {
  characteristic: string;
  tolerance: number;
  /** Null when the readings showed no spread (every one the same): nothing to divide by. */
  cg: number | null;
  cgk: number | null;
  resolutionPct: number;
  resolutionOk: boolean;
  pass: boolean;
  reasons: string[];
}

export interface Type1Result {
  n: number;
  mean: number;
  sd: number;
  bias: number;
  /** Student's t of the bias (n − 1 degrees of freedom) and its two-sided p-value; null when s = 0. */
  t: number | null;
  pValue: number | null;
  /** True when the bias differs from zero at the 5 % level (with s = 0: when there is any bias). */
  biasSignificant: boolean;
  /** Words about the run as a whole (no spread seen, a significant bias), for the screen. */
  notes: string[];
  perCharacteristic: CharacteristicCapability[];
}

/** One reading of an R&R study: appraiser, part and trial are counted from 1. */
export interface GrrMeasurement {
  appraiser: number;
  part: number;
  trial: number;
  value: number;
}

export interface GrrInput {
  measurements: readonly GrrMeasurement[];
  /** Tolerance T for %GRR against tolerance; omitted: that figure is null. */
  tolerance?: number;
  /** Spread taken as the study variation: 6 standard deviations (common practice; some use 5.15). */
  spreadSigmas?: number;
  /** True: never pool the interaction into repeatability (the full table, as reference manuals print it). */
  keepInteraction?: boolean;
}

export interface AnovaRow {
  source: "part" | "appraiser" | "interaction" | "repeatability" | "total";
  df: number;
  ss: number;
  ms: number;
  f: number | null;
  p: number | null;
}

/** Standard deviations of the parts of the variation (square roots of the variance components). */
export interface GrrComponents {
  repeatability: number;
  reproducibility: number;
  appraiser: number;
  interaction: number;
  grr: number;
  part: number;
  total: number;
}

export interface GrrResult {
  appraisers: number;
  parts: number;
  trials: number;
  anova: AnovaRow[];
  /** True when the interaction was not significant and was pooled into repeatability. */
  interactionPooled: boolean;
  sd: GrrComponents;
  /** 100 · σ_GRR / σ_total. */
  pctStudyVariation: number;
  /** 100 · spreadSigmas · σ_GRR / T; null without a tolerance. */
  pctTolerance: number | null;
  /** Number of distinct categories, 1.41 · σ_part / σ_GRR, rounded down (at least 1). */
  ndc: number;
}

/** What a gauge's latest study adds to its uncertainty budget and its flags. */
export interface GaugeStudySummary {
  kind: "type1" | "grr";
  /** YYYY-MM-DD the study was taken and when it is due again. */
  performedOn: string;
  dueOn: string;
  /** Repeatability standard deviation the study found, in the gauge's unit. */
  repeatSd: number;
  /** Bias against the reference (type 1 only; 0 for an R&R study). */
  bias: number;
  /** σ_GRR of an R&R study (repeatability and reproducibility together); absent on a type 1 study. */
  grrSd?: number;
  /** The thresholds the study was judged by when it was saved (a later change applies to later studies). */
  thresholds?: StudyThresholds;
}

/** One line of a gauge's uncertainty budget (JCGM 100 style): a standard uncertainty and where it came from. */
export interface BudgetLine {
  source: "certificate" | "repeatability" | "resolution";
  standardU: number;
}

export interface GaugeBudget {
  lines: BudgetLine[];
  /** Combined standard uncertainty and the expanded U at k = 2 that the guard band uses. */
  uc: number;
  U: number;
}
