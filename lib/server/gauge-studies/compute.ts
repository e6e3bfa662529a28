import "server-only";
import {
  checkType1Readings,
  convertMeasure,
  studyDueOn,
  type1Study,
  type StudyCharacteristic,
  type StudyThresholds,
} from "@/lib/domain";
import type { Type1StudyInput } from "@/lib/schemas/gauge-studies";
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

/** The row a type 1 study keeps; 422 with the core's words when the readings will not do. */
export function type1Row(
  gauge: StudyGauge,
  input: Type1StudyInput,
  characteristics: StudyCharacteristic[],
  thresholds: StudyThresholds,
): Omit<NewStudyRow, "instrumentId" | "performedBy"> {
  const problems = checkType1Readings(input.readings);
  if (problems.length) throw new AppError("invalid", problems.join(" "), { readings: problems });
  const performedOn = input.performedOn ?? todayUtc();
  if (performedOn > todayUtc()) {
    throw new AppError("invalid", "A study cannot be dated after today", {
      performedOn: ["Enter the day the readings were taken"],
    });
  }
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
