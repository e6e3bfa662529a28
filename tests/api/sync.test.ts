// POST /api/sync against the real MariaDB: roles, acceptance, replay, and the all-or-nothing rule.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { lockWayOut } from "@/lib/domain";
import { getSequelize } from "@/lib/server/core/db";
import { Instrument, Job } from "@/models";
import { POST } from "@/app/api/sync/route";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { count, flagsOf, footprint, push, reading, syncedInAudit } from "./sync-fixtures";

let a: TestShop;
let b: TestShop;

beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

describe("POST /api/sync: who may push", () => {
  it("refuses a signed-out request with 401 and another role with 403", async () => {
    const batch = [reading(a.job.id, "bore/1/top/A", 4.0302)];
    expect((await push(null, batch)).status).toBe(401);
    for (const role of ["inspector", "admin"] as const) {
      const res = await push(a.users[role], batch);
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe("forbidden");
    }
    expect(await count("SELECT COUNT(*) AS n FROM readings WHERE id = ?", [batch[0].id])).toBe(0);
  });
  it("takes readings from the machinist and the lead", async () => {
    for (const role of ["machinist", "lead"] as const) {
      const res = await push(a.users[role], [reading(a.job.id, "deck/left/front", 9.025)]);
      expect(res.status).toBe(200);
      expect(res.body.results[0].status).toBe("accepted");
    }
  });
});

describe("POST /api/sync: accepted readings", () => {
  it("stores value as entered and canonical mm, the server's verdict, who and which device", async () => {
    const r = reading(a.job.id, "bore/2/top/A", 4.0302, { instrumentId: a.instrument.id, partTempC: 20 });
    const before = await footprint(a.job.id, a.shop.id);
    const res = await push(a.users.machinist, [r], "tablet-7");
    expect(res.status).toBe(200);
    expect(res.body.results).toEqual([
      {
        index: 0,
        id: r.id,
        status: "accepted",
        replay: false,
        verdict: "in_spec",
        // deviation from nominal 4.03: +0.0002 in; limits 4.0295–4.0305 (factories INCH_LIMITS)
        evaluation: {
          verdict: "in_spec",
          verdictNote: null,
          unit: "in",
          limitMin: 4.0295,
          limitMax: 4.0305,
          deviation: 0.0002,
        },
      },
    ]);
    expect(res.body.cursor).toMatch(/^\d+$/);
    const [row] = await getSequelize().query<Record<string, unknown>>(
      "SELECT value_entered, unit_entered, value_canonical, taken_by, device_id, received_at, verdict FROM readings WHERE id = ?",
      { replacements: [r.id], type: "SELECT" as never },
    );
    expect(Number(row.value_entered)).toBe(4.0302);
    expect(row.unit_entered).toBe("in");
    expect(Number(row.value_canonical)).toBe(102.36708); // 4.0302 in × 25.4 mm/in (NIST SP 811, B.8, exact)
    expect(row.taken_by).toBe(a.users.machinist.id);
    expect(row.device_id).toBe("tablet-7");
    expect(row.received_at).toBeTruthy();
    const after = await footprint(a.job.id, a.shop.id);
    expect(after.readings - before.readings).toBe(1);
    expect(after.changes - before.changes).toBeGreaterThanOrEqual(1);
    // One "readings.sync" audit event per job per batch lists each new reading exactly once.
    const audited = (await syncedInAudit(a.shop.id)).filter((e) => e.id === r.id);
    expect(audited).toEqual([
      {
        id: r.id,
        stationId: "bore/2/top/A",
        value: 4.0302,
        unit: "in",
        verdict: "in_spec",
        supersedes: null,
        jobId: a.job.id,
        deviceId: "tablet-7",
        userId: a.users.machinist.id,
      },
    ]);
  });

  it("a replay of the same batch is a no-op: accepted again with the stored verdict, nothing new written", async () => {
    const batch = [reading(a.job.id, "bore/3/top/A", 4.0301), reading(a.job.id, "bore/3/mid/A", 4.0312)];
    const first = await push(a.users.machinist, batch);
    expect(first.status).toBe(200);
    expect(first.body.results.map((x: { verdict: string }) => x.verdict)).toEqual(["in_spec", "out_of_spec"]);
    const before = await footprint(a.job.id, a.shop.id);
    for (let i = 0; i < 3; i++) {
      const again = await push(a.users.machinist, batch, "another-device");
      expect(again.status).toBe(200);
      expect(again.body.results.map((x: { status: string; replay: boolean }) => [x.status, x.replay])).toEqual([
        ["accepted", true],
        ["accepted", true],
      ]);
      expect(again.body.results[1].evaluation).toEqual(first.body.results[1].evaluation);
    }
    expect(await footprint(a.job.id, a.shop.id)).toEqual(before);
  });

  it("the same reading twice in one batch is stored once", async () => {
    const r = reading(a.job.id, "bore/4/top/A", 4.0301);
    const res = await push(a.users.machinist, [r, { ...r }]);
    expect(res.status).toBe(200);
    expect(res.body.results.map((x: { status: string }) => x.status)).toEqual(["accepted", "accepted"]);
    expect(await count("SELECT COUNT(*) AS n FROM readings WHERE id = ?", [r.id])).toBe(1);
  });

  it("the same id with other figures is a conflict; the stored reading is not overwritten", async () => {
    const r = reading(a.job.id, "bore/5/top/A", 4.0301);
    expect((await push(a.users.machinist, [r])).status).toBe(200);
    const res = await push(a.users.machinist, [{ ...r, value: 4.0303 }]);
    expect(res.status).toBe(422);
    expect(res.body.results[0]).toMatchObject({ status: "rejected", code: "conflict" });
    expect(res.body.results[0].reason).toMatch(/supersedes/);
    expect(res.body.error.fields["readings.0.id"]).toBeDefined();
    expect(await count("SELECT COUNT(*) AS n FROM readings WHERE id = ? AND value_entered = 4.0301", [r.id])).toBe(1);
  });

  it("a skipped station is stored with its reason and no value or verdict", async () => {
    const r = reading(a.job.id, "lash/1/int", null, { skipped: true, skipReason: "Head is off at the machine shop" });
    const res = await push(a.users.machinist, [r]);
    expect(res.status).toBe(200);
    expect(res.body.results[0].verdict).toBeNull();
    expect(
      await count("SELECT COUNT(*) AS n FROM readings WHERE id = ? AND skipped = 1 AND value_entered IS NULL", [r.id]),
    ).toBe(1);
  });
});

