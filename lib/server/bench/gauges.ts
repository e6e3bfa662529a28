import "server-only";
import type { BenchInstrument } from "@/lib/schemas/sync";
import { shopInstruments } from "@/lib/server/readings/repo";

/** The shop's gauges in use, as a job pack carries them: what the tablet's gauge studies pick from. */
export async function benchGauges(shopId: number): Promise<BenchInstrument[]> {
  const all = await shopInstruments(shopId);
  return all.filter((g) => g.active).map(({ shopId: _s, ...g }) => g);
}
