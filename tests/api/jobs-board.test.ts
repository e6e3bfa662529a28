// The jobs board a page at a time (GET /api/jobs): paging, each status filter, the search, each
// sort both ways, progress and flag counts (kept progress counted again after a reading or a limits
// edit), bad parameters (422 naming them), and never another shop's job.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as BOARD } from "@/app/api/jobs/route";
import { Customer, Flag, Job, JobLimit, Reading } from "@/models";
import { createShop, insertReading, INCH_LIMITS, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

type Row = {
  id: number;
  code: string;
  customer: string;
  engine: string;
  status: string;
  dueDate: string | null;
  progress: { done: number; required: number } | null;
  flags: { open: number; disposed: number };
};
type Page = { jobs: Row[]; total: number; page: number; pageSize: number; pageCount: number; shopJobs: number };

let s: TestShop;
let other: TestShop;
const made = new Map<string, number>(); // code -> id

async function board(params: Record<string, string | number> = {}, shop = s) {
  const qs = new URLSearchParams(Object.entries(params).map(([k, v]) => [k, String(v)]));
  const res = await call(BOARD as never, await asUser(shop.users.lead, "GET", `/api/jobs?${qs}`));
  return res as { status: number; body: Page & { error?: { fields?: Record<string, string> } } };
}

async function allRows(params: Record<string, string | number> = {}) {
  const first = await board({ ...params, pageSize: 100 });
  expect(first.body.total).toBeLessThanOrEqual(100);
  return first.body.jobs;
}

// Jobs of one shop: codes that sort differently as text and as numbers, two customers, statuses
// and due dates (one without), a flag on one job.
const PLAN = [
  { n: 2, status: "measuring", due: "2027-03-01", customer: "Zephyr Marine" },
  { n: 10, status: "intake", due: "2027-01-15", customer: "Alder Racing" },
  { n: 3, status: "review", due: null, customer: "Alder Racing" },
  { n: 11, status: "released", due: "2026-12-20", customer: "Zephyr Marine" },
  { n: 4, status: "closed", due: "2026-11-02", customer: "Zephyr Marine" },
  { n: 12, status: "measuring", due: "2027-02-10", customer: "100% Engines" },
] as const;

beforeAll(async () => {
  s = await createShop();
  other = await createShop();
  const customers = new Map<string, number>();
  for (const name of new Set(PLAN.map((p) => p.customer)))
    customers.set(name, (await Customer.create({ shopId: s.shop.id, name: `${name} ${s.shop.id}` })).id);
  for (const p of PLAN) {
    const job = await Job.create({
      shopId: s.shop.id,
      customerId: customers.get(p.customer)!,
      engineId: s.engine.id,
      templateId: s.template.id,
      code: `B-${p.n}`,
      title: `Board job ${p.n}`,
      unitSystem: "in",
      status: p.status,
      dueDate: p.due,
    });
    for (const [i, l] of INCH_LIMITS.entries()) await JobLimit.create({ ...l, jobId: job.id, sortOrder: i });
    made.set(job.code, job.id);
  }
  made.set(s.job.code, s.job.id);
  await Flag.create({
    shopId: s.shop.id,
    jobId: made.get("B-12")!,
    stationId: "bore/1/top/A",
    characteristic: "bore_diameter",
    value: 4.04,
    unit: "in",
    verdict: "out_of_spec",
    reason: "out_of_spec",
  });
});

describe("GET /api/jobs: who may read it", () => {
  it.each(["machinist", "inspector"] as const)("refuses the %s with 403", async (role) => {
    expect((await call(BOARD as never, await asUser(s.users[role], "GET", "/api/jobs"))).status).toBe(403);
  });

  it("refuses the signed-out with 401", async () => {
    expect((await call(BOARD as never, await asUser(null, "GET", "/api/jobs"))).status).toBe(401);
  });

  it("never shows another shop's job, whatever the filter or search", async () => {
    const mine = await board({ status: "all", pageSize: 100 });
    expect(mine.body.total).toBe(PLAN.length + 1);
    expect(mine.body.shopJobs).toBe(PLAN.length + 1);
    expect(mine.body.jobs.map((j) => j.id)).not.toContain(other.job.id);
    expect((await board({ status: "all", q: other.job.code })).body.total).toBe(0);
    const theirs = await board({ status: "all" }, other);
    expect(theirs.body.jobs.map((j) => j.id)).toEqual([other.job.id]);
  });
});

describe("GET /api/jobs: pages", () => {
  it("pages through every match once, with the total on each page", async () => {
    const seen: number[] = [];
    for (const page of [1, 2, 3]) {
      const res = await board({ status: "all", sort: "code", pageSize: 3, page });
      expect(res.body).toMatchObject({ total: 7, page, pageSize: 3, pageCount: 3 });
      expect(res.body.jobs).toHaveLength(page < 3 ? 3 : 1);
      seen.push(...res.body.jobs.map((j) => j.id));
    }
    expect(new Set(seen).size).toBe(7);
    expect((await board({ status: "all", pageSize: 3, page: 9 })).body.jobs).toEqual([]);
  });

  it.each([
    [{ page: 0 }, "page"],
    [{ pageSize: 500 }, "pageSize"],
    [{ sort: "colour" }, "sort"],
    [{ status: "lost" }, "status"],
    [{ dir: "up" }, "dir"],
    [{ q: "x".repeat(101) }, "q"],
  ])("answers 422 naming the parameter for %j", async (params, field) => {
    const res = await board(params);
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error?.fields ?? {})).toContain(field);
  });
});

