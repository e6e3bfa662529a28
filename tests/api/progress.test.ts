// Required-station progress is one rule (lib/domain/progress.ts, rule of this product): the desk
// board, the tablet's job list, the job page and the release checklist must give, for the same
// job, the figures the domain function gives from the job's rows. Checked on the demo jobs and
// on a factory job whose readings exercise corrections, skips, two tablets and ties.
import { beforeAll, describe, expect, it } from "vitest";
import { jobProgress } from "@/lib/domain";
import { getSequelize } from "@/lib/server/core/db";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { GET as BOARD } from "@/app/api/jobs/route";
import { GET as DETAIL } from "@/app/api/jobs/[jobId]/route";
import { GET as BENCH } from "@/app/api/bench/jobs/route";
import { GET as RELEASE } from "@/app/api/release/[jobId]/route";
import { Job, Reading, Shop, User } from "@/models";
import { createShop, insertReading, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

type Figures = { done: number; required: number };
type Users = Record<"machinist" | "lead" | "inspector", TestUser>;

async function domainFigures(shopId: number, jobId: number): Promise<Figures> {
  const ctx = await loadJobContext(shopId, jobId);
  const rows = await Reading.findAll({ where: { jobId }, raw: true });
  const p = jobProgress(ctx.shape, ctx.spec, rows);
  return { done: p.done, required: p.required };
}

/** The same job's figures as each screen's route answers them. */
async function screenFigures(users: Users, jobId: number) {
  const id = String(jobId);
  const board = await call(BOARD as never, await asUser(users.lead, "GET", "/api/jobs"));
  const bench = await call(BENCH as never, await asUser(users.machinist, "GET", "/api/bench/jobs"));
  const detail = await call(DETAIL, await asUser(users.lead, "GET", `/api/jobs/${id}`), { jobId: id });
  const release = await call(RELEASE, await asUser(users.inspector, "GET", `/api/release/${id}`), { jobId: id });
  const sections = detail.body.summary.sections as { requiredDone: number; required: number }[];
  const readings = release.body.checklist.checks.find((c: { id: string }) => c.id === "readings");
  return {
    board: board.body.jobs.find((j: { id: number }) => j.id === jobId).progress as Figures,
    bench: bench.body.jobs.find((j: { id: number }) => j.id === jobId)?.progress as Figures | undefined,
    page: {
      done: sections.reduce((n, s) => n + s.requiredDone, 0),
      required: sections.reduce((n, s) => n + s.required, 0),
    },
    checklist: readings.progress as Figures,
  };
}

async function demoUsers(): Promise<{ shopId: number; users: Users }> {
  getSequelize();
  const shop = await Shop.findOne({ where: { slug: "kestrel-flats" } });
  if (!shop) throw new Error("The test database has no demo shop; npm test seeds it");
  const users = {} as Users;
  for (const role of ["machinist", "lead", "inspector"] as const) {
    const u = (await User.findOne({ where: { shopId: shop.id, role } }))!;
    users[role] = { id: u.id, shopId: shop.id, role, name: u.name, email: u.email };
  }
  return { shopId: shop.id, users };
}

describe("required-station progress: every screen gives the domain's figures", () => {
  it.each(["KF-2611", "KF-2612", "KF-2613"])("demo job %s", async (code) => {
    const { shopId, users } = await demoUsers();
    const job = (await Job.findOne({ where: { shopId, code } }))!;
    const expected = await domainFigures(shopId, job.id);
    expect(expected.required).toBeGreaterThan(0);
    const got = await screenFigures(users, job.id);
    expect(got).toEqual({ board: expected, bench: expected, page: expected, checklist: expected });
  });

  describe("a factory job with corrections, skips, two tablets and a tie", () => {
    let s: TestShop;
    beforeAll(async () => {
      s = await createShop();
      const add = (stationId: string, value: number | null, min: number, extra: Record<string, unknown> = {}) =>
        insertReading(s, stationId, value, min, extra);
      await add("bore/1/top/A", 4.0301, 1); // done
      const old = await add("bore/1/top/B", 4.0301, 2);
      await add("bore/1/top/B", 4.0302, 3, { supersedes: old.id }); // corrected: done once
      const value = await add("bore/2/top/A", 4.0301, 4);
      await add("bore/2/top/A", null, 5, { supersedes: value.id, skipReason: "Sleeved later" }); // skip: not done
      await add("bore/2/top/B", 4.0301, 6);
      await add("bore/2/top/B", null, 7, { skipReason: "Second tablet" }); // later unlinked skip: not done
      await add("bore/3/top/A", null, 8, { skipReason: "Tie" });
      await add("bore/3/top/A", 4.0301, 8, { id: "ffffffff-ffff-4fff-bfff-ffffffffffff" }); // tie: larger id wins
    });

    it("all four screens count 3 done, as the domain does", async () => {
      const expected = await domainFigures(s.shop.id, s.job.id);
      expect(expected.done).toBe(3);
      const got = await screenFigures(s.users, s.job.id);
      expect(got).toEqual({ board: expected, bench: expected, page: expected, checklist: expected });
    });
  });
});
