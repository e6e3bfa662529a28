// A reading as it is kept (on the tablet, or in the database) turned into the core's RawReading,
// with the uncertainty of the gauge it was taken with. The tablet's preview and the server's
// verdicts both go through here, so a figure is judged with the same guard band on both.
import { uncertaintyAtK2 } from "./gauge-uncertainty";
import type { Lubricant, RawReading } from "./types";
import { convertMeasure } from "./units";

/** What the core takes of a gauge's certificate: its expanded uncertainty U at coverage factor k, in its unit. */
export interface GaugeCertificate {
  unit: string;
  expandedU: number;
  coverageK: number;
}

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
 * The gauge's U restated at k = 2 and in `unit`; undefined without a gauge or a U, or when the gauge
 * reads another quantity. A k that is not above zero is taken as 2, the usual certificate's.
 */
export function gaugeUncertainty(gauge: GaugeCertificate | undefined, unit: string): number | undefined {
  if (!gauge || !(gauge.expandedU >= 0)) return undefined;
  const atK2 = uncertaintyAtK2(gauge.expandedU, gauge.coverageK > 0 ? gauge.coverageK : 2);
  return convertMeasure(atK2, gauge.unit, unit);
}

/** The core's input for a kept reading taken with `gauge` (none: no guard band). */
export function coreReading(r: KeptReading, gauge?: GaugeCertificate): RawReading {
  const u = gaugeUncertainty(gauge, r.unit);
  const at = r.takenAt instanceof Date ? r.takenAt.toISOString() : r.takenAt;
  return {
    stationId: r.stationId,
    value: r.value,
    unit: r.unit as RawReading["unit"],
    ...(at !== undefined ? { takenAt: at } : {}),
    ...(r.partTempC != null ? { temperatureC: r.partTempC } : {}),
    ...(r.gaugeTempC != null ? { gaugeTemperatureC: r.gaugeTempC } : {}),
    ...(u !== undefined ? { uncertainty: u } : {}),
    ...(r.lubricant ? { lubricant: r.lubricant as Lubricant } : {}),
  };
}