describe("POST /api/sync: dial bore gauge mode", () => {
  let dialId: number;
  beforeAll(async () => {
    getSequelize();
    dialId = (
      await Instrument.create({
        shopId: a.shop.id,
        kind: "bore_gauge_dial",
        label: "Dial bore gauge",
        serial: `DB-${randomUUID().slice(0, 6)}`,
        unit: "in",
        resolution: 0.0001,
        expandedU: 0.0001,
        calibrationDue: "2027-06-01",
        dialPlusMeansSmaller: true,
      })
    ).id;
  });
  it("recomputes setting − reading when plus means smaller and stores both", async () => {
    // 4.0300 − (−0.0002) = 4.0302 (dial-gauge.ts; common practice, from memory)
    const r = reading(a.job.id, "bore/6/top/A", 4.0302, {
      entryMode: "dial",
      dialSetting: 4.03,
      dialDeviation: -0.0002,
      instrumentId: dialId,
    });
    const res = await push(a.users.machinist, [r]);
    expect(res.status).toBe(200);
    expect(
      await count(
        `SELECT COUNT(*) AS n FROM readings WHERE id = ? AND entry_mode = 'dial'
           AND dial_setting = 4.03 AND dial_deviation = -0.0002 AND value_entered = 4.0302`,
        [r.id],
      ),
    ).toBe(1);
  });
  it("refuses a diameter that does not match the gauge's sign convention", async () => {
    const r = reading(a.job.id, "bore/6/mid/A", 4.0298, {
      entryMode: "dial",
      dialSetting: 4.03,
      dialDeviation: -0.0002,
      instrumentId: dialId,
    });
    const res = await push(a.users.machinist, [r]);
    expect(res.status).toBe(422);
    expect(res.body.error.fields["readings.0.value"][0]).toMatch(/gives 4\.0302 in .*plus means a smaller bore/);
  });
});

