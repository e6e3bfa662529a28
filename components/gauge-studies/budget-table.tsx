import { withUnit } from "@/components/flags/format";
import { unitWords } from "@/lib/domain";
import type { BudgetLine, GaugeBudget, GaugeStudySummary } from "@/lib/domain/gauge-studies/types";

// A gauge's uncertainty budget line by line, as the core combined it (JCGM 100): each standard
// uncertainty, where it came from, and its share of uc² (the lines add in quadrature, so shares of
// the square add up to 100 %); then uc and the expanded U (k = 2) every verdict's guard band uses.
/** An uncertainty to two significant digits, as JCGM 100 (7.2.6) says usually suffices. */
export function uncertaintyText(x: number, unit: string): string {
  return `${x === 0 ? "0" : String(Number(x.toPrecision(2)))} ${unitWords(unit)}`;
}

export interface BudgetTableProps {
  budget: GaugeBudget;
  unit: string;
  certificate: { expandedU: number; coverageK: number };
  resolution: number;
  /** The latest study whose s is the repeatability line; none: the line is absent. */
  study?: Pick<GaugeStudySummary, "kind" | "performedOn" | "repeatSd"> | null;
}

function whence(line: BudgetLine, p: BudgetTableProps): string {
  const u = (x: number) => withUnit(x, p.unit);
  switch (line.source) {
    case "certificate":
      return `Certificate: U = ${u(p.certificate.expandedU)} at k = ${p.certificate.coverageK}, divided by k`;
    case "repeatability":
      return p.study
        ? `Repeatability: s = ${u(p.study.repeatSd)} from the ${p.study.kind === "grr" ? "R&R" : "repeatability"} ` +
            `study of ${p.study.performedOn} (one reading, so s itself)`
        : "Repeatability";
    case "resolution":
      return `Resolution: a step of ${u(p.resolution)}, divided by √12`;
  }
}

export function BudgetTable(props: BudgetTableProps) {
  const { budget, unit } = props;
  const ucSquared = budget.uc ** 2;
  const share = (x: number) => (ucSquared > 0 ? `${((100 * x ** 2) / ucSquared).toFixed(0)} %` : "—");
  return (
    <table className="w-full text-sm" data-testid="gauge-budget">
      <caption className="pb-1 text-left font-semibold">Uncertainty budget</caption>
      <thead className="text-xs text-muted">
        <tr>
          <th className="p-1 text-left font-semibold">Source</th>
          <th className="p-1 text-right font-semibold">Standard uncertainty</th>
          <th className="p-1 text-right font-semibold">Share of uc²</th>
        </tr>
      </thead>
      <tbody className="tabular">
        {budget.lines.map((line) => (
          <tr key={line.source} className="border-t border-rule" data-line={line.source}>
            <th scope="row" className="p-1 text-left font-normal">
              {whence(line, props)}
            </th>
            <td className="p-1 text-right">{uncertaintyText(line.standardU, unit)}</td>
            <td className="p-1 text-right">{share(line.standardU)}</td>
          </tr>
        ))}
        {!props.study && (
          <tr className="border-t border-rule text-muted">
            <th scope="row" className="p-1 text-left font-normal">
              Repeatability: no study yet, so the certificate stands alone for it
            </th>
            <td className="p-1 text-right">—</td>
            <td className="p-1 text-right">—</td>
          </tr>
        )}
        <tr className="border-t-2 border-rule" data-line="uc">
          <th scope="row" className="p-1 text-left font-semibold">
            Combined standard uncertainty uc (root sum of squares)
          </th>
          <td className="p-1 text-right font-semibold">{uncertaintyText(budget.uc, unit)}</td>
          <td className="p-1 text-right">100 %</td>
        </tr>
        <tr className="border-t border-rule" data-line="U">
          <th scope="row" className="p-1 text-left font-semibold">
            Expanded uncertainty U = 2 · uc, the guard band of every verdict
          </th>
          <td className="p-1 text-right font-semibold">{uncertaintyText(budget.U, unit)}</td>
          <td className="p-1 text-right text-muted">k = 2</td>
        </tr>
      </tbody>
    </table>
  );
}
