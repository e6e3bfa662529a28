// Gauge studies through their routes: the server works out every figure with the core from the
// readings sent (never a client's result), judges them against the tolerances the gauge judged on
// open jobs, keeps the study, and answers per role and per shop. Figures of the readings are
// invented test data; the statistics are cross-checked with simple-statistics (a reference library).
import { randomUUID } from "node:crypto";
import { mean, sampleStandardDeviation } from "simple-statistics";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as LIST, POST as SAVE } from "@/app/api/gauges/[gaugeId]/studies/route";
import { POST as PREVIEW } from "@/app/api/gauges/[gaugeId]/studies/preview/route";
import { POST as SYNC } from "@/app/api/sync/route";
import { GET as PACK } from "@/app/api/bench/jobs/[jobId]/route";
import { AuditEvent, GaugeStudy } from "@/models";
import { latestStudies } from "@/lib/server/gauge-studies/repo";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
let other: TestShop;
const REFERENCE = { value: 4.03, expandedU: 0.00005, coverageK: 2 };
// 25 readings of a 4.0300 in setting ring in steps of the gauge's 0.0001 in (invented).
const STEPS = [0, 1, -1, 0, 1, 0, 0, -1, 1, 2, 0, -1, 0, 1, 0, -2, 0, 1, 0, -1, 1, 0, 0, 1, 0];
const READINGS = STEPS.map((k) => Number((4.03 + k * 0.0001).toFixed(4)));

const url = (id: number, tail = "") => `/api/gauges/${id}/studies${tail}`;
const body = (over: Record<string, unknown> = {}) => ({
  kind: "type1",
  readings: READINGS,
  reference: REFERENCE,
  ...over,
});

async function post(handler: typeof SAVE, who: keyof TestShop["users"], gaugeId: number, b: unknown, shop = s) {
  const tail = handler === PREVIEW ? "/preview" : "";
  const req = await asUser(shop.users[who], "POST", url(gaugeId, tail), b);
  return call(handler as never, req, { gaugeId: String(gaugeId) });
}

async function read(stationId: string, value: number) {
  const res = await call(
    SYNC as never,
    await asUser(s.users.machinist, "POST", "/api/sync", {
      deviceId: "bench-1",
      readings: [
        {
          id: randomUUID(),
          jobId: s.job.id,
          stationId,
          value,
          unit: "in",
          instrumentId: s.instrument.id,
          takenAt: new Date().toISOString(),
        },
      ],
    }),
  );
  expect(res.status, JSON.stringify(res.body)).toBe(200);
}

beforeAll(async () => {
  s = await createShop();
  other = await createShop();
  await read("bore/1/mid/A", 4.0302);
});

describe("preview", () => {
  it("works the study out with the core, judges it on the job's bore tolerance, and keeps nothing", async () => {
    const res = await post(PREVIEW, "machinist", s.instrument.id, body({ mean: 99, result: { sd: 0 } }));
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const { study, jobs } = res.body;
    expect(study.id).toBeNull();
    // Mean and sample standard deviation (n − 1) against simple-statistics.
    expect(study.type1.mean).toBeCloseTo(mean(READINGS), 10);
    expect(study.type1.sd).toBeCloseTo(sampleStandardDeviation(READINGS), 10);
    expect(study.type1.bias).toBeCloseTo(mean(READINGS) - 4.03, 10);
    // The test job's bore is 4.0300 ± 0.0005 in: T = 0.0010 in; Cg = 0.2·T/(6·s) as the issue states it.
    const bore = study.type1.perCharacteristic.find(
      (c: { characteristic: string }) => c.characteristic === "bore_diameter",
    );
    expect(bore.tolerance).toBeCloseTo(0.001, 12);
    expect(bore.cg).toBeCloseTo((0.2 * 0.001) / (6 * sampleStandardDeviation(READINGS)), 8);
    // A 0.0001 in step is 10 % of T, past the common-practice 5 %: the study fails on it.
    expect(bore.resolutionOk).toBe(false);
    expect(study.passed).toBe(false);
    expect(jobs.map((j: { code: string }) => j.code)).toEqual([s.job.code]);
    expect(await GaugeStudy.count({ where: { instrumentId: s.instrument.id } })).toBe(0);
  });

  it("refuses too few or too many readings with words on the field", async () => {
    const few = await post(PREVIEW, "lead", s.instrument.id, body({ readings: READINGS.slice(0, 24) }));
    expect(few.status).toBe(422);
    expect(few.body.error.fields.readings.join(" ")).toMatch(/25 to 50 readings; 24 so far: take 1 more/);
    const many = await post(PREVIEW, "lead", s.instrument.id, body({ readings: [...READINGS, ...READINGS, 4.03] }));
    expect(many.status).toBe(422);
    expect(JSON.stringify(many.body.error.fields)).toMatch(/25 to 50 readings/);
  });
});

