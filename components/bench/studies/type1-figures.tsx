import { characteristicWords } from "@/lib/domain";
import type { Type1Result } from "@/lib/domain/gauge-studies/types";
import { gaugeFigure } from "./figures";
import { StudyPass } from "./study-pass";

const index = (x: number | null) => (x === null ? "—" : x.toFixed(2));

/** Mean, s, bias and its t-test, then Cg, Cgk and resolution per characteristic with pass or fail. */
export function Type1Figures({ result, resolution, unit }: { result: Type1Result; resolution: number; unit: string }) {
  const fine = (x: number) => `${gaugeFigure(x, resolution, 2)} ${unit}`;
  return (
    <div className="flex flex-col gap-3" data-testid="type1-result">
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 sm:grid-cols-4">
        <dt className="text-muted">Readings</dt>
        <dd className="font-mono tabular">{result.n}</dd>
        <dt className="text-muted">Mean</dt>
        <dd className="font-mono tabular">{fine(result.mean)}</dd>
        <dt className="text-muted">Spread s</dt>
        <dd className="font-mono tabular" data-testid="study-sd">
          {fine(result.sd)}
        </dd>
        <dt className="text-muted">Bias</dt>
        <dd className="font-mono tabular">{fine(result.bias)}</dd>
        <dt className="text-muted">t (bias)</dt>
        <dd className="font-mono tabular">{result.t === null ? "—" : result.t.toFixed(2)}</dd>
        <dt className="text-muted">p</dt>
        <dd className="font-mono tabular">{result.pValue === null ? "—" : result.pValue.toFixed(3)}</dd>
      </dl>
      <p className={result.biasSignificant ? "font-semibold text-fail" : "text-muted"}>
        {result.biasSignificant
          ? "The bias is significant (5 % level): the gauge reads the reference off; have it checked or set again."
          : "No significant bias at the 5 % level."}
      </p>
      {result.notes.map((n) => (
        <p key={n} className="text-sm">
          {n}
        </p>
      ))}
      {result.perCharacteristic.length > 0 && (
        <table className="w-full text-left" data-testid="study-characteristics">
          <thead className="text-sm text-muted">
            <tr>
              <th className="py-1 pr-2 font-semibold">Used for</th>
              <th className="py-1 pr-2 font-semibold">T ({unit})</th>
              <th className="py-1 pr-2 font-semibold">Cg</th>
              <th className="py-1 pr-2 font-semibold">Cgk</th>
              <th className="py-1 pr-2 font-semibold">Resolution</th>
              <th className="py-1 font-semibold">Result</th>
            </tr>
          </thead>
          <tbody>
            {result.perCharacteristic.map((c) => (
              <tr key={`${c.characteristic}-${c.tolerance}`} className="border-t border-rule align-top">
                <td className="py-2 pr-2">{characteristicWords(c.characteristic)}</td>
                <td className="py-2 pr-2 font-mono tabular">{gaugeFigure(c.tolerance, resolution)}</td>
                <td className="py-2 pr-2 font-mono tabular">{index(c.cg)}</td>
                <td className="py-2 pr-2 font-mono tabular">{index(c.cgk)}</td>
                <td className="py-2 pr-2 font-mono tabular">{c.resolutionPct.toFixed(1)} % of T</td>
                <td className="py-2">
                  <StudyPass pass={c.pass} />
                  {c.reasons.map((r) => (
                    <p key={r} className="text-sm">
                      {r}
                    </p>
                  ))}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
