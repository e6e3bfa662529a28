// Gauges in the verdicts: a reading taken with a gauge past its calibration due date is flagged
// gauge_past_due, and the gauge's U (k = 2) feeds the marginal band (ISO 14253-1:2017 guard band,
// see lib/domain/verdict.ts). The readings travel the real way: POST /api/sync as the machinist.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as REGISTER } from "@/app/api/instruments/route";
import { POST as SYNC } from "@/app/api/sync/route";
import { Flag, Reading } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

async function register(over: Record<string, unknown>): Promise<number> {
  const body = {
    kind: "bore_gauge_digital",
    label: "Bore gauge",
    serial: `BG-${randomUUID().slice(0, 8)}`,
    unit: "in",
    resolution: 0.0001,
    expandedU: 0.0001,
    // 2–6 in, 50–155 mm: a bore gauge's usual span (common practice); 155 mm ≈ 6.1 in.
    ...(over.unit === "mm" ? { rangeMin: 50, rangeMax: 155 } : { rangeMin: 2, rangeMax: 6 }),
    calibratedOn: day(-200),
    calibrationDue: day(165),
    ...over,
  };
  const res = await call(REGISTER as never, await asUser(s.users.admin, "POST", "/api/instruments", body));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.instrument.id;
}

async function read(stationId: string, value: number, instrumentId: number) {
  const id = randomUUID();
  const res = await call(
    SYNC as never,
    await asUser(s.users.machinist, "POST", "/api/sync", {
      deviceId: "bench-2",
      readings: [
        { id, jobId: s.job.id, stationId, value, unit: "in", instrumentId, takenAt: new Date().toISOString() },
      ],
    }),
  );
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return { reading: (await Reading.findByPk(id))!, flag: await Flag.findOne({ where: { readingId: id } }) };
}

beforeAll(async () => {
  s = await createShop();
});

describe("gauge past its calibration due date", () => {
  it("a gauge the admin registers as past due flags a new in-spec reading taken with it", async () => {
    const old = await register({ calibratedOn: day(-400), calibrationDue: day(-1) });
    const { reading, flag } = await read("bore/1/mid/A", 4.03, old);
    expect(reading).toMatchObject({ verdict: "in_spec", verdictNote: "gauge_past_due" });
    expect(flag).toMatchObject({ reason: "gauge_past_due", verdict: "in_spec", state: "open" });
  });

  it("a gauge due today is still in calibration: no flag", async () => {
    const dueToday = await register({ calibrationDue: day(0) });
    const { reading, flag } = await read("bore/2/mid/A", 4.03, dueToday);
    expect(reading.verdictNote).toBeNull();
    expect(flag).toBeNull();
  });

  it("a later recalibration of the gauge does not clear a reading taken while it was past due", async () => {
    const { Instrument } = await import("@/models");
    const old = await register({ calibratedOn: day(-400), calibrationDue: day(-3) });
    const { reading, flag } = await read("bore/4/mid/A", 4.03, old);
    expect(flag).toMatchObject({ reason: "gauge_past_due", state: "open" });
    await Instrument.update({ calibratedOn: day(0), calibrationDue: day(365) }, { where: { id: old } });
    await read("bore/4/mid/B", 4.03, old); // any later sync on the job reconciles it again
    await reading.reload();
    expect(reading.verdictNote).toBe("gauge_past_due");
    expect((await Flag.findByPk(flag!.id))?.state).toBe("open");
  });

  it("out of spec wins over past due as the reason", async () => {
    const old = await register({ calibratedOn: day(-400), calibrationDue: day(-30) });
    const { flag } = await read("bore/3/mid/A", 4.04, old);
    expect(flag?.reason).toBe("out_of_spec");
  });
});

describe("the gauge's U feeds the marginal band", () => {
  // Limits 4.0295–4.0305 in. The guard band is the gauge's U at k = 2 from its budget: certificate
  // U/k and resolution δ/√12 in quadrature (JCGM 100:2008 eq. (10), F.2.2.1), U = 2·uc.
  it("U = 0.0001 in, step 0.0001 in → U = 0.000115 in: 4.03045 is within U of the maximum, flagged", async () => {
    // 2·√(0.00005² + (0.0001/√12)²) = 0.0001155; 4.0305 − 0.0001155 = 4.0303845 < 4.03045 → marginal
    const g = await register({ expandedU: 0.0001 });
    const { reading, flag } = await read("bore/4/top/A", 4.03045, g);
    expect(reading.verdict).toBe("marginal");
    expect(flag?.reason).toBe("marginal");
  });

  it("U = 0 on the certificate still leaves the step's δ/√12: U = 0.0000577 in", async () => {
    // 2·0.0001/√12 = 0.0000577; 4.0305 − 0.0000577 = 4.0304423: 4.03045 is above it, 4.0304 below
    const g = await register({ expandedU: 0 });
    expect((await read("bore/5/top/A", 4.03045, g)).reading.verdict).toBe("marginal");
    const { reading, flag } = await read("bore/5/mid/A", 4.0304, g);
    expect(reading.verdict).toBe("in_spec");
    expect(flag).toBeNull();
  });

  it("a metric gauge's U is converted: 0.0025658 mm = 0.000101 in (25.4 mm per in, NIST SP 811 B.8)", async () => {
    // 2·√(0.00125² + (0.001/√12)²) = 0.0025658 mm; 4.0305 − 0.000101 = 4.030399: 4.0304 is above it,
    // 4.0303 below.
    const g = await register({ unit: "mm", resolution: 0.001, expandedU: 0.0025 });
    expect((await read("bore/6/top/A", 4.0304, g)).reading.verdict).toBe("marginal");
    expect((await read("bore/7/top/A", 4.0303, g)).reading.verdict).toBe("in_spec");
  });
});
