// The flag queue's every sort, both ways, over two jobs of one shop: the server's order is the one
// each sort promises (its keys, then the flag's id, all turned for the other direction), pages
// join up, and the keys kept on the flag (its job's code, when its value was judged) follow a
// job's new code and the judged reading's time. Readings arrive through POST /api/sync.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as LIST } from "@/app/api/flags/route";
import { POST as SYNC } from "@/app/api/sync/route";
import { VERDICTS } from "@/lib/domain";
import { FLAG_SORTS, type FlagListItem, type FlagSort } from "@/lib/schemas/flag";
import { FLAG_REASONS, FLAG_STATES } from "@/lib/schemas/enums";
import { Job, JobLimit } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
let second: { id: number; code: string };

type R = { stationId: string; value: number; minutesAgo: number; supersedes?: string };

async function push(jobId: number, readings: R[]): Promise<string[]> {
  const rows = readings.map((r) => ({
    id: randomUUID(),
    jobId,
    stationId: r.stationId,
    value: r.value,
    unit: "in",
    instrumentId: s.instrument.id,
    takenAt: new Date(Date.now() - r.minutesAgo * 60_000).toISOString(),
    ...(r.supersedes ? { supersedes: r.supersedes } : {}),
  }));
  const res = await call(
    SYNC as never,
    await asUser(s.users.machinist, "POST", "/api/sync", { deviceId: "sort-tablet", readings: rows }),
  );
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return rows.map((r) => r.id);
}

const list = async (q: string): Promise<FlagListItem[]> => {
  const res = await call(LIST as never, await asUser(s.users.lead, "GET", `/api/flags${q}`));
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.items;
};

// Bores over the 4.0305 in maximum, one within U of it (marginal), and cylinder 1's taper and
// out-of-round over 0.001 in (two computed flags opened in one batch, so judged at the same time).
// Figures invented for the test.
const BORES: R[] = [
  { stationId: "bore/1/top/A", value: 4.0312, minutesAgo: 50 },
  { stationId: "bore/1/mid/A", value: 4.03, minutesAgo: 50 },
  { stationId: "bore/1/bottom/A", value: 4.0299, minutesAgo: 50 },
  { stationId: "bore/1/top/B", value: 4.0301, minutesAgo: 50 },
  { stationId: "bore/1/mid/B", value: 4.03, minutesAgo: 50 },
  { stationId: "bore/1/bottom/B", value: 4.03, minutesAgo: 50 },
  { stationId: "bore/2/top/A", value: 4.03045, minutesAgo: 40 },
  { stationId: "bore/3/top/A", value: 4.0309, minutesAgo: 30 },
];

beforeAll(async () => {
  s = await createShop();
  const first = (await Job.findByPk(s.job.id))!;
  const copy = await Job.create({
    shopId: s.shop.id,
    customerId: s.customer.id,
    engineId: s.engine.id,
    templateId: s.template.id,
    code: `A-${first.code}`, // sorts before the first job's code
    title: "Second job",
    unitSystem: "in",
    status: "measuring",
  });
  for (const l of await JobLimit.findAll({ where: { jobId: first.id } }))
    await JobLimit.create({ ...l.get({ plain: true }), id: undefined, jobId: copy.id } as never);
  second = { id: copy.id, code: copy.code };
  const [top] = await push(s.job.id, BORES);
  await push(second.id, BORES.slice(0, 7));
  // A correction closes the first job's top-of-bore flag: the queue holds every state but disposed.
  await push(s.job.id, [{ stationId: "bore/1/top/A", value: 4.0302, minutesAgo: 5, supersedes: top }]);
});

