import "server-only";
import type { StudyGauge } from "@/lib/schemas/bench-gauges";
import { settingMasters } from "@/lib/server/bench/repo";
import { shopInstruments } from "@/lib/server/readings/gauge-repo";

/** The shop's gauges in use, as a job pack carries them, with their setting masters: what a study picks from. */
export async function benchGauges(shopId: number): Promise<StudyGauge[]> {
  const [all, masters] = await Promise.all([shopInstruments(shopId), settingMasters(shopId)]);
  return all.filter((g) => g.active).map(({ shopId: _s, ...g }) => ({ ...g, master: masters.get(g.id) ?? null }));
}
