// jobsWithEngines and loadJobContext read jobs, engines and job limits through the driver (core/sql-columns.ts): its rows must be
// the plain rows Sequelize gives for the same records, field for field, every type included.
import { beforeAll, describe, expect, it } from "vitest";
import { toEngineShape, toSpecLimit } from "@/lib/server/jobs/context";
import { jobsWithEngines, loadJobContext } from "@/lib/server/jobs/repo";
import { Engine, Job, JobLimit } from "@/models";
import { createShop, type TestShop } from "../support/factories";

let s: TestShop;
let other: TestShop;
beforeAll(async () => {
  s = await createShop();
  other = await createShop();
  // Every nullable column given a value (a lock time with milliseconds, a JSON plan, finished sizes).
  await Job.update(
    {
      dueDate: "2027-01-15",
      notes: 'Customer asks for, the "usual" finish',
      buildPlan: { steps: ["hone", "deck"], torque: { rods: 45 } },
      finishedBore: 4.0405,
      finishedMainJournal: 2.4488,
      finishedRodJournal: 2.0993,
      lockedAt: new Date("2026-11-30T17:04:05.678Z"),
    },
    { where: { id: s.job.id } },
  );
  await Engine.update(
    { nominalMainJournal: 2.45, headMaterial: "aluminium", fuel: "gasoline", blockSerial: "B-1" },
    { where: { id: s.engine.id } },
  );
});

describe("jobsWithEngines", () => {
  it("gives the shop's jobs with their engines exactly as Sequelize's plain rows", async () => {
    const [row, ...rest] = await jobsWithEngines(s.shop.id, [s.job.id, other.job.id]);
    expect(rest).toEqual([]); // the other shop's job is simply absent
    const job = (await Job.findByPk(s.job.id))!.get({ plain: true });
    const engine = (await Engine.findByPk(s.engine.id))!.get({ plain: true });
    expect(row.job).toStrictEqual(job);
    expect(row.engine).toStrictEqual(engine);
    expect(row.job.lockedAt).toEqual(new Date("2026-11-30T17:04:05.678Z"));
    expect(row.job.finishedBore).toBe(4.0405);
  });

  it("answers nothing for no ids and orders several by id", async () => {
    expect(await jobsWithEngines(s.shop.id, [])).toEqual([]);
    const jobs = await jobsWithEngines(other.shop.id, [other.job.id]);
    expect(jobs.map((j) => j.job.id)).toEqual([other.job.id]);
  });
});

describe("loadJobContext", () => {
  it("is the context Sequelize's rows give, limits in spec order included", async () => {
    const ctx = await loadJobContext(s.shop.id, s.job.id);
    const job = (await Job.findByPk(s.job.id))!.get({ plain: true });
    const engine = (await Engine.findByPk(s.engine.id))!.get({ plain: true });
    const limits = await JobLimit.findAll({
      where: { jobId: s.job.id },
      order: [
        ["sortOrder", "ASC"],
        ["id", "ASC"],
      ],
    });
    expect(ctx).toStrictEqual({
      job,
      engine,
      shape: toEngineShape(engine, job),
      spec: limits.map(toSpecLimit),
    });
    expect(ctx.spec.length).toBeGreaterThan(0);
  });

  it("answers 404 for another shop's job", async () => {
    await expect(loadJobContext(other.shop.id, s.job.id)).rejects.toMatchObject({ code: "not_found" });
  });
});
