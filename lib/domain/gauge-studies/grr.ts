// Repeatability and reproducibility across people by the ANOVA method: a two-way crossed design
// (parts × appraisers, r trials each) with interaction. Parts and appraisers are tested against the
// interaction's mean square, the interaction against repeatability's; an interaction that is not
// significant (p > 0.25, common practice) is pooled into repeatability. Variance components from the
// expected mean squares of the random-effects model, a negative estimate taken as 0.
import jStat from "jstat";
import { checkGrrDesign } from "./checks";
import type { AnovaRow, GrrComponents, GrrInput, GrrMeasurement, GrrResult } from "./types";

/** Above this p the interaction is pooled into repeatability (common practice). */
export const POOL_INTERACTION_ABOVE_P = 0.25;

interface Sums {
  a: number;
  b: number;
  r: number;
  part: number;
  appraiser: number;
  interaction: number;
  repeatability: number;
  total: number;
}

function average(values: readonly number[]): number {
  const origin = values[0];
  return origin + values.reduce((sum, x) => sum + (x - origin), 0) / values.length;
}

/** Sums of squares of the balanced design, each from its own deviations (no subtraction). */
function sumsOfSquares(measurements: readonly GrrMeasurement[]): Sums {
  const appraisers = [...new Set(measurements.map((m) => m.appraiser))];
  const parts = [...new Set(measurements.map((m) => m.part))];
  const [a, b] = [appraisers.length, parts.length];
  const r = measurements.length / (a * b);
  const grand = average(measurements.map((m) => m.value));
  const meanOf = (keep: (m: GrrMeasurement) => boolean) => average(measurements.filter(keep).map((m) => m.value));
  const partMean = new Map(parts.map((p) => [p, meanOf((m) => m.part === p)]));
  const appraiserMean = new Map(appraisers.map((o) => [o, meanOf((m) => m.appraiser === o)]));
  const cellMean = new Map<string, number>();
  for (const o of appraisers) {
    for (const p of parts)
      cellMean.set(
        `${o}/${p}`,
        meanOf((m) => m.appraiser === o && m.part === p),
      );
  }
  const squares = (xs: Iterable<number>) => [...xs].reduce((sum, x) => sum + x * x, 0);
  let interaction = 0;
  for (const o of appraisers) {
    for (const p of parts) {
      const d = cellMean.get(`${o}/${p}`)! - partMean.get(p)! - appraiserMean.get(o)! + grand;
      interaction += r * d * d;
    }
  }
  return {
    a,
    b,
    r,
    part: a * r * squares([...partMean.values()].map((x) => x - grand)),
    appraiser: b * r * squares([...appraiserMean.values()].map((x) => x - grand)),
    interaction,
    repeatability: squares(measurements.map((m) => m.value - cellMean.get(`${m.appraiser}/${m.part}`)!)),
    total: squares(measurements.map((m) => m.value - grand)),
  };
}

function fTest(ms: number, df: number, msDenominator: number, dfDenominator: number) {
  if (!(msDenominator > 0)) return { f: null, p: null };
  const f = ms / msDenominator;
  return { f, p: Math.max(0, 1 - jStat.centralF.cdf(f, df, dfDenominator)) };
}

function row(source: AnovaRow["source"], df: number, ss: number, test?: { f: number | null; p: number | null }) {
  return { source, df, ss, ms: ss / df, f: test?.f ?? null, p: test?.p ?? null };
}

