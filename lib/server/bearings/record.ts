import "server-only";
import { halfPlaceWords, lengthWords } from "@/lib/domain";
import type { BearingRecordLine } from "@/lib/schemas/record";
import { getBearingsView } from "@/lib/server/bearings/view";
import { clearanceWords, differenceWords, setName } from "@/lib/schemas/bearing-words";

// The build record's bearing section: per point the halves chosen and where they went, the
// clearance predicted for them and the clearance measured once installed.

export async function bearingRecordLines(shopId: number, jobId: number): Promise<BearingRecordLine[]> {
  const view = await getBearingsView(shopId, jobId);
  const unit = view.job.unit;
  return view.points.flatMap((p) => {
    const upper = view.shells.find((s) => s.id === p.upperShellId);
    const lower = view.shells.find((s) => s.id === p.lowerShellId);
    if (!upper || !lower) return [];
    const diff = p.measured && p.predicted ? differenceWords(p.measured.value, p.predicted.value, unit) : "-";
    return [
      {
        point: p.label + (p.byHand ? " (chosen by hand)" : ""),
        upper: `${setName(upper)}, ${halfPlaceWords(p.role, "upper")}`,
        lower: `${setName(lower)}, ${halfPlaceWords(p.role, "lower")}`,
        predicted: clearanceWords(p.predicted, unit),
        measured: p.measured ? lengthWords(p.measured.value, unit) : "not measured",
        difference: diff,
      },
    ];
  });
}