describe("POST /api/sync: gauges past their calibration due date", () => {
  it("keeps the verdict, notes gauge_past_due and opens a flag for that reason", async () => {
    getSequelize();
    const old = await Instrument.create({
      shopId: a.shop.id,
      kind: "bore_gauge_digital",
      label: "Old mic",
      serial: `OLD-${randomUUID().slice(0, 6)}`,
      unit: "in",
      resolution: 0.0001,
      expandedU: 0.0001,
      calibrationDue: "2026-06-30",
    });
    const r = reading(a.job.id, "bore/7/top/A", 4.03, { instrumentId: old.id });
    const res = await push(a.users.machinist, [r]);
    expect(res.status).toBe(200);
    expect(res.body.results[0].evaluation).toMatchObject({ verdict: "in_spec", verdictNote: "gauge_past_due" });
    const flags = (await flagsOf(a.job.id)).filter((f) => f.readingId === r.id);
    expect(flags).toMatchObject([{ reason: "gauge_past_due", state: "open" }]);
  });
});

describe("POST /api/sync: locked jobs", () => {
  it("refuses readings for a released job with the reason in words, writes nothing, but still accepts a replay", async () => {
    const shop = await createShop();
    const stored = reading(shop.job.id, "bore/1/top/A", 4.0301);
    expect((await push(shop.users.machinist, [stored])).status).toBe(200);
    getSequelize();
    await Job.update(
      { status: "released", lockedAt: new Date("2026-12-12T15:00:00Z") },
      { where: { id: shop.job.id } },
    );
    const before = await footprint(shop.job.id, shop.shop.id);
    const res = await push(shop.users.machinist, [reading(shop.job.id, "bore/1/mid/A", 4.0301)]);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("job_locked");
    const reason = `Job ${shop.job.code} was released on 12 Dec 2026; readings are locked. ${lockWayOut("released")}`;
    expect(res.body.results[0]).toMatchObject({ status: "rejected", code: "job_locked", reason });
    expect(res.body.error.message).toContain(reason);
    expect(await footprint(shop.job.id, shop.shop.id)).toEqual(before);
    const replay = await push(shop.users.machinist, [stored]);
    expect(replay.status).toBe(200);
    expect(replay.body.results[0]).toMatchObject({ status: "accepted", replay: true });
  });
});

describe("POST /api/sync: every clause of the lock rule refuses on its own (jobLock, rule of this product)", () => {
  // Each case leaves the other clauses open, so dropping any one clause from jobLock fails it.
  it.each([
    ["lockedAt set, status still review", { status: "review", lockedAt: new Date("2026-12-12T15:00:00Z") }, "locked"],
    ["lockedAt set, status measuring", { status: "measuring", lockedAt: new Date("2026-12-12T15:00:00Z") }, "locked"],
    ["released with no lockedAt", { status: "released", lockedAt: null }, "released"],
    ["closed with no lockedAt", { status: "closed", lockedAt: null }, "closed"],
  ] as const)("%s → 409 job_locked, nothing written", async (_what, fields, verb) => {
    const shop = await createShop();
    getSequelize();
    await Job.update(fields, { where: { id: shop.job.id } });
    const before = await footprint(shop.job.id, shop.shop.id);
    const res = await push(shop.users.machinist, [reading(shop.job.id, "bore/1/top/A", 4.0301)]);
    expect(res.status).toBe(409);
    expect(res.body.results[0]).toMatchObject({ status: "rejected", code: "job_locked" });
    expect(res.body.results[0].reason).toMatch(new RegExp(`^Job ${shop.job.code} was ${verb}\\b`));
    expect(await footprint(shop.job.id, shop.shop.id)).toEqual(before);
  });

  it("the same job with the lock cleared takes the reading (the case above is the lock, not the data)", async () => {
    const shop = await createShop();
    getSequelize();
    await Job.update({ status: "review", lockedAt: null }, { where: { id: shop.job.id } });
    const res = await push(shop.users.machinist, [reading(shop.job.id, "bore/1/top/A", 4.0301)]);
    expect(res.status).toBe(200);
    expect(res.body.results[0].status).toBe("accepted");
  });
});

