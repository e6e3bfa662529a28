// The demo's gauges copied into a bench shop (benchmark data only): every bench reading names one
// whose kind and range suit it, as the ingest asks. All are in calibration here (the demo keeps
// some past due, or due soon, to show their flags); a bench measures the ordinary path, not a flag
// on every reading of one gauge.
import { Instrument } from "@/models";
import type { RangedGauge } from "@/lib/domain";
import { DEMO_GAUGES } from "../seed/demo-gauges";

export type BenchGauge = RangedGauge & { id: number };

const IN_CALIBRATION_UNTIL = "2099-12-31";

/** Creates the demo gauges in `shopId`, in the demo's order, each in calibration. */
export async function createDemoGauges(shopId: number): Promise<BenchGauge[]> {
  const gauges: BenchGauge[] = [];
  for (const { key, ...g } of DEMO_GAUGES) {
    void key;
    const made = await Instrument.create({ shopId, ...g, calibrationDue: IN_CALIBRATION_UNTIL } as never);
    gauges.push({ ...g, id: made.get("id") as number, active: true } as BenchGauge);
  }
  return gauges;
}
