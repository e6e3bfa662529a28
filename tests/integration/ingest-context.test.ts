// POST /api/sync keeps each job's context (engine shape, limits, lock) in memory between batches
// (lib/server/sync/ingest-context.ts) and reuses it only while jobs.context_revision is unchanged. The
// database changes that token on every edit of the job, its engine or its limits (triggers), so
// these edits go around every app writer on purpose: whoever edits, the next batch sees it.
// Limits: tests/support/factories.ts INCH_LIMITS (bore 4.03 ± 0.0005 in).
import { beforeEach, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { getSequelize } from "@/lib/server/core/db";
import { Engine, Job, JobLimit } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { push, reading } from "../api/sync-fixtures";
import { asOwner } from "../support/owner-db";

let s: TestShop;
beforeEach(async () => {
  s = await createShop();
});

const revisionOf = async (jobId: number) =>
  (
    await getSequelize().query<{ r: string }>("SELECT CAST(context_revision AS CHAR) AS r FROM jobs WHERE id = ?", {
      replacements: [jobId],
      type: QueryTypes.SELECT,
    })
  )[0].r;

describe("the sync server's cached job context", () => {
  it("is kept while nothing changes: a batch does not move the token", async () => {
    const before = await revisionOf(s.job.id);
    expect(before).not.toBe("0");
    expect((await push(s.users.machinist, [reading(s.job.id, "bore/1/top/A", 4.0301)])).status).toBe(200);
    expect((await push(s.users.machinist, [reading(s.job.id, "bore/1/mid/A", 4.0301)])).status).toBe(200);
    expect(await revisionOf(s.job.id)).toBe(before);
  });

  it("a limits edit made between two batches judges the second batch with the new limits", async () => {
    const first = await push(s.users.machinist, [reading(s.job.id, "bore/1/top/A", 4.0303)]);
    expect(first.body.results[0].verdict).toBe("in_spec"); // max 4.0305
    const before = await revisionOf(s.job.id);
    await asOwner("UPDATE job_limits SET tol_plus = 0.0002 WHERE job_id = ? AND characteristic = 'bore_diameter'", [
      s.job.id,
    ]);
    expect(await revisionOf(s.job.id)).not.toBe(before);
    const second = await push(s.users.machinist, [reading(s.job.id, "bore/2/top/A", 4.0303)]);
    expect(second.body.results[0]).toMatchObject({ verdict: "out_of_spec", evaluation: { limitMax: 4.0302 } }); // 4.03 + 0.0002
  });

  it("a limit removed or added between batches is seen by the next batch", async () => {
    await push(s.users.machinist, [reading(s.job.id, "bore/1/top/A", 4.0301)]);
    await JobLimit.destroy({ where: { jobId: s.job.id, characteristic: "bore_diameter" } });
    const none = await push(s.users.machinist, [reading(s.job.id, "bore/1/mid/A", 4.04)]);
    expect(none.body.results[0].evaluation).toMatchObject({ verdict: null, limitMax: null });
    await JobLimit.create({
      jobId: s.job.id,
      characteristic: "bore_diameter",
      stationPattern: "*",
      limitType: "max_only",
      unit: "in",
      max: 4.031,
      required: true,
      sortOrder: 9,
    });
    const back = await push(s.users.machinist, [reading(s.job.id, "bore/1/bottom/A", 4.0312)]);
    expect(back.body.results[0]).toMatchObject({ verdict: "out_of_spec", evaluation: { limitMax: 4.031 } });
  });

  it("an engine edit between batches is seen by the next batch (the route shrinks)", async () => {
    expect((await push(s.users.machinist, [reading(s.job.id, "bore/6/top/A", 4.0301)])).status).toBe(200);
    await Engine.update({ cylinders: 4, layout: "inline" }, { where: { id: s.engine.id } });
    const res = await push(s.users.machinist, [reading(s.job.id, "bore/6/mid/A", 4.0301)]);
    expect(res.status).toBe(422);
    expect(res.body.results[0].errors.stationId[0]).toMatch(/not on job .*\(4 cylinders/);
  });

  it("a job on another engine of the shop is judged with its own engine", async () => {
    const four = await Engine.create({
      shopId: s.shop.id,
      customerId: s.customer.id,
      description: "Test four",
      cylinders: 4,
      layout: "inline",
      mains: 5,
      unitSystem: "in",
      nominalBore: 3.5,
      nominalStroke: 3.2,
      blockMaterial: "greyCastIron",
    });
    const job = await Job.create({
      shopId: s.shop.id,
      customerId: s.customer.id,
      engineId: four.id,
      code: `F-${four.id}`,
      title: "Four",
      unitSystem: "in",
      status: "measuring",
    });
    const ok = await push(s.users.machinist, [reading(job.id, "bore/1/top/A", 3.5002)]);
    expect(ok.status).toBe(200); // 3.5 in is this engine's bore, far from the V8's 4.03
    const res = await push(s.users.machinist, [reading(job.id, "bore/6/top/A", 3.5002)]);
    expect(res.body.results[0].errors.stationId[0]).toMatch(/\(4 cylinders/);
  });

  it("a job locked between batches refuses the next batch, with the reason", async () => {
    expect((await push(s.users.machinist, [reading(s.job.id, "bore/1/top/A", 4.0301)])).status).toBe(200);
    await Job.update({ status: "released", lockedAt: new Date("2026-12-01T10:00:00Z") }, { where: { id: s.job.id } });
    const res = await push(s.users.machinist, [reading(s.job.id, "bore/1/mid/A", 4.0301)]);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/released on 1 Dec 2026/);
  });
});
