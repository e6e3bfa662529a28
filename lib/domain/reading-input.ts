// A reading as it is kept (on the tablet, or in the database) turned into the core's RawReading,
// with the uncertainty of the gauge it was taken with. The tablet's preview and the server's
// verdicts both go through here, so a figure is judged with the same guard band on both.
import { gaugeBudget } from "./gauge-studies/budget";
import type { GaugeStudySummary } from "./gauge-studies/types";
import type { Lubricant, RawReading } from "./types";
import { convertMeasure } from "./units";

/**
 * What the core takes of a gauge, in its unit: its certificate's expanded uncertainty U at coverage
 * factor k, its smallest step and the repeatability its latest study found (each optional).
 */
export interface GaugeCertificate {
  unit: string;
  expandedU: number;
  coverageK: number;
  resolution?: number | null;
  study?: Pick<GaugeStudySummary, "repeatSd"> | null;
}

const usable = (x: number | null | undefined): x is number => typeof x === "number" && Number.isFinite(x) && x >= 0;

/** A reading as kept: a figure not taken is null (database) or left out (tablet). */
export interface KeptReading {
  stationId: string;
  value: number;
  unit: string;
  takenAt?: string | Date;
  partTempC?: number | null;
  gaugeTempC?: number | null;
  lubricant?: string | null;
}

/**
 * The U at k = 2 of one reading taken with the gauge, in `unit`: its budget of certificate (U/k),
 * study repeatability (s) and resolution (δ/√12). Undefined without a gauge or a U, or when the gauge
 * reads another quantity. A k that is not above zero is taken as 2, the usual certificate's; a step or
 * a study figure that is not a number of zero or more is left out of the budget.
 */
export function gaugeUncertainty(gauge: GaugeCertificate | undefined, unit: string): number | undefined {
  if (!gauge || !usable(gauge.expandedU)) return undefined;
  const { U } = gaugeBudget({
    expandedU: gauge.expandedU,
    coverageK: gauge.coverageK > 0 ? gauge.coverageK : 2,
    resolution: usable(gauge.resolution) ? gauge.resolution : 0,
    study: gauge.study && usable(gauge.study.repeatSd) ? gauge.study : null,
  });
  return convertMeasure(U, gauge.unit, unit);
}

/** The core's input for a kept reading taken with `gauge` (none: no guard band). */
export function coreReading(r: KeptReading, gauge?: GaugeCertificate): RawReading {
  const u = gaugeUncertainty(gauge, r.unit);
  const at = r.takenAt instanceof Date ? r.takenAt.toISOString() : r.takenAt;
  // Built by assignment, keys in this order: a job's page and exports make hundreds, and spreads of
  // optional parts cost more than the rest of the step.
  const raw: RawReading = { stationId: r.stationId, value: r.value, unit: r.unit as RawReading["unit"] };
  if (at !== undefined) raw.takenAt = at;
  if (r.partTempC != null) raw.temperatureC = r.partTempC;
  if (r.gaugeTempC != null) raw.gaugeTemperatureC = r.gaugeTempC;
  if (u !== undefined) raw.uncertainty = u;
  if (r.lubricant) raw.lubricant = r.lubricant as Lubricant;
  return raw;
}
