import { withUnit } from "@/components/flags/format";
import type { AnovaRow, GrrComponents, GrrResult } from "@/lib/domain/gauge-studies/types";

// An R&R study as the core worked it out: the ANOVA table (sums of squares, mean squares, F and p),
// then the spread each source adds, as a standard deviation and as its share of the total's standard
// deviation and of its variance, %GRR and ndc. Only variances add up (the total's variance is the sum
// of the sources'), so only the variance column sums to 100 % over gauge R&R and part to part.
const SOURCE_WORDS: Record<AnovaRow["source"], string> = {
  part: "Parts",
  appraiser: "Appraisers",
  interaction: "Parts × appraisers",
  repeatability: "Repeatability (within)",
  total: "Total",
};

const COMPONENT_WORDS: [keyof GrrComponents, string][] = [
  ["repeatability", "Repeatability (the gauge)"],
  ["reproducibility", "Reproducibility (the people)"],
  ["appraiser", "  of which appraisers"],
  ["interaction", "  of which parts × appraisers"],
  ["grr", "Gauge R&R"],
  ["part", "Part to part"],
  ["total", "Total"],
];

/** Sums of squares run to the square of the unit: 4 significant digits, in plain or e-notation. */
const square = (x: number) => (x === 0 ? "0" : Math.abs(x) >= 1e-3 ? x.toPrecision(4) : x.toExponential(3));
const pFigure = (p: number | null) => (p === null ? "—" : p < 0.0001 ? "< 0.0001" : p.toFixed(4));

export function AnovaTable({ result, unit }: { result: GrrResult; unit: string }) {
  const { sd } = result;
  const share = (x: number) => (sd.total > 0 ? `${((100 * x) / sd.total).toFixed(1)} %` : "—");
  const varianceShare = (x: number) => (sd.total > 0 ? `${((100 * x * x) / (sd.total * sd.total)).toFixed(1)} %` : "—");
  return (
    <div className="flex flex-col gap-3" data-testid="grr-anova">
      <p className="text-sm">
        {result.appraisers} appraisers × {result.parts} parts × {result.trials} trials
        {result.interactionPooled
          ? ". The parts × appraisers interaction was not significant (p > 0.25), so it is pooled into repeatability."
          : "."}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full text-right text-sm tabular">
          <caption className="sr-only">Analysis of variance</caption>
          <thead className="text-xs text-muted">
            <tr>
              <th className="p-1 text-left font-semibold">Source</th>
              <th className="p-1 font-semibold">df</th>
              <th className="p-1 font-semibold">Sum of squares</th>
              <th className="p-1 font-semibold">Mean square</th>
              <th className="p-1 font-semibold">F</th>
              <th className="p-1 font-semibold">p</th>
            </tr>
          </thead>
          <tbody>
            {result.anova.map((row) => (
              <tr key={row.source} className="border-t border-rule">
                <th scope="row" className="p-1 text-left font-medium">
                  {SOURCE_WORDS[row.source]}
                </th>
                <td className="p-1">{row.df}</td>
                <td className="p-1">{square(row.ss)}</td>
                <td className="p-1">{row.source === "total" ? "" : square(row.ms)}</td>
                <td className="p-1">{row.f === null ? "—" : row.f.toFixed(2)}</td>
                <td className="p-1">{pFigure(row.p)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="overflow-x-auto">
        <table className="w-full text-right text-sm tabular">
          <caption className="sr-only">Spread by source</caption>
          <thead className="text-xs text-muted">
            <tr>
              <th className="p-1 text-left font-semibold">Spread from</th>
              <th className="p-1 font-semibold">Standard deviation</th>
              <th className="p-1 font-semibold">Of the total standard deviation</th>
              <th className="p-1 font-semibold">Of the total variance</th>
            </tr>
          </thead>
          <tbody>
            {COMPONENT_WORDS.map(([key, words]) => (
              <tr key={key} className={`border-t border-rule ${key === "grr" ? "font-semibold" : ""}`}>
                <th scope="row" className={`p-1 text-left font-medium ${words.startsWith(" ") ? "pl-5" : ""}`}>
                  {words.trim()}
                </th>
                <td className="p-1">{withUnit(sd[key], unit)}</td>
                <td className="p-1">{share(sd[key])}</td>
                <td className="p-1">{varianceShare(sd[key])}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-muted">
        Standard deviations do not add up, variances do: gauge R&R and part to part make 100 % of the total variance.
      </p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-muted">%GRR of the study variation</dt>
        <dd className="font-semibold tabular">{result.pctStudyVariation.toFixed(1)} %</dd>
        <dt className="text-muted">%GRR of the tolerance</dt>
        <dd className="font-semibold tabular">
          {result.pctTolerance === null ? "no tolerance given" : `${result.pctTolerance.toFixed(1)} %`}
        </dd>
        <dt className="text-muted">Distinct categories (ndc)</dt>
        <dd className="font-semibold tabular">{result.ndc}</dd>
      </dl>
      <p className="text-xs text-muted">
        An ndc below 5 means the gauge cannot tell the parts apart finely enough to control them (common practice).
      </p>
    </div>
  );
}
