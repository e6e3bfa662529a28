// POST /api/sync refuses a reading whose gauge cannot take it, in the tablet's words (the core's
// gaugeRefusal): none named, a kind that cannot measure the station, or a range that does not hold
// the value. Gauges are invented test gauges; a 20–150 lbf·ft click wrench is a common size
// (common practice). Limits: tests/support/factories.ts INCH_LIMITS (torque 65–70 lbf·ft).
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { getSequelize } from "@/lib/server/core/db";
import { Instrument } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { count, push, reading } from "./sync-fixtures";

let s: TestShop;
let wrench: number;

const gauge = (over: Record<string, unknown>) =>
  Instrument.create({
    shopId: s.shop.id,
    kind: "torque_wrench",
    label: "Click wrench",
    serial: `TW-${randomUUID().slice(0, 6)}`,
    unit: "lbf_ft",
    resolution: 1,
    expandedU: 0,
    calibratedOn: "2026-06-01",
    calibrationDue: "2027-06-01",
    ...over,
  });
const stored = (id: string) => count("SELECT COUNT(*) AS n FROM readings WHERE id = ?", [id]);

beforeAll(async () => {
  s = await createShop();
  getSequelize();
  // Switch off the kit's wrench (no range on file), so only ranged wrenches can be offered.
  await Instrument.update({ active: false }, { where: { id: s.gauges.torque } });
  wrench = (await gauge({ label: "Click wrench 20–150", serial: "TW-SMALL", rangeMin: 20, rangeMax: 150 })).id;
});

describe("POST /api/sync: the gauge of a reading", () => {
  it("refuses 210 lbf·ft on a 20–150 lbf·ft wrench in words, code wrong_gauge, and writes nothing", async () => {
    const r = reading(s.job.id, "torque/head-bolts", 210, { instrumentId: wrench });
    const res = await push(s.users.machinist, [r]);
    expect(res.status).toBe(422);
    const words =
      "'Click wrench 20–150' (TW-SMALL) reads 20–150 lbf·ft; 210 lbf·ft is outside its range. " +
      "Pick a torque wrench whose range holds 210 lbf·ft: " +
      "none on file holds it, so ask the admin to register one under Gauges";
    expect(res.body.results[0]).toMatchObject({ status: "rejected", code: "wrong_gauge", reason: words });
    expect(res.body.error.fields["readings.0.instrumentId"]).toEqual([words]);
    expect(res.body.results[0].reason).not.toMatch(/lbf_ft|instrumentId/);
    expect(await stored(r.id)).toBe(0);
  });

  it("names the wrench that holds it once the shop has one, and takes the reading with it", async () => {
    const big = (await gauge({ label: "Click wrench 100–600", serial: "TW-BIG", rangeMin: 100, rangeMax: 600 })).id;
    const r = reading(s.job.id, "torque/head-bolts", 210, { instrumentId: wrench });
    const res = await push(s.users.machinist, [r]);
    expect(res.body.results[0].reason).toMatch(/holds 210 lbf·ft: 'Click wrench 100–600' \(TW-BIG\) 100–600 lbf·ft$/);
    const again = await push(s.users.machinist, [{ ...r, id: randomUUID(), instrumentId: big }]);
    expect(again.status).toBe(200);
    expect(again.body.results[0].evaluation.verdict).toBe("out_of_spec"); // 210 against 65–70 lbf·ft
  });

  it("converts to the gauge's unit: 95 N·m (70.07 lbf·ft) on the 20–150 lbf·ft wrench is taken", async () => {
    // 1 lbf·ft = 1.355818 N·m (NIST SP 811, B.8): 95 N·m = 70.07 lbf·ft, inside 20–150.
    const r = reading(s.job.id, "torque/rod-bolts", 95, { unit: "nm", instrumentId: wrench });
    expect((await push(s.users.machinist, [r])).status).toBe(200);
  });

  it("refuses a reading that names no gauge, and a gauge of a kind that cannot measure the station", async () => {
    const none = reading(s.job.id, "bore/3/top/A", 4.0301, { instrumentId: undefined });
    const res = await push(s.users.machinist, [none]);
    expect(res.status).toBe(422);
    expect(res.body.results[0]).toMatchObject({ code: "wrong_gauge" });
    expect(res.body.results[0].reason).toMatch(
      /^No gauge is named for this reading\. Pick a dial bore gauge or bore gauge whose range holds 4\.0301 in: /,
    );
    const mic = reading(s.job.id, "bore/3/top/A", 4.0301, { instrumentId: s.gauges.mic });
    const refused = await push(s.users.machinist, [mic]);
    expect(refused.body.results[0].reason).toMatch(
      /^'Kit micrometer' \(KIT-MIC-\w+\) is an outside micrometer; it cannot measure a cylinder bore diameter\. /,
    );
    expect(await stored(none.id)).toBe(0);
    expect(await stored(mic.id)).toBe(0);
  });

  it("a skip needs no gauge", async () => {
    const skip = reading(s.job.id, "torque/damper", null, { skipped: true, skipReason: "Damper not fitted yet" });
    const res = await push(s.users.machinist, [{ ...skip, instrumentId: undefined }]);
    expect(res.status).toBe(200);
  });
});
