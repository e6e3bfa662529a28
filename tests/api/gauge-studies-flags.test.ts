// A gauge's latest study in the verdict's notes and flags: a reading whose gauge's study fails for
// its tolerance T (here on resolution: a 0.0001 in step is 10 % of T = 0.0010 in, past the
// common-practice 5 %) is flagged like a gauge past calibration, and so is one taken after the study
// fell due. Saving the study judges the open job's earlier readings again. Figures are invented.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as SAVE } from "@/app/api/gauges/[gaugeId]/studies/route";
import { POST as SYNC } from "@/app/api/sync/route";
import { Flag, Instrument, Reading } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
const steps = [0, 1, -1, 0, 1, 0, 0, -1, 1, 0, 0, -1, 0, 1, 0, -1, 0, 1, 0, -1, 1, 0, 0, 1, 0];

async function study(gaugeId: number, step: number, performedOn: string) {
  const readings = steps.map((k) => Number((4.03 + k * step).toFixed(6)));
  const req = await asUser(s.users.lead, "POST", `/api/gauges/${gaugeId}/studies`, {
    kind: "type1",
    performedOn,
    readings,
    reference: { value: 4.03, expandedU: 0.00005 },
    confirmedFlagsOpened: null,
  });
  const res = await call(SAVE as never, req, { gaugeId: String(gaugeId) });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}

async function read(stationId: string, value: number, instrumentId: number) {
  const id = randomUUID();
  const reading = {
    id,
    jobId: s.job.id,
    stationId,
    value,
    unit: "in",
    instrumentId,
    takenAt: new Date().toISOString(),
  };
  const res = await call(
    SYNC as never,
    await asUser(s.users.machinist, "POST", "/api/sync", { deviceId: "bench-3", readings: [reading] }),
  );
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return { reading: (await Reading.findByPk(id))!, flag: await Flag.findOne({ where: { readingId: id } }) };
}

beforeAll(async () => {
  s = await createShop();
});

describe("a gauge's study in the verdict", () => {
  it("saving a study that fails for the bore flags the open job's earlier bore reading, saying why", async () => {
    const before = await read("bore/1/mid/A", 4.0301, s.instrument.id);
    expect(before.flag).toBeNull();
    const saved = await study(s.instrument.id, 0.0001, "2026-11-20");
    expect(saved.study.passed).toBe(false);
    expect(saved.jobs[0]).toMatchObject({ jobId: s.job.id, consequences: { flagsOpened: 1 } });
    await before.reading.reload();
    expect(before.reading.verdictNote).toBe("gauge_study_failed");
    const flag = await Flag.findOne({ where: { readingId: before.reading.id, state: "open" } });
    expect(flag?.reason).toBe("gauge_study_failed");
  });

  it("a new reading with that gauge is flagged at upload too", async () => {
    const { reading, flag } = await read("bore/2/mid/A", 4.0301, s.instrument.id);
    expect(reading.verdictNote).toBe("gauge_study_failed");
    expect(flag?.reason).toBe("gauge_study_failed");
  });

  it("a gauge whose passing study fell due before the reading is flagged for that", async () => {
    const fine = await Instrument.create({
      shopId: s.shop.id,
      kind: "bore_gauge_digital",
      label: "Fine bore gauge",
      serial: `FBG-${randomUUID().slice(0, 6)}`,
      unit: "in",
      resolution: 0.00001,
      expandedU: 0.00002,
      rangeMin: 2,
      rangeMax: 6,
      calibratedOn: "2026-06-01",
      calibrationDue: "2027-06-01",
    });
    // Steps of 0.00001 in: s ≈ 0.0000071 in, Cg = 0.2·0.001/(6·s) ≈ 4.7, well past 1.33.
    const saved = await study(fine.id, 0.00001, "2025-06-01");
    expect(saved.study).toMatchObject({ passed: true, dueOn: "2026-06-01" });
    const { reading, flag } = await read("bore/3/mid/A", 4.0301, fine.id);
    expect(reading.verdictNote).toBe("gauge_study_due");
    expect(flag?.reason).toBe("gauge_study_due");
  });
});