// Each sort's keys in the direction that walks its index forwards, as migration 20261205010000 and
// flags/repo.ts promise; an enum sorts by its position in the column's list.
const position = (list: readonly string[]) => (v: string) => list.indexOf(v);
const KEYS: Record<FlagSort, { forward: "asc" | "desc"; keys: ((f: FlagListItem) => unknown)[] }> = {
  age: { forward: "desc", keys: [(f) => f.judgedAt] },
  job: { forward: "asc", keys: [(f) => f.jobCode, (f) => f.stationId] },
  station: { forward: "asc", keys: [(f) => f.stationId] },
  value: { forward: "asc", keys: [(f) => f.value] },
  deviation: { forward: "asc", keys: [(f) => f.deviation] },
  verdict: { forward: "desc", keys: [(f) => -position(VERDICTS)(f.verdict), (f) => f.judgedAt] },
  reason: { forward: "desc", keys: [(f) => -position(FLAG_REASONS)(f.reason), (f) => f.judgedAt] },
  state: { forward: "desc", keys: [(f) => -position(FLAG_STATES)(f.state), (f) => f.judgedAt] },
};

// SQL's order: NULL first, then by value.
const compare = (a: unknown, b: unknown) =>
  a === b ? 0 : a === null ? -1 : b === null ? 1 : (a as number | string) < (b as number | string) ? -1 : 1;

function expected(items: FlagListItem[], sort: FlagSort, dir: "asc" | "desc"): number[] {
  const { forward, keys } = KEYS[sort];
  const sign = dir === forward ? 1 : -1;
  const all = [...keys, (f: FlagListItem) => f.id];
  return [...items]
    .sort((x, y) => {
      for (const k of all) {
        const c = compare(k(x), k(y));
        if (c) return sign * c;
      }
      return 0;
    })
    .map((f) => f.id);
}

describe("the flag queue's sorts", () => {
  it("holds flags of both jobs, in two states, with ties in the judged time", async () => {
    const all = await list("?state=all&pageSize=100");
    expect(all.length).toBeGreaterThanOrEqual(9);
    expect(all.length).toBeLessThanOrEqual(16); // four pages of 4 below hold them all
    expect(new Set(all.map((f) => f.jobCode))).toEqual(new Set([s.job.code, second.code]));
    expect(new Set(all.map((f) => f.state))).toEqual(new Set(["open", "closed"]));
    expect(new Set(all.map((f) => f.reason))).toEqual(new Set(["out_of_spec", "marginal"]));
    const derived = all.filter((f) => f.derived && f.jobId === second.id);
    expect(derived).toHaveLength(2);
    expect(derived[0].judgedAt).toBe(derived[1].judgedAt);
  });

  it.each(FLAG_SORTS.flatMap((sort) => (["asc", "desc"] as const).map((dir) => [sort, dir] as const)))(
    "sort %s %s: the promised order, and pages of 4 join up to it",
    async (sort, dir) => {
      const all = await list(`?state=all&pageSize=100&sort=${sort}&dir=${dir}`);
      expect(all.map((f) => f.id)).toEqual(expected(all, sort, dir));
      const pages: number[] = [];
      for (let page = 1; page <= 4; page++)
        pages.push(...(await list(`?state=all&pageSize=4&page=${page}&sort=${sort}&dir=${dir}`)).map((f) => f.id));
      expect(pages).toEqual(all.map((f) => f.id));
    },
  );

  it("ages a reading's flag from the reading's time, a computed value's from the flag's own", async () => {
    const all = await list("?state=all&pageSize=100");
    for (const f of all.filter((x) => !x.derived)) expect(f.judgedAt).toBe(f.takenAt); // takenAt: the reading's row
    for (const f of all.filter((x) => x.derived)) expect(f.judgedAt).toBe(f.createdAt);
  });

  it("follows a job's new code", async () => {
    await Job.update({ code: `Z-${second.code}` }, { where: { id: second.id } });
    const byJob = await list(`?state=all&pageSize=100&sort=job&dir=asc`);
    const ofSecond = byJob.filter((f) => f.jobId === second.id);
    expect(ofSecond.length).toBeGreaterThan(0);
    expect(ofSecond.every((f) => f.jobCode === `Z-${second.code}`)).toBe(true);
    // Now after the first job's code, where "A-…" had put them first.
    expect(byJob.slice(-ofSecond.length).map((f) => f.jobId)).toEqual(ofSecond.map(() => second.id));
  });
});
