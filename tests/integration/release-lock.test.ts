// A released job is locked: a reading the tablet sends afterwards through POST /api/sync is
// refused with a reason (the tablet keeps it, marked), nothing is written, and the release
// still verifies. Once the lead reopens, the same reading goes in.
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { POST as sign } from "@/app/api/release/[jobId]/route";
import { POST as reopen } from "@/app/api/release/[jobId]/reopen/route";
import { GET as verify } from "@/app/api/release/[jobId]/verify/route";
import { POST as sync } from "@/app/api/sync/route";
import { Reading } from "@/models";
import { createShop, gaugeFor, TEST_PASSWORD } from "../support/factories";
import { asUser, call } from "../support/requests";
import { completeJob } from "../api/release-fixtures";

describe("the release lock", () => {
  it("refuses a reading sent after release, keeps nothing of it, and accepts it after reopening", async () => {
    const s = await createShop();
    await completeJob(s);
    const p = { jobId: String(s.job.id) };
    const signed = await call(
      sign,
      await asUser(s.users.inspector, "POST", `/api/release/${s.job.id}`, {
        fullName: s.users.inspector.name,
        password: TEST_PASSWORD,
      }),
      p,
    );
    expect(signed.status).toBe(201);

    const reading = {
      id: randomUUID(),
      jobId: s.job.id,
      stationId: "skirt/1",
      value: 4.0285,
      unit: "in",
      instrumentId: gaugeFor(s.shop.id, "skirt/1"),
      takenAt: new Date().toISOString(),
    };
    const batch = { deviceId: "tablet-after-release", readings: [reading] };
    const refused = await call(sync, await asUser(s.users.machinist, "POST", "/api/sync", batch));
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("job_locked");
    expect(refused.body.results).toHaveLength(1);
    expect(refused.body.results[0]).toMatchObject({ id: reading.id, status: "rejected", code: "job_locked" });
    expect(refused.body.results[0].reason).toMatch(
      new RegExp(`Job ${s.job.code} was released on .*readings are locked`),
    );
    expect(await Reading.count({ where: { id: reading.id } })).toBe(0);

    const check = await call(verify, await asUser(s.users.inspector, "GET", `/api/release/${s.job.id}/verify`), p);
    expect(check.body.status).toBe("match");

    const reopened = await call(
      reopen,
      await asUser(s.users.lead, "POST", `/api/release/${s.job.id}/reopen`, {
        reason: "Skirt of piston 1 to be measured again",
      }),
      p,
    );
    expect(reopened.status).toBe(200);
    const accepted = await call(sync, await asUser(s.users.machinist, "POST", "/api/sync", batch));
    expect(accepted.status).toBe(200);
    expect(accepted.body.results[0]).toMatchObject({ id: reading.id, status: "accepted" });
    expect(await Reading.count({ where: { id: reading.id } })).toBe(1);
  });
});
