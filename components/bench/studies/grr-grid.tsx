import type { GrrDraft, GrrDesign } from "@/lib/offline/study-draft-shape";
import { nextGrrCell } from "@/lib/offline/study-drafts";
import { gaugeFigure } from "./figures";

// Where an R&R study stands: a row per person, a column per part, each trial's figure in its cell,
// the cell the next figure goes to outlined, so the order of entry is always in sight.
const NEXT_CELL = "outline outline-4 -outline-offset-4 outline-brass";

export function GrrGrid({ draft, design }: { draft: GrrDraft; design: GrrDesign }) {
  const next = nextGrrCell(draft);
  const at = (appraiser: number, part: number) =>
    draft.measurements.filter((m) => m.appraiser === appraiser && m.part === part).sort((a, b) => a.trial - b.trial);
  const parts = Array.from({ length: design.parts }, (_, i) => i + 1);
  return (
    <table
      className="w-full table-fixed text-center text-xs sm:text-sm"
      data-testid="grr-grid"
      aria-label="Figures entered"
    >
      <thead>
        <tr>
          <th className="w-36 text-left font-semibold text-muted lg:w-24">Part</th>
          {parts.map((p) => (
            <th key={p} className="font-semibold text-muted">
              {p}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {design.appraisers.map((name, i) => (
          <tr key={name} className="border-t border-rule">
            <th scope="row" className="truncate py-1 text-left font-semibold" title={name}>
              {name}
            </th>
            {parts.map((p) => {
              const here = next?.appraiser === i + 1 && next.part === p;
              return (
                <td
                  key={p}
                  className={`py-1 font-mono tabular ${here ? NEXT_CELL : ""}`}
                  aria-current={here ? "step" : undefined}
                >
                  {at(i + 1, p).map((m) => (
                    <span key={m.trial} className="block leading-tight">
                      {gaugeFigure(m.value, draft.gauge.resolution)}
                    </span>
                  ))}
                </td>
              );
            })}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
