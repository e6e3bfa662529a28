import type { GrrResult } from "@/lib/domain/gauge-studies/types";

// An R&R study's result: the ANOVA table, the parts of the variation as standard deviations,
// %GRR against the study's variation and the tolerance, and the number of distinct categories.
const SOURCE_WORDS: Record<GrrResult["anova"][number]["source"], string> = {
  part: "Parts",
  appraiser: "People",
  interaction: "People × parts",
  repeatability: "Repeatability",
  total: "Total",
};
const sig = (x: number) => (x === 0 ? "0" : String(Number(x.toPrecision(4))));
const maybe = (x: number | null, digits: number) => (x === null ? "—" : x.toFixed(digits));

export function GrrFigures({ result, unit }: { result: GrrResult; unit: string }) {
  const { sd } = result;
  const parts: [string, number][] = [
    ["Repeatability (gauge)", sd.repeatability],
    ["Reproducibility (people)", sd.reproducibility],
    ["R&R together", sd.grr],
    ["Parts", sd.part],
    ["Total", sd.total],
  ];
  return (
    <div className="flex flex-col gap-3" data-testid="grr-result">
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1">
        <dt className="text-muted">%GRR of study variation</dt>
        <dd className="font-mono text-xl font-semibold tabular">{result.pctStudyVariation.toFixed(1)} %</dd>
        <dt className="text-muted">%GRR of tolerance</dt>
        <dd className="font-mono text-xl font-semibold tabular">
          {result.pctTolerance === null ? "no tolerance given" : `${result.pctTolerance.toFixed(1)} %`}
        </dd>
        <dt className="text-muted">Distinct categories (ndc)</dt>
        <dd className="font-mono text-xl font-semibold tabular">{result.ndc}</dd>
      </dl>
      <table className="w-full text-right text-sm" aria-label="Analysis of variance">
        <thead className="text-muted">
          <tr>
            <th className="py-1 text-left font-semibold">Source</th>
            <th className="py-1 font-semibold">df</th>
            <th className="py-1 font-semibold">SS</th>
            <th className="py-1 font-semibold">MS</th>
            <th className="py-1 font-semibold">F</th>
            <th className="py-1 font-semibold">p</th>
          </tr>
        </thead>
        <tbody className="font-mono tabular">
          {result.anova.map((r) => (
            <tr key={r.source} className="border-t border-rule">
              <th scope="row" className="py-1 text-left font-sans font-semibold">
                {SOURCE_WORDS[r.source]}
              </th>
              <td className="py-1">{r.df}</td>
              <td className="py-1">{sig(r.ss)}</td>
              <td className="py-1">{r.source === "total" ? "" : sig(r.ms)}</td>
              <td className="py-1">{maybe(r.f, 2)}</td>
              <td className="py-1">{maybe(r.p, 3)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {result.interactionPooled && (
        <p className="text-sm text-muted">
          People × parts was not significant (p above 0.25) and is counted with repeatability (common practice).
        </p>
      )}
      <table className="w-full text-right text-sm" aria-label="Standard deviations">
        <tbody className="font-mono tabular">
          {parts.map(([label, value]) => (
            <tr key={label} className="border-t border-rule">
              <th scope="row" className="py-1 text-left font-sans font-semibold">
                {label}
              </th>
              <td className="py-1">
                {sig(value)} {unit}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
