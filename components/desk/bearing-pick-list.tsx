import { halfPlaceWords } from "@/lib/domain";
import type { BearingsView, PointView } from "@/lib/schemas/bearings";
import { clearanceWords, setName } from "@/lib/schemas/bearing-words";

// The pick list the lead prints and takes to the shelf: for each point, which set each half comes
// from and where it goes. Printing shows this list alone (the rest of the page is print:hidden).

type Choice = Pick<PointView, "point" | "upperShellId" | "lowerShellId" | "predicted">;

export function BearingPickList({ view, choice }: { view: BearingsView; choice: Choice[] }) {
  const chosen = view.points
    .map((p) => ({ p, c: choice.find((c) => c.point === p.point) }))
    .filter(({ c }) => c?.upperShellId && c.lowerShellId);
  const set = (id: number | null | undefined) => view.shells.find((s) => s.id === id);
  return (
    <section aria-labelledby="pick-list-title" className="flex flex-col gap-2" data-print="pick-list">
      <h2 id="pick-list-title" className="text-xl font-semibold">
        Pick list · {view.job.code} {view.job.title}
      </h2>
      {!chosen.length ? (
        <p className="text-muted">Choose halves (run the selection or pick them) to get a pick list.</p>
      ) : (
        <table className="w-full border-collapse text-sm">
          <thead>
            <tr className="border-b-2 border-rule text-left">
              <th className="p-2">Point</th>
              <th className="p-2">Half</th>
              <th className="p-2">Set</th>
              <th className="p-2">Predicted clearance</th>
            </tr>
          </thead>
          <tbody>
            {chosen.flatMap(({ p, c }) =>
              (["upper", "lower"] as const).map((half) => {
                const s = set(half === "upper" ? c!.upperShellId : c!.lowerShellId);
                return (
                  <tr key={`${p.point}-${half}`} className="border-b border-rule print:break-inside-avoid">
                    {half === "upper" && (
                      <td rowSpan={2} className="p-2 align-top font-semibold">
                        {p.label}
                      </td>
                    )}
                    <td className="p-2">{halfPlaceWords(p.role, half)}</td>
                    <td className="p-2">{s ? `#${s.id} ${setName(s)}` : "—"}</td>
                    {half === "upper" && (
                      <td rowSpan={2} className="p-2 align-top font-mono tabular">
                        {clearanceWords(c!.predicted, view.job.unit)}
                      </td>
                    )}
                  </tr>
                );
              }),
            )}
          </tbody>
        </table>
      )}
      <p className="text-xs text-muted">
        Halves mix only within one maker&apos;s series and never more than one step apart (common practice). Measure
        each installed bore on the bench after torquing; the engine and bearing maker&apos;s figures govern.
      </p>
    </section>
  );
}
