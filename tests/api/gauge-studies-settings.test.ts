// The shop's gauge study thresholds: defaults (common practice: Cg and Cgk 1.33, resolution 5 % of T,
// %GRR 30 %, yearly), the admin edits them with words for bad input, and a study saved afterwards
// is judged by the new marks and keeps them.
import { beforeAll, describe, expect, it } from "vitest";
import { GET, PUT } from "@/app/api/admin/study-settings/route";
import { POST as SAVE } from "@/app/api/gauges/[gaugeId]/studies/route";
import { AuditEvent } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
const PATH = "/api/admin/study-settings";
const NEXT = { minCg: 1.67, minCgk: 1.5, maxResolutionPct: 10, maxGrrPct: 20, validMonths: 6 };

beforeAll(async () => {
  s = await createShop();
});

describe("study settings", () => {
  it("a new shop has the common-practice defaults", async () => {
    const res = await call(GET as never, await asUser(s.users.lead, "GET", PATH));
    expect(res.status).toBe(200);
    expect(res.body.settings).toEqual({
      minCg: 1.33,
      minCgk: 1.33,
      maxResolutionPct: 5,
      maxGrrPct: 30,
      validMonths: 12,
    });
  });

  it("only the admin changes them", async () => {
    for (const who of ["lead", "inspector", "machinist"] as const) {
      expect((await call(PUT as never, await asUser(s.users[who], "PUT", PATH, NEXT))).status).toBe(403);
    }
  });

  it("refuses figures the columns cannot keep or that make no sense, naming the field", async () => {
    const res = await call(
      PUT as never,
      await asUser(s.users.admin, "PUT", PATH, { ...NEXT, minCg: 1.333, validMonths: 0, maxGrrPct: 150 }),
    );
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["maxGrrPct", "minCg", "validMonths"]);
  });

  it("the admin's change is stored, audited, and judges the next study", async () => {
    const res = await call(PUT as never, await asUser(s.users.admin, "PUT", PATH, NEXT));
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.settings).toEqual(NEXT);
    const audit = await AuditEvent.findOne({ where: { shopId: s.shop.id, action: "gauge.study.settings" } });
    expect(audit).not.toBeNull();
    const readings = Array.from({ length: 25 }, (_, i) => 4.03 + (i % 3) * 0.0001);
    const study = await call(
      SAVE as never,
      await asUser(s.users.lead, "POST", `/api/gauges/${s.instrument.id}/studies`, {
        kind: "type1",
        performedOn: "2026-11-30",
        readings: readings.map((x) => Number(x.toFixed(4))),
        reference: { value: 4.03, expandedU: 0.00005 },
        characteristics: [{ characteristic: "bore_diameter", tolerance: 0.002 }],
      }),
      { gaugeId: String(s.instrument.id) },
    );
    expect(study.status, JSON.stringify(study.body)).toBe(201);
    expect(study.body.study.thresholds).toEqual(NEXT);
    expect(study.body.study.dueOn).toBe("2027-05-30"); // six months on
    // 0.0001 in is 5 % of T = 0.002 in: inside the new 10 % mark.
    expect(study.body.study.type1.perCharacteristic[0].resolutionOk).toBe(true);
  });
});
