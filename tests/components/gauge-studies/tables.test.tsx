// @vitest-environment jsdom
import { cleanup, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, it } from "vitest";
import { AnovaTable } from "@/components/gauge-studies/anova-table";
import { BudgetTable, uncertaintyText } from "@/components/gauge-studies/budget-table";
import { Type1Figures } from "@/components/gauge-studies/type1-figures";
import { gaugeBudget } from "@/lib/domain";
import type { GaugeBudget, GrrResult, Type1Result } from "@/lib/domain/gauge-studies/types";

afterEach(cleanup);

// JCGM 100, 5.1.2 (root sum of squares) and 4.3.7 (a step δ read as a rectangular spread of width δ:
// u = δ/√12), worked by hand for invented demo figures: certificate U = 0.0002 in at k = 2 gives 0.0001 in;
// s = 0.00012 in; δ = 0.0001 in gives 0.0000289 in; uc = √(1e-8 + 1.44e-8 + 8.33e-10) = 0.000159 in.
const uRes = 0.0001 / Math.sqrt(12);
const uc = Math.sqrt(0.0001 ** 2 + 0.00012 ** 2 + uRes ** 2);
const budget: GaugeBudget = {
  lines: [
    { source: "certificate", standardU: 0.0001 },
    { source: "repeatability", standardU: 0.00012 },
    { source: "resolution", standardU: uRes },
  ],
  uc,
  U: 2 * uc,
};

describe("BudgetTable", () => {
  it("shows each line, uc and U to two significant digits with each line's share of uc²", () => {
    render(
      <BudgetTable
        budget={budget}
        unit="in"
        certificate={{ expandedU: 0.0002, coverageK: 2 }}
        resolution={0.0001}
        study={{ kind: "type1", performedOn: "2026-11-20", repeatSd: 0.00012 }}
      />,
    );
    const table = screen.getByTestId("gauge-budget");
    const line = (k: string) => table.querySelector(`[data-line="${k}"]`)?.textContent ?? "";
    expect(line("certificate")).toMatch(/U = 0\.0002 in at k = 2.*0\.0001 in.*40 %/);
    expect(line("repeatability")).toMatch(/study of 2026-11-20.*0\.00012 in.*57 %/);
    expect(line("resolution")).toMatch(/√12.*0\.000029 in.*3 %/);
    expect(line("uc")).toMatch(/0\.00016 in/);
    expect(line("U")).toMatch(/0\.00032 in/);
  });

  it("agrees with the core's budget for the same gauge (the hand-worked figures above)", () => {
    const core = gaugeBudget({ expandedU: 0.0002, coverageK: 2, resolution: 0.0001, study: { repeatSd: 0.00012 } });
    expect(core.uc).toBeCloseTo(uc, 12);
    expect(core.lines.map((l) => l.standardU)).toEqual(budget.lines.map((l) => expect.closeTo(l.standardU, 12)));
  });

  it("says the certificate stands alone when the gauge has no study", () => {
    const alone: GaugeBudget = { lines: [{ source: "certificate", standardU: 0.001 }], uc: 0.001, U: 0.002 };
    render(<BudgetTable budget={alone} unit="mm" certificate={{ expandedU: 0.002, coverageK: 2 }} resolution={0} />);
    expect(screen.getByText(/no study yet/)).toBeTruthy();
    expect(uncertaintyText(0.002, "mm")).toBe("0.002 mm");
  });
});

// A made-up R&R result (demo figures): the table shows the core's figures, it does not work them out.
const grr: GrrResult = {
  appraisers: 3,
  parts: 10,
  trials: 2,
  anova: [
    { source: "part", df: 9, ss: 0.000125, ms: 0.0000139, f: 41.2, p: 0.00000001 },
    { source: "appraiser", df: 2, ss: 0.0000021, ms: 0.00000105, f: 3.1, p: 0.07 },
    { source: "repeatability", df: 48, ss: 0.0000162, ms: 0.000000338, f: null, p: null },
    { source: "total", df: 59, ss: 0.000143, ms: 0, f: null, p: null },
  ],
  interactionPooled: true,
  sd: {
    repeatability: 0.00058,
    reproducibility: 0.00014,
    appraiser: 0.00014,
    interaction: 0,
    grr: 0.0006,
    part: 0.0015,
    total: 0.0016,
  },
  pctStudyVariation: 37.5,
  pctTolerance: 18,
  ndc: 3,
};

describe("AnovaTable", () => {
  it("lists the sources with df, F and p, the spread by source and %GRR with ndc", () => {
    render(<AnovaTable result={grr} unit="mm" />);
    const box = screen.getByTestId("grr-anova");
    expect(box.textContent).toMatch(/pooled into repeatability/);
    const parts = within(box).getByRole("rowheader", { name: "Parts" }).closest("tr");
    expect(parts?.textContent).toMatch(/^Parts9.*41\.20< 0\.0001$/);
    const rr = within(box).getByRole("rowheader", { name: "Gauge R&R" }).closest("tr");
    // 0.0006 / 0.0016 of the standard deviation; its square, 0.140625, of the variance.
    expect(rr?.textContent).toBe("Gauge R&R0.0006 mm37.5 %14.1 %");
    expect(box.textContent).toMatch(/%GRR of the tolerance18\.0 %/);
    expect(box.textContent).toMatch(/ndc\)3/);
  });
});

describe("AnovaTable's shares", () => {
  it("gives gauge R&R and part to part shares of the variance that add to 100 %", () => {
    // A 3-4-5 right triangle: 0.0006² + 0.0008² = 0.001², as the total's variance is the sum of the sources'.
    const sd = { ...grr.sd, grr: 0.0006, part: 0.0008, total: 0.001 };
    render(<AnovaTable result={{ ...grr, sd }} unit="mm" />);
    const row = (name: string) => screen.getByRole("rowheader", { name }).closest("tr")?.textContent;
    expect(row("Gauge R&R")).toBe("Gauge R&R0.0006 mm60.0 %36.0 %");
    expect(row("Part to part")).toBe("Part to part0.0008 mm80.0 %64.0 %");
  });
});

const type1: Type1Result = {
  n: 25,
  mean: 1.00002,
  sd: 0.00011,
  bias: 0.00002,
  t: 0.91,
  pValue: 0.372,
  biasSignificant: false,
  notes: [],
  perCharacteristic: [
    {
      characteristic: "bore_diameter",
      tolerance: 0.0015,
      cg: 0.45,
      cgk: 0.39,
      resolutionPct: 6.7,
      resolutionOk: false,
      pass: false,
      reasons: ["Cg 0.45 is below 1.33."],
    },
    {
      characteristic: "main_bearing_bore",
      tolerance: 0.01,
      cg: 3.03,
      cgk: 2.97,
      resolutionPct: 1,
      resolutionOk: true,
      pass: true,
      reasons: [],
    },
  ],
};

describe("Type1Figures", () => {
  it("shows the run's figures and a verdict in words per characteristic", () => {
    render(<Type1Figures result={type1} unit="in" />);
    const box = screen.getByTestId("type1-figures");
    expect(box.textContent).toMatch(/Mean1\.00002 in/);
    expect(box.textContent).toMatch(/p = 0\.3720/);
    const bore = box.querySelector('[data-characteristic="bore_diameter"]')?.textContent;
    expect(bore).toMatch(/Cylinder bore diameterT = 0\.0015 in0\.450\.396\.7 %Not capableCg 0\.45 is below 1\.33\./);
    expect(box.querySelector('[data-characteristic="main_bearing_bore"]')?.textContent).toMatch(/Capable$/);
  });
});
