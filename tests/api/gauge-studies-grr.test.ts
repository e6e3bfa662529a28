// R&R studies through the save route: the server runs the core's ANOVA on the measurements sent,
// keeps them with the appraisers' names, judges %GRR against the shop's mark, and refuses an
// unbalanced design with words. Figures are invented test data; the total sum of squares is
// cross-checked with simple-statistics (a reference library).
import { sampleVariance } from "simple-statistics";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as SAVE } from "@/app/api/gauges/[gaugeId]/studies/route";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
// 2 appraisers × 5 parts × 2 trials: parts 0.0010 in apart, appraiser 2 reads 0.0001 in high.
const MEASUREMENTS = [1, 2].flatMap((appraiser) =>
  [1, 2, 3, 4, 5].flatMap((part) =>
    [1, 2].map((trial) => ({
      appraiser,
      part,
      trial,
      value: Number((4.03 + part * 0.001 + (appraiser - 1) * 0.0001 + (trial === 2 ? 0.0001 : 0)).toFixed(4)),
    })),
  ),
);

async function save(body: Record<string, unknown>) {
  const req = await asUser(s.users.lead, "POST", `/api/gauges/${s.instrument.id}/studies`, {
    kind: "grr",
    appraisers: ["Ana", "Bo"],
    measurements: MEASUREMENTS,
    ...body,
  });
  return call(SAVE as never, req, { gaugeId: String(s.instrument.id) });
}

beforeAll(async () => {
  s = await createShop();
});

describe("R&R study", () => {
  it("is worked out by the core's ANOVA and kept with its appraisers", async () => {
    const res = await save({ tolerance: 0.01, performedOn: "2026-11-02" });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const { study } = res.body;
    expect(study).toMatchObject({ kind: "grr", appraisers: ["Ana", "Bo"], tolerance: 0.01, reference: null });
    expect(study.measurements).toHaveLength(20);
    const values = MEASUREMENTS.map((m) => m.value);
    const total = study.grr.anova.find((r: { source: string }) => r.source === "total");
    expect(total.df).toBe(19);
    expect(total.ss).toBeCloseTo(sampleVariance(values) * 19, 12);
    expect(study.summary.repeatSd).toBeCloseTo(study.grr.sd.repeatability, 8);
    expect(study.summary.grrSd).toBeCloseTo(study.grr.sd.grr, 8);
    // %GRR against T = 100 · 6 · σ_GRR / T (6σ, common practice), judged against the default 30 %.
    expect(study.grr.pctTolerance).toBeCloseTo((100 * 6 * study.grr.sd.grr) / 0.01, 8);
    expect(study.passed).toBe(study.grr.pctTolerance <= 30);
  });

  it("refuses an unbalanced study, saying which cell lacks a trial", async () => {
    const res = await save({ measurements: MEASUREMENTS.slice(1) });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.measurements.join(" ")).toMatch(/Appraiser 1, part 1 lacks trial 1/);
  });

  it("refuses readings of an appraiser nobody named", async () => {
    const res = await save({ appraisers: ["Ana"] });
    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body.error)).toMatch(/2 or 3 appraisers/);
  });
});
