import "server-only";
import type { LatestStudyLine } from "@/lib/schemas/gauge-study-overview";
import { listInstruments } from "@/lib/server/gauges/repo";
import { latestStudies } from "./repo";

/** The latest study of every gauge of the shop (deactivated ones too); gauges without one are left out. */
export async function latestStudyLines(shopId: number): Promise<LatestStudyLine[]> {
  const gauges = await listInstruments(shopId, { includeInactive: true });
  const latest = await latestStudies(
    shopId,
    gauges.map((g) => g.id),
  );
  return [...latest.values()].map((s) => ({ instrumentId: s.instrumentId, passed: s.passed, summary: s.summary }));
}