function anovaTable(
  s: Sums,
  keepInteraction: boolean,
): { anova: AnovaRow[]; pooled: boolean; msRepeat: number; msInteraction: number } {
  const df = { part: s.b - 1, appraiser: s.a - 1, interaction: (s.a - 1) * (s.b - 1), repeat: s.a * s.b * (s.r - 1) };
  const msInteraction = s.interaction / df.interaction;
  const msRepeat = s.repeatability / df.repeat;
  const interactionTest = fTest(msInteraction, df.interaction, msRepeat, df.repeat);
  const notSignificant =
    interactionTest.p === null ? msInteraction === 0 : interactionTest.p > POOL_INTERACTION_ABOVE_P;
  const pooled = notSignificant && !keepInteraction;
  const total = row("total", s.a * s.b * s.r - 1, s.total);
  if (pooled) {
    const dfPool = df.interaction + df.repeat;
    const msPool = (s.interaction + s.repeatability) / dfPool;
    return {
      anova: [
        row("part", df.part, s.part, fTest(s.part / df.part, df.part, msPool, dfPool)),
        row("appraiser", df.appraiser, s.appraiser, fTest(s.appraiser / df.appraiser, df.appraiser, msPool, dfPool)),
        row("repeatability", dfPool, s.interaction + s.repeatability),
        total,
      ],
      pooled,
      msRepeat: msPool,
      msInteraction: msPool,
    };
  }
  return {
    anova: [
      row("part", df.part, s.part, fTest(s.part / df.part, df.part, msInteraction, df.interaction)),
      row(
        "appraiser",
        df.appraiser,
        s.appraiser,
        fTest(s.appraiser / df.appraiser, df.appraiser, msInteraction, df.interaction),
      ),
      row("interaction", df.interaction, s.interaction, interactionTest),
      row("repeatability", df.repeat, s.repeatability),
      total,
    ],
    pooled,
    msRepeat,
    msInteraction,
  };
}

/** Standard deviations of each part of the variation (expected mean squares, negatives set to 0). */
function components(s: Sums, t: ReturnType<typeof anovaTable>): GrrComponents {
  const ms = (source: AnovaRow["source"]) => t.anova.find((r) => r.source === source)!.ms;
  const repeatVar = t.msRepeat;
  const interactionVar = t.pooled ? 0 : Math.max(0, (t.msInteraction - t.msRepeat) / s.r);
  const appraiserVar = Math.max(0, (ms("appraiser") - t.msInteraction) / (s.b * s.r));
  const partVar = Math.max(0, (ms("part") - t.msInteraction) / (s.a * s.r));
  const reproducibilityVar = appraiserVar + interactionVar;
  const grrVar = repeatVar + reproducibilityVar;
  return {
    repeatability: Math.sqrt(repeatVar),
    reproducibility: Math.sqrt(reproducibilityVar),
    appraiser: Math.sqrt(appraiserVar),
    interaction: Math.sqrt(interactionVar),
    grr: Math.sqrt(grrVar),
    part: Math.sqrt(partVar),
    total: Math.sqrt(grrVar + partVar),
  };
}

/** The R&R study's ANOVA, its variation split by source, %GRR and the number of distinct categories. */
export function grrAnova(input: GrrInput): GrrResult {
  const problems = checkGrrDesign(input.measurements);
  if (input.tolerance !== undefined && !(input.tolerance > 0 && Number.isFinite(input.tolerance))) {
    problems.push("The tolerance must be above zero (upper − lower limit), or left out.");
  }
  const spreadSigmas = input.spreadSigmas ?? 6;
  if (!(spreadSigmas > 0 && Number.isFinite(spreadSigmas))) {
    problems.push("The study variation must span a number of standard deviations above zero (usually 6).");
  }
  if (problems.length > 0) throw new Error(problems.join(" "));
  const sums = sumsOfSquares(input.measurements);
  const table = anovaTable(sums, input.keepInteraction === true);
  const sd = components(sums, table);
  if (!(sd.grr > 0)) {
    throw new Error(
      "Every trial of each part gave the same figure and the appraisers agreed exactly, so the study shows no " +
        "measurement spread to judge: repeat it with a gauge that reads in finer steps.",
    );
  }
  return {
    appraisers: sums.a,
    parts: sums.b,
    trials: sums.r,
    anova: table.anova,
    interactionPooled: table.pooled,
    sd,
    pctStudyVariation: (100 * sd.grr) / sd.total,
    pctTolerance: input.tolerance === undefined ? null : (100 * spreadSigmas * sd.grr) / input.tolerance,
    ndc: Math.max(1, Math.floor((1.41 * sd.part) / sd.grr)),
  };
}
