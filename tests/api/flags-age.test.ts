// A flag's age counts from the reading it judges (when it was taken), not from when the flag row
// was written: a tablet that was offline for days sends an old reading, and its flag is the
// oldest in the queue and says so on its own page.
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { GET as LIST } from "@/app/api/flags/route";
import { GET as DETAIL } from "@/app/api/flags/[flagId]/route";
import { Flag, Reading } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

const DAY = 24 * 3600_000;

async function flagged(s: TestShop, stationId: string, takenAt: Date) {
  const reading = await Reading.create({
    id: randomUUID(),
    shopId: s.shop.id,
    jobId: s.job.id,
    stationId,
    characteristic: "bore_diameter",
    value: 4.0312,
    valueCanonical: 4.0312,
    unit: "in",
    takenBy: s.users.machinist.id,
    takenAt,
    deviceId: "test-tablet",
    verdict: "out_of_spec",
    limitMin: 4.0295,
    limitMax: 4.0305,
  });
  return Flag.create({
    shopId: s.shop.id,
    jobId: s.job.id,
    readingId: reading.id,
    stationId,
    characteristic: "bore_diameter",
    value: 4.0312,
    unit: "in",
    limitMin: 4.0295,
    limitMax: 4.0305,
    verdict: "out_of_spec",
    reason: "out_of_spec",
  });
}

describe("flag age", () => {
  it("counts from the judged reading's time in the queue, its sort and the flag's page", async () => {
    const s = await createShop();
    const fresh = await flagged(s, "bore/2/top/A", new Date(Date.now() - 5 * 60_000));
    const late = await flagged(s, "bore/3/top/A", new Date(Date.now() - 3 * DAY)); // raised after `fresh`
    expect(late.createdAt.getTime()).toBeGreaterThanOrEqual(fresh.createdAt.getTime());

    const res = await call(
      LIST as never,
      await asUser(s.users.lead, "GET", `/api/flags?job=${s.job.id}&sort=age&dir=desc`),
    );
    expect(res.status).toBe(200);
    const items = res.body.items as { id: number; judgedAt: string; takenAt: string; createdAt: string }[];
    expect(items.map((i) => i.id)).toEqual([late.id, fresh.id]); // oldest reading first
    expect(items[0].judgedAt).toBe(items[0].takenAt);
    expect(Date.now() - Date.parse(items[0].judgedAt)).toBeGreaterThanOrEqual(3 * DAY);
    expect(Date.now() - Date.parse(items[0].createdAt)).toBeLessThan(DAY); // the row itself is new

    const asc = await call(
      LIST as never,
      await asUser(s.users.lead, "GET", `/api/flags?job=${s.job.id}&sort=age&dir=asc`),
    );
    expect(asc.body.items.map((i: { id: number }) => i.id)).toEqual([fresh.id, late.id]);

    const one = await call(DETAIL as never, await asUser(s.users.lead, "GET", `/api/flags/${late.id}`), {
      flagId: String(late.id),
    });
    expect(one.body.flag.judgedAt).toBe(items[0].takenAt);
  });
});
