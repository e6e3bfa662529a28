import "server-only";
import type { GuideState } from "@/lib/schemas/shop";
import { guideCounts } from "./repo";

// The first-job guide: a step is done when the shop has done it, wherever it was done. Picking a
// sheet counts once a sheet was made, imported or edited, or a job took one.
export async function guideState(shopId: number): Promise<GuideState> {
  const c = await guideCounts(shopId);
  return {
    done: { gauge: c.gauges > 0, sheet: c.sheetEdits > 0 || c.jobs > 0, job: c.jobs > 0, bench: c.readings > 0 },
    firstJobId: c.firstJobId,
  };
}
