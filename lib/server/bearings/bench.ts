import "server-only";
import { halfPlaceWords, shellSetWords } from "@/lib/domain";
import type { BenchBearing } from "@/lib/schemas/sync-pack";
import { listPoints, listShells, type ShellRow } from "@/lib/server/bearings/repo";

// The saved choice as it travels in the tablet's job pack (and prints in the build record): which
// set each half comes from, where it goes, and the clearance predicted for it.

const words = (s: ShellRow) =>
  `#${s.id} ${shellSetWords({
    series: s.series,
    role: s.role,
    step: {
      kind: s.step,
      ...(s.stepAmount != null ? { amount: s.stepAmount } : {}),
      ...(s.grade ? { grade: s.grade } : {}),
    },
    unit: s.unit,
  })}`;

export async function chosenBearings(shopId: number, jobId: number): Promise<BenchBearing[]> {
  const [shells, points] = await Promise.all([listShells(shopId, jobId), listPoints(shopId, jobId)]);
  return points.flatMap((p) => {
    const upper = shells.find((s) => s.id === p.upperShellId);
    const lower = shells.find((s) => s.id === p.lowerShellId);
    if (!upper || !lower) return [];
    const role = p.point.startsWith("rod/") ? "rod" : p.thrust ? "thrust" : "main";
    return [
      {
        point: p.point,
        upper: { shellId: upper.id, words: words(upper), place: halfPlaceWords(role, "upper") },
        lower: { shellId: lower.id, words: words(lower), place: halfPlaceWords(role, "lower") },
        predicted: p.predictedClearance ?? null,
        uncertainty: p.predictedU ?? null,
        unit: upper.unit,
      },
    ];
  });
}
