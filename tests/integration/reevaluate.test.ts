// Editing a job's limits re-judges its readings and derived values in one transaction: verdicts
// flip, flags open and close exactly as the new limits say, dispositions stay with closed flags,
// and the audit trail holds the limits before and after.
import { randomUUID } from "node:crypto";
import { beforeEach, describe, expect, it } from "vitest";
import { PUT } from "@/app/api/jobs/[jobId]/limits/route";
import { AuditEvent, Flag, FlagDisposition, Job, Reading, SyncChange } from "@/models";
import { createShop, INCH_LIMITS, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
const ids: Record<string, string> = {};

// Fixtures (invented figures) against the factory's limits: bore 4.0300 ± 0.0005 in
// (4.0295–4.0305), main oil clearance 0.0015–0.0025 in. No gauge, so U = 0 and no guard band.
async function add(stationId: string, characteristic: string, value: number, minute: number) {
  const r = await Reading.create({
    id: randomUUID(),
    shopId: s.shop.id,
    jobId: s.job.id,
    stationId,
    characteristic,
    value,
    valueCanonical: value * 25.4,
    unit: "in",
    takenBy: s.users.machinist.id,
    takenAt: new Date(Date.UTC(2026, 11, 1, 8, minute)),
    deviceId: "test",
  });
  ids[stationId] = r.id;
}

type Limit = Record<string, unknown> & { characteristic: string };
const limits = (over: Record<string, Record<string, unknown>> = {}): Limit[] =>
  INCH_LIMITS.map((l) => ({ ...l, ...(over[l.characteristic] ?? {}) }));

async function save(list: Limit[]) {
  const job = await Job.findByPk(s.job.id);
  return call(
    PUT as never,
    await asUser(s.users.lead, "PUT", `/api/jobs/${s.job.id}/limits`, {
      specRevision: job!.specRevision,
      limits: list,
    }),
    { jobId: String(s.job.id) },
  );
}

const verdictOf = async (station: string) => (await Reading.findByPk(ids[station]))?.verdict;
const unclosed = async () =>
  (await Flag.findAll({ where: { jobId: s.job.id }, order: [["id", "ASC"]] }))
    .filter((f) => f.state !== "closed")
    .map((f) => (f.readingId ? `r:${f.stationId}` : `d:${f.derivedKey}`))
    .sort();

beforeEach(async () => {
  s = await createShop();
  await add("bore/1/top/A", "bore_diameter", 4.0304, 1);
  await add("bore/1/top/B", "bore_diameter", 4.0302, 2);
  await add("bore/2/top/A", "bore_diameter", 4.0307, 3);
  await add("main-brg/1/front/A", "main_bearing_bore", 2.4515, 4);
  await add("main/1/front/A", "main_journal_diameter", 2.449, 5);
});

describe("PUT /api/jobs/[jobId]/limits re-evaluates the job", () => {
  it("judges, then flips verdicts and opens and closes flags as the limits change", async () => {
    // 1. The limits as they are: 4.0307 > 4.0305 is out; the clearance 2.4515 − 2.4490 = 0.0025 sits on its maximum: in.
    const first = await save(limits());
    expect(first.status).toBe(200);
    expect(first.body.job.specRevision).toBe(2);
    expect([await verdictOf("bore/1/top/A"), await verdictOf("bore/1/top/B"), await verdictOf("bore/2/top/A")]).toEqual(
      ["in_spec", "in_spec", "out_of_spec"],
    );
    expect(await unclosed()).toEqual(["r:bore/2/top/A"]);
    expect(first.body.result).toMatchObject({ opened: 1, closed: 0 });

    // The lead decides to measure it again: the disposition must survive the flag's closing.
    const flag = (await Flag.findOne({ where: { jobId: s.job.id, stationId: "bore/2/top/A" } }))!;
    await flag.update({
      state: "disposed",
      disposition: "measure_again",
      disposedBy: s.users.lead.id,
      disposedAt: new Date(),
    });
    await FlagDisposition.create({ flagId: flag.id, disposition: "measure_again", userId: s.users.lead.id });

    // 2. Loosen the bore to +0.0008 (max 4.0308): 4.0307 is in, its flag closes.
    const second = await save(limits({ bore_diameter: { tolPlus: 0.0008 } }));
    expect(second.body.result).toMatchObject({ opened: 0, closed: 1 });
    expect(await verdictOf("bore/2/top/A")).toBe("in_spec");
    expect(await unclosed()).toEqual([]);
    const closed = (await Flag.findByPk(flag.id))!;
    expect(closed).toMatchObject({ state: "closed", disposition: "measure_again" });
    expect(await FlagDisposition.count({ where: { flagId: flag.id } })).toBe(1);

    // 3. Tighten the bore to +0.0001 (max 4.0301) and the clearance to 0.0020: all three bores and the clearance are out.
    const third = await save(limits({ bore_diameter: { tolPlus: 0.0001 }, main_oil_clearance: { max: 0.002 } }));
    expect(third.body.result).toMatchObject({ opened: 4, closed: 0 });
    expect([await verdictOf("bore/1/top/A"), await verdictOf("bore/1/top/B"), await verdictOf("bore/2/top/A")]).toEqual(
      ["out_of_spec", "out_of_spec", "out_of_spec"],
    );
    expect(await unclosed()).toEqual([
      "d:main_oil_clearance@main-brg/1/front/A",
      "r:bore/1/top/A",
      "r:bore/1/top/B",
      "r:bore/2/top/A",
    ]);
    const derived = await Flag.findOne({
      where: { jobId: s.job.id, derivedKey: "main_oil_clearance@main-brg/1/front/A" },
    });
    expect(derived).toMatchObject({ value: 0.0025, limitMax: 0.002, verdict: "out_of_spec" });
    expect((await Job.findByPk(s.job.id))!.specRevision).toBe(4);
  });

  it("audits every edit with the limits before and after, and puts it on the change feed", async () => {
    await save(limits());
    await save(limits({ bore_diameter: { tolPlus: 0.0008 } }));
    const events = await AuditEvent.findAll({
      where: { action: "job_limits.update", entityId: String(s.job.id) },
      order: [["id", "ASC"]],
    });
    expect(events).toHaveLength(2);
    const bore = (x: unknown) =>
      (x as { limits: { characteristic: string; tolPlus?: number }[] }).limits.find(
        (l) => l.characteristic === "bore_diameter",
      )?.tolPlus;
    expect([bore(events[1].before), bore(events[1].after)]).toEqual([0.0005, 0.0008]);
    expect(events[1].before).toMatchObject({ specRevision: 2 });
    expect(events[1].after).toMatchObject({ specRevision: 3 });
    expect(events.every((e) => e.userId === s.users.lead.id)).toBe(true);
    // The reading whose verdict flipped has its own re-evaluation event.
    const flip = await AuditEvent.findOne({
      where: { action: "reading.re-evaluate", entityId: ids["bore/2/top/A"] },
      order: [["id", "DESC"]],
    });
    expect([(flip?.before as { verdict: string }).verdict, (flip?.after as { verdict: string }).verdict]).toEqual([
      "out_of_spec",
      "in_spec",
    ]);
    expect(await SyncChange.count({ where: { jobId: s.job.id, entity: "job_limits" } })).toBe(2);
  });

  it("changes nothing when the edit is refused", async () => {
    await save(limits());
    const before = await unclosed();
    const bad = await save(limits({ bore_diameter: { tolPlus: -1 } }));
    expect(bad.status).toBe(422);
    expect(await unclosed()).toEqual(before);
    expect((await Job.findByPk(s.job.id))!.specRevision).toBe(2);
  });
});