describe("save and list", () => {
  it("keeps the study with the performer, lists it, audits it, and hands it to the verdict's gauges", async () => {
    const res = await post(SAVE, "lead", s.instrument.id, body({ performedOn: "2026-11-20" }));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.study).toMatchObject({
      kind: "type1",
      performedOn: "2026-11-20",
      dueOn: "2027-11-20",
      performedBy: { id: s.users.lead.id, name: s.users.lead.name },
      reference: REFERENCE,
      readings: READINGS,
      passed: false,
    });
    const list = await call(LIST as never, await asUser(s.users.inspector, "GET", url(s.instrument.id)), {
      gaugeId: String(s.instrument.id),
    });
    expect(list.status).toBe(200);
    expect(list.body.studies.map((x: { id: number }) => x.id)).toEqual([res.body.study.id]);
    const latest = await latestStudies(s.shop.id, [s.instrument.id]);
    expect(latest.get(s.instrument.id)?.summary.repeatSd).toBeCloseTo(sampleStandardDeviation(READINGS), 8);
    const audit = await AuditEvent.findOne({ where: { shopId: s.shop.id, action: "gauge.study.recorded" } });
    expect(audit?.entityId).toBe(String(s.instrument.id));
    const pack = await call(PACK as never, await asUser(s.users.machinist, "GET", `/api/bench/jobs/${s.job.id}`), {
      jobId: String(s.job.id),
    });
    const gauge = pack.body.instruments.find((g: { id: number }) => g.id === s.instrument.id);
    expect(gauge.study).toMatchObject({ kind: "type1", performedOn: "2026-11-20", dueOn: "2027-11-20" });
    expect(gauge.study.repeatSd).toBeCloseTo(sampleStandardDeviation(READINGS), 8);
  });

  it("a later study is the latest; an earlier-dated one saved after it is not", async () => {
    const newer = await post(SAVE, "admin", s.instrument.id, body({ performedOn: "2026-11-25" }));
    await post(SAVE, "admin", s.instrument.id, body({ performedOn: "2026-10-01" }));
    expect((await latestStudies(s.shop.id, [s.instrument.id])).get(s.instrument.id)?.id).toBe(newer.body.study.id);
  });

  it("refuses a study dated after today", async () => {
    const res = await post(SAVE, "lead", s.instrument.id, body({ performedOn: "2999-01-01" }));
    expect(res.status).toBe(422);
    expect(res.body.error.fields.performedOn).toBeDefined();
  });
});

describe("who may", () => {
  it("an inspector reads studies but does not take them", async () => {
    expect((await post(SAVE, "inspector", s.instrument.id, body())).status).toBe(403);
    expect((await post(PREVIEW, "inspector", s.instrument.id, body())).status).toBe(403);
  });

  it("another shop's gauge is not found, whatever the route", async () => {
    expect((await post(SAVE, "lead", s.instrument.id, body(), other)).status).toBe(404);
    expect((await post(PREVIEW, "lead", s.instrument.id, body(), other)).status).toBe(404);
    const list = await call(LIST as never, await asUser(other.users.lead, "GET", url(s.instrument.id)), {
      gaugeId: String(s.instrument.id),
    });
    expect(list.status).toBe(404);
    expect(await GaugeStudy.count({ where: { shopId: other.shop.id } })).toBe(0);
  });
});
