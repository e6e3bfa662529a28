import "server-only";
import {
  checkGrrDesign,
  checkType1Readings,
  grrAnova,
  convertMeasure,
  studyDueOn,
  type1Study,
  type StudyCharacteristic,
  type StudyThresholds,
} from "@/lib/domain";
import type { GrrStudyInput, Type1StudyInput } from "@/lib/schemas/gauge-studies";
import { AppError } from "@/lib/server/core/errors";
import type { NewStudyRow, StudyGauge } from "./repo";

// A study's figures, worked out by the core from what was measured (never from a client's result),
// with the tolerances it is judged against: those the gauge judged on open jobs, and any the
// person added. No database here.

export type Used = { characteristic: string; unit: string; tolerance: number };

/** One tolerance per characteristic, the tightest, in the gauge's unit. */
export function studyCharacteristics(
  gauge: StudyGauge,
  used: readonly Used[],
  added: readonly StudyCharacteristic[],
): StudyCharacteristic[] {
  const tightest = new Map<string, number>();
  const keep = (c: string, t: number) => {
    const rounded = Number(t.toPrecision(12));
    if (rounded > 0 && !(rounded >= (tightest.get(c) ?? Infinity))) tightest.set(c, rounded);
  };
  for (const u of used) {
    const inGaugeUnit = convertMeasure(u.tolerance, u.unit, gauge.unit);
    if (inGaugeUnit !== undefined && Number.isFinite(inGaugeUnit)) keep(u.characteristic, inGaugeUnit);
  }
  for (const a of added) keep(a.characteristic, a.tolerance);
  return [...tightest].map(([characteristic, tolerance]) => ({ characteristic, tolerance }));
}

const todayUtc = () => new Date().toISOString().slice(0, 10);

type Row = Omit<NewStudyRow, "instrumentId" | "performedBy">;

function studyDay(performedOn: string | undefined): string {
  const day = performedOn ?? todayUtc();
  if (day > todayUtc()) {
    throw new AppError("invalid", "A study cannot be dated after today", {
      performedOn: ["Enter the day the readings were taken"],
    });
  }
  return day;
}

/** The row a type 1 study keeps; 422 with the core's words when the readings will not do. */
export function type1Row(
  gauge: StudyGauge,
  input: Type1StudyInput,
  characteristics: StudyCharacteristic[],
  thresholds: StudyThresholds,
): Row {
  const problems = checkType1Readings(input.readings);
  if (problems.length) throw new AppError("invalid", problems.join(" "), { readings: problems });
  const performedOn = studyDay(input.performedOn);
  const result = type1Study({
    readings: input.readings,
    reference: input.reference,
    resolution: gauge.resolution,
    characteristics,
    thresholds,
  });
  return {
    kind: "type1",
    performedOn,
    dueOn: studyDueOn(performedOn, thresholds.validMonths),
    unit: gauge.unit,
    resolution: gauge.resolution,
    reference: input.reference,
    tolerance: null,
    measurements: [...input.readings],
    appraisers: null,
    mean: result.mean,
    repeatSd: result.sd,
    bias: result.bias,
    grrSd: null,
    passed: result.perCharacteristic.every((c) => c.pass),
    thresholds,
    result,
  };
}

/**
 * The row an R&R study keeps. It passes when its %GRR (against the tolerance when one was given,
 * else against the study's own variation) is within the shop's mark.
 */
export function grrRow(gauge: StudyGauge, input: GrrStudyInput, thresholds: StudyThresholds): Row {
  const problems = checkGrrDesign(input.measurements);
  const appraisersUsed = new Set(input.measurements.map((m) => m.appraiser));
  if ([...appraisersUsed].some((a) => a > input.appraisers.length)) {
    problems.push(`Name every appraiser: ${input.appraisers.length} named, readings name ${appraisersUsed.size}.`);
  }
  if (problems.length) throw new AppError("invalid", problems.join(" "), { measurements: problems });
  const performedOn = studyDay(input.performedOn);
  const result = grrAnova({ measurements: input.measurements, tolerance: input.tolerance });
  const pct = result.pctTolerance ?? result.pctStudyVariation;
  const values = input.measurements.map((m) => m.value);
  return {
    kind: "grr",
    performedOn,
    dueOn: studyDueOn(performedOn, thresholds.validMonths),
    unit: gauge.unit,
    resolution: gauge.resolution,
    reference: null,
    tolerance: input.tolerance ?? null,
    measurements: input.measurements.map((m) => ({ ...m })),
    appraisers: [...input.appraisers],
    mean: values.reduce((a, b) => a + b, 0) / values.length,
    repeatSd: result.sd.repeatability,
    bias: 0,
    grrSd: result.sd.grr,
    passed: pct <= thresholds.maxGrrPct,
    thresholds,
    result,
  };
}
