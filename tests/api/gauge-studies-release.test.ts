// The release checklist and the build record name each gauge's latest study: a study past its due
// date on the day of a reading, or one that fails for the reading's tolerance, blocks like an
// overdue calibration. Studies and figures here are invented test fixtures; the indices follow the
// issue's formulas (Cg = 0.2·T/(6·s), pass at 1.33, common practice).
import { Op } from "sequelize";
import { describe, expect, it } from "vitest";
import { DEFAULT_STUDY_THRESHOLDS } from "@/lib/domain";
import { getSequelize } from "@/lib/server/core/db";
import { GET as latestRoute } from "@/app/api/gauge-studies/latest/route";
import { loadBuildRecord } from "@/lib/server/record/data";
import { renderRecordPdf } from "@/lib/server/record/pdf";
import { releaseChecklist } from "@/lib/server/release/checklist";
import { GaugeStudy, Instrument, Reading } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { pdfText } from "../support/pdf-text";
import { asUser, call } from "../support/requests";
import { completeJob } from "./release-fixtures";

/** A filled-in job whose 48 bore readings were judged against 4.0295–4.0305 in (T = 0.001 in). */
async function jobWithBores(): Promise<TestShop> {
  const s = await createShop();
  await completeJob(s);
  await Reading.update(
    { limitMin: 4.0295, limitMax: 4.0305 },
    { where: { jobId: s.job.id, stationId: { [Op.like]: "bore/%" } } },
  );
  return s;
}

async function addStudy(s: TestShop, over: { performedOn?: string; dueOn?: string; repeatSd: number }) {
  getSequelize();
  await GaugeStudy.create({
    shopId: s.shop.id,
    instrumentId: s.gauges.bore,
    kind: "type1",
    performedBy: s.users.lead.id,
    performedOn: over.performedOn ?? "2026-06-01",
    dueOn: over.dueOn ?? "2027-06-01",
    unit: "in",
    resolution: 0.0001,
    referenceValue: 4.03,
    referenceU: 0.00005,
    referenceK: 2,
    measurements: [],
    mean: 4.03,
    repeatSd: over.repeatSd,
    bias: 0,
    passed: true,
    thresholds: { ...DEFAULT_STUDY_THRESHOLDS },
    result: {},
  });
}

const gaugesCheck = async (s: TestShop) =>
  (await releaseChecklist(s.shop.id, s.job.id)).checks.find((c) => c.id === "gauges")!;

describe("release checklist: gauge studies", () => {
  it("blocks on a study that fails for the job's tolerance, linking to the gauge's page", async () => {
    const s = await jobWithBores();
    // s = 0.0001 in on T = 0.001 in: Cg = 0.0002/0.0006 = 0.33, below 1.33.
    await addStudy(s, { repeatSd: 0.0001 });
    const check = await gaugesCheck(s);
    expect(check.ok).toBe(false);
    const item = check.items.find((i) => i.key === `gauges:study-failed:${s.gauges.bore}`)!;
    expect(item.text).toMatch(
      new RegExp(
        /^Kit bore gauge \(serial KIT-BORE-[\w-]+\) fails its repeatability study of 2026-06-01 /.source +
          /for a tolerance of 0\.001 in: Cg 0\.33 is below 1\.33/.source,
      ),
    );
    expect(item.text).toMatch(/on 48 current readings: Cylinder \d/);
    expect(item.text).toMatch(/Measure again with a gauge capable for this tolerance/);
    expect(item.links[0].href).toBe(`/admin/gauges/${s.gauges.bore}`);
    expect(check.summary).toBe("186 of 234 readings have a suitable gauge in calibration; 48 do not");
  });

  it("blocks on a study past its due date on the day of the reading, whatever the tolerance", async () => {
    const s = await jobWithBores();
    await addStudy(s, { performedOn: "2025-11-01", dueOn: "2026-11-01", repeatSd: 0.00001 });
    const check = await gaugesCheck(s);
    const item = check.items.find((i) => i.key === `gauges:study-overdue:${s.gauges.bore}`)!;
    // Every reading taken with the bore gauge, bores and installed bearing bores alike.
    const withGauge = await Reading.count({ where: { jobId: s.job.id, instrumentId: s.gauges.bore } });
    expect(withGauge).toBeGreaterThan(48);
    expect(item.text).toContain(
      `was past its repeatability study of 2025-11-01's due date (2026-11-01) on ${withGauge} current readings`,
    );
  });

  it("lets a capable, current study through and passes a gauge without a study", async () => {
    const s = await jobWithBores();
    getSequelize();
    // A finer gauge: step 0.00002 in is 2 % of T; s = 0.00001 in gives Cg = 0.0002/0.00006 = 3.33.
    await Instrument.update({ resolution: 0.00002 }, { where: { id: s.gauges.bore } });
    await addStudy(s, { repeatSd: 0.00001 });
    const check = await gaugesCheck(s);
    expect(check.items).toEqual([]);
    expect(check.ok).toBe(true);
  });
});

describe("build record: gauge studies", () => {
  it("prints each gauge's latest study with its date, spread, due date and whether it stood", async () => {
    const s = await jobWithBores();
    await addStudy(s, { repeatSd: 0.0001 });
    const record = await loadBuildRecord(s.shop.id, s.job.id);
    const bore = record.gauges.find((g) => g.label === "Kit bore gauge")!;
    expect(bore.study).toMatch(
      /^Repeatability study of 2026-06-01 \(s = 0\.0001 in\), due 2027-06-01\. The gauge fails its repeatability/,
    );
    expect(bore.studyProblem).toBe(true);
    const mic = record.gauges.find((g) => g.label === "Kit micrometer")!;
    expect(mic).toMatchObject({ study: "No study on file: the certificate's U alone", studyProblem: false });
    const { text } = await pdfText(await renderRecordPdf(record));
    expect(text).toContain("Latest study");
    expect(text).toContain("Repeatability study of 2026-06-01");
  });
});

describe("GET /api/gauge-studies/latest", () => {
  it("gives each gauge's latest study of the actor's shop to the admin, lead and inspector only", async () => {
    const s = await jobWithBores();
    await addStudy(s, { performedOn: "2025-11-01", dueOn: "2026-11-01", repeatSd: 0.0002 });
    await addStudy(s, { performedOn: "2026-06-01", dueOn: "2027-06-01", repeatSd: 0.0001 });
    const other = await createShop();
    for (const who of [s.users.admin, s.users.lead, s.users.inspector]) {
      const res = await call(latestRoute, await asUser(who, "GET", "/api/gauge-studies/latest"));
      expect(res.status).toBe(200);
      expect(res.body.studies).toEqual([
        {
          instrumentId: s.gauges.bore,
          passed: true,
          summary: expect.objectContaining({ kind: "type1", performedOn: "2026-06-01", dueOn: "2027-06-01" }),
        },
      ]);
    }
    const theirs = await call(latestRoute, await asUser(other.users.admin, "GET", "/api/gauge-studies/latest"));
    expect(theirs.body.studies).toEqual([]);
    expect((await call(latestRoute, await asUser(s.users.machinist, "GET", "/api/gauge-studies/latest"))).status).toBe(
      403,
    );
    expect((await call(latestRoute, await asUser(null, "GET", "/api/gauge-studies/latest"))).status).toBe(401);
  });
});