describe("GET /api/jobs: filters and search", () => {
  it("shows open jobs by default, or the status asked for", async () => {
    const open = await allRows();
    expect(new Set(open.map((j) => j.status))).toEqual(new Set(["intake", "measuring", "review"]));
    expect(open).toHaveLength(5);
    expect((await allRows({ status: "released" })).map((j) => j.code)).toEqual(["B-11"]);
    expect((await allRows({ status: "closed" })).map((j) => j.code)).toEqual(["B-4"]);
  });

  it("shows only jobs with an open flag when asked", async () => {
    const rows = await allRows({ status: "all", flagged: 1 });
    expect(rows.map((j) => j.code)).toEqual(["B-12"]);
    expect(rows[0].flags).toEqual({ open: 1, disposed: 0 });
  });

  it("finds by code, title, customer or engine, in any case, taking % and _ literally", async () => {
    expect((await allRows({ status: "all", q: "b-1" })).map((j) => j.code).sort()).toEqual(["B-10", "B-11", "B-12"]);
    expect((await allRows({ status: "all", q: "ALDER" })).map((j) => j.code).sort()).toEqual(["B-10", "B-3"]);
    expect((await allRows({ status: "all", q: "100%" })).map((j) => j.code)).toEqual(["B-12"]);
    expect((await allRows({ status: "all", q: "board_job" })).length).toBe(0);
    expect((await allRows({ status: "all", q: "test v8" })).length).toBe(7);
  });
});

describe("GET /api/jobs: sorts", () => {
  const codes = async (sort: string, dir: string) =>
    (await allRows({ status: "all", sort, dir })).map((j) => j.code).filter((c) => c.startsWith("B-"));

  it("sorts codes as numbers read, both ways", async () => {
    expect(await codes("code", "asc")).toEqual(["B-2", "B-3", "B-4", "B-10", "B-11", "B-12"]);
    expect(await codes("code", "desc")).toEqual(["B-12", "B-11", "B-10", "B-4", "B-3", "B-2"]);
  });

  it("sorts by due date with undated jobs last (first when descending)", async () => {
    expect(await codes("due", "asc")).toEqual(["B-4", "B-11", "B-10", "B-12", "B-2", "B-3"]);
    expect(await codes("due", "desc")).toEqual(["B-3", "B-2", "B-12", "B-10", "B-11", "B-4"]);
  });

  it("sorts by customer, by status in the work's order, and by open flags", async () => {
    expect((await codes("customer", "asc")).slice(0, 3)).toEqual(["B-12", "B-10", "B-3"]); // a tie goes by id
    expect(await codes("status", "asc")).toEqual(["B-10", "B-2", "B-12", "B-3", "B-11", "B-4"]);
    expect((await codes("flags", "desc"))[0]).toBe("B-12");
  });

  it("sorts by progress from the kept counts, closed jobs first", async () => {
    const job = made.get("B-2")!;
    await Reading.create({ ...readingOf(job, "bore/1/top/A"), id: randomUUID() });
    const rows = (await allRows({ status: "all", sort: "progress", dir: "asc" })).filter((j) =>
      j.code.startsWith("B-"),
    );
    expect(rows[0].code).toBe("B-4");
    expect(rows[0].progress).toBeNull();
    expect(rows.at(-1)!.code).toBe("B-2");
    expect(rows.at(-1)!.progress).toEqual({ done: 1, required: 93 });
  });
});

function readingOf(jobId: number, stationId: string) {
  return {
    shopId: s.shop.id,
    jobId,
    stationId,
    characteristic: "bore_diameter",
    value: 4.0301,
    valueCanonical: 4.0301 * 25.4,
    unit: "in",
    takenBy: s.users.machinist.id,
    takenAt: new Date(),
    deviceId: "test",
  };
}

describe("GET /api/jobs: progress kept per job", () => {
  const progressOf = async (code: string) =>
    (await allRows({ status: "all", q: code })).find((j) => j.code === code)!.progress;

  it("counts again after a new reading and after a limits edit", async () => {
    // The factory's V8 and limits: 93 required stations (counted by hand in jobs.test.ts).
    expect(await progressOf(s.job.code)).toEqual({ done: 0, required: 93 });
    await insertReading(s, "bore/1/top/A", 4.0301, 1);
    expect(await progressOf(s.job.code)).toEqual({ done: 1, required: 93 });
    const old = await insertReading(s, "bore/1/top/B", 4.0301, 2);
    await insertReading(s, "bore/1/top/B", null, 3, { supersedes: old.id, skipReason: "Sleeved" });
    expect(await progressOf(s.job.code)).toEqual({ done: 1, required: 93 });
    // No torque limit any more: the 5 torque groups leave the count.
    await JobLimit.destroy({ where: { jobId: s.job.id, characteristic: "fastener_torque" } });
    expect(await progressOf(s.job.code)).toEqual({ done: 1, required: 88 });
  });

  it("shows no progress for a closed job", async () => {
    expect(await progressOf("B-4")).toBeNull();
  });
});
