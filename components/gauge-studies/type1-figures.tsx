import { StatusTag } from "@/components/admin/status-tag";
import { withUnit } from "@/components/flags/format";
import { characteristicWords } from "@/lib/domain";
import type { Type1Result } from "@/lib/domain/gauge-studies/types";

// A repeatability study's figures as the core worked them out: mean, s, bias and whether it is
// significant (Student's t), then Cg, Cgk and the step as % of T for each characteristic with its verdict
// in words and shape, and the reasons of a fail.
const index = (x: number | null) => (x === null ? "—" : x.toFixed(2));
const pFigure = (p: number | null) => (p === null ? "—" : p < 0.0001 ? "< 0.0001" : p.toFixed(4));

export function Type1Figures({ result, unit }: { result: Type1Result; unit: string }) {
  const notes = result.notes;
  return (
    <div className="flex flex-col gap-3" data-testid="type1-figures">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr_auto_1fr]">
        <dt className="text-muted">Readings</dt>
        <dd className="tabular">{result.n}</dd>
        <dt className="text-muted">Mean</dt>
        <dd className="tabular">{withUnit(result.mean, unit)}</dd>
        <dt className="text-muted">Standard deviation s</dt>
        <dd className="tabular">{withUnit(result.sd, unit)}</dd>
        <dt className="text-muted">Bias (mean − reference)</dt>
        <dd className="tabular">{withUnit(result.bias, unit)}</dd>
        <dt className="text-muted">t of the bias, p</dt>
        <dd className="tabular">
          {result.t === null ? "—" : result.t.toFixed(2)}, p = {pFigure(result.pValue)}
        </dd>
        <dt className="text-muted">Bias significant at 5 %</dt>
        <dd className="font-semibold">{result.biasSignificant ? "Yes: the gauge reads off the reference" : "No"}</dd>
      </dl>
      {notes.length > 0 && (
        <ul className="list-disc pl-5 text-sm">
          {notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
      <table className="w-full text-sm">
        <caption className="sr-only">Capability for each characteristic</caption>
        <thead className="text-xs text-muted">
          <tr>
            <th className="p-1 text-left font-semibold">Characteristic (T)</th>
            <th className="p-1 text-right font-semibold">Cg</th>
            <th className="p-1 text-right font-semibold">Cgk</th>
            <th className="p-1 text-right font-semibold">Step % of T</th>
            <th className="p-1 text-left font-semibold">Result</th>
          </tr>
        </thead>
        <tbody>
          {result.perCharacteristic.map((c) => (
            <tr
              key={c.characteristic}
              className="border-t border-rule align-top"
              data-characteristic={c.characteristic}
            >
              <th scope="row" className="p-1 text-left font-medium">
                {characteristicWords(c.characteristic)}
                <span className="block text-xs font-normal text-muted">T = {withUnit(c.tolerance, unit)}</span>
              </th>
              <td className="p-1 text-right tabular">{index(c.cg)}</td>
              <td className="p-1 text-right tabular">{index(c.cgk)}</td>
              <td className="p-1 text-right tabular">{c.resolutionPct.toFixed(1)} %</td>
              <td className="p-1">
                <StatusTag tone={c.pass ? "good" : "bad"}>{c.pass ? "Capable" : "Not capable"}</StatusTag>
                {c.reasons.length > 0 && (
                  <ul className="mt-1 flex flex-col gap-0.5 text-xs">
                    {c.reasons.map((r) => (
                      <li key={r}>{r}</li>
                    ))}
                  </ul>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {result.perCharacteristic.length === 0 && (
        <p className="text-sm text-muted">No characteristic with a tolerance was judged.</p>
      )}
    </div>
  );
}