describe("POST /api/sync: bad payloads → 400/422 with field errors and no partial write", () => {
  it("400 when the body is not JSON", async () => {
    const res = await call(
      POST,
      await asUser(a.users.machinist, "POST", "/api/sync", "{not json", { "content-type": "application/json" }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("bad_json");
  });

  it.each([
    ["an array", [], "_"],
    ["no deviceId", { readings: [] }, "deviceId"],
    ["readings not a list", { deviceId: "t", readings: "many" }, "readings"],
  ])("422 for a malformed batch (%s), with no per-item results", async (_name, body, field) => {
    const res = await call(POST, await asUser(a.users.machinist, "POST", "/api/sync", body));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]).toBeDefined();
    expect(res.body.results).toBeUndefined();
  });

  it("413 for more than 500 readings, saying to split the batch", async () => {
    const res = await call(
      POST,
      await asUser(a.users.machinist, "POST", "/api/sync", {
        deviceId: "t",
        readings: Array.from({ length: 501 }, () => ({})),
      }),
    );
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: "payload_too_large" });
    expect(res.body.error.message).toMatch(/at most 500 .* Split it/);
  });

  const cases: [string, (job: number) => Record<string, unknown>, string, string, RegExp][] = [
    ["wrong types", (j) => ({ ...reading(j, "bore/1/top/B", 0), value: "4.0302" }), "value", "invalid", /number/],
    [
      "a job id that is not a number",
      (j) => ({ ...reading(j, "bore/1/top/B", 4.03), jobId: "KF-1" }),
      "jobId",
      "invalid",
      /number/,
    ],
    [
      "an id that is not a UUID",
      (j) => ({ ...reading(j, "bore/1/top/B", 4.03), id: "reading-1" }),
      "id",
      "invalid",
      /UUID/,
    ],
    [
      "a malformed station id",
      (j) => reading(j, "bore/1/side/A", 4.03),
      "stationId",
      "invalid",
      /depth must be top \| mid \| bottom/,
    ],
    [
      "a station the engine does not have",
      (j) => reading(j, "bore/9/top/A", 4.03),
      "stationId",
      "invalid",
      /not on job .* engine \(8 cylinders/,
    ],
    [
      "a value out of physical range (a bore of 40.3 in)",
      (j) => reading(j, "bore/1/top/B", 40.3),
      "value",
      "invalid",
      /cannot be a cylinder bore diameter/,
    ],
    [
      "a wrong unit for the characteristic",
      (j) => reading(j, "bore/1/top/B", 4.03, { unit: "lbf_ft" }),
      "unit",
      "invalid",
      /use in or mm, not lbf·ft/,
    ],
    [
      "torque without its lubricant",
      (j) => ({ ...reading(j, "torque/main-caps", 68), lubricant: undefined }),
      "lubricant",
      "invalid",
      /lubricant/,
    ],
    [
      "a skip without a reason",
      (j) => reading(j, "bore/1/top/B", null, { skipped: true }),
      "skipReason",
      "invalid",
      /why/,
    ],
    [
      "a gauge of another shop",
      (j) => reading(j, "bore/1/top/B", 4.03, { instrumentId: b.instrument.id }),
      "instrumentId",
      "wrong_gauge",
      /No gauge/,
    ],
    [
      "a correction of another job's reading",
      (j) => reading(j, "bore/1/top/B", 4.03, { supersedes: randomUUID() }),
      "supersedes",
      "invalid",
      /not on job/,
    ],
  ];

  it.each(cases)(
    "%s: the bad reading is rejected by field, the good one held, nothing written",
    async (_name, make, field, code, message) => {
      const good = reading(a.job.id, "bore/8/bottom/B", 4.0301);
      const bad = make(a.job.id);
      const before = await footprint(a.job.id, a.shop.id);
      const res = await push(a.users.machinist, [good, bad]);
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe("invalid");
      expect(res.body.error.fields[`readings.1.${field}`]?.join(" ")).toMatch(message);
      expect(res.body.results[0]).toEqual({ index: 0, id: good.id, status: "held" });
      expect(res.body.results[1]).toMatchObject({ index: 1, status: "rejected", code });
      expect(res.body.results[1].errors[field].join(" ")).toMatch(message);
      expect(await footprint(a.job.id, a.shop.id)).toEqual(before);
    },
  );

  it("another shop's job is refused exactly like a job that does not exist", async () => {
    const theirs = await push(a.users.machinist, [reading(b.job.id, "bore/1/top/A", 4.0301)]);
    const nobody = await push(a.users.machinist, [reading(2_000_000_000, "bore/1/top/A", 4.0301)]);
    expect(theirs.status).toBe(422);
    expect(theirs.body.results[0]).toMatchObject({
      status: "rejected",
      code: "not_found",
      reason: `Job ${b.job.id} not found`,
    });
    expect(nobody.body.results[0]).toMatchObject({
      status: "rejected",
      code: "not_found",
      reason: "Job 2000000000 not found",
    });
    expect(JSON.stringify(theirs.body)).not.toContain(b.job.code);
    expect(await count("SELECT COUNT(*) AS n FROM readings WHERE job_id = ?", [b.job.id])).toBe(0);
  });
});
