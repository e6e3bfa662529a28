// Dispositions meet reconciliation (lib/server/reconcile/reconcile.ts, run by POST /api/sync): a newer
// in-spec reading closes a decided flag and keeps its history; the tablet sees "measure again"
// through the job pack and the change feed; an acceptance stays on the record.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as DISPOSE } from "@/app/api/flags/[flagId]/disposition/route";
import { GET as DETAIL } from "@/app/api/flags/[flagId]/route";
import { GET as PACK } from "@/app/api/bench/jobs/[jobId]/route";
import { GET as FEED, POST as SYNC } from "@/app/api/sync/route";
import { Flag, FlagDisposition } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;

async function push(
  stationId: string,
  value: number,
  opts: { supersedes?: string; minutesAgo?: number } = {},
): Promise<string> {
  const id = randomUUID();
  const takenAt = new Date(Date.now() - (opts.minutesAgo ?? 0) * 60_000).toISOString();
  const reading = {
    id,
    jobId: s.job.id,
    stationId,
    value,
    unit: "in",
    instrumentId: s.instrument.id,
    takenAt,
    ...(opts.supersedes ? { supersedes: opts.supersedes } : {}),
  };
  const res = await call(
    SYNC as never,
    await asUser(s.users.machinist, "POST", "/api/sync", { deviceId: "bench-1", readings: [reading] }),
  );
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return id;
}

async function flagged(stationId: string, value: number): Promise<Flag> {
  const readingId = await push(stationId, value, { minutesAgo: 10 });
  const f = await Flag.findOne({ where: { readingId } });
  expect(f?.state).toBe("open");
  return f!;
}

async function dispose(flagId: number, body: unknown) {
  const res = await call(
    DISPOSE as never,
    await asUser(s.users.lead, "POST", `/api/flags/${flagId}/disposition`, body),
    { flagId: String(flagId) },
  );
  expect(res.status, JSON.stringify(res.body)).toBe(201);
}

const reload = async (f: Flag) => (await Flag.findByPk(f.id))!;
const history = async (f: Flag) =>
  (await FlagDisposition.findAll({ where: { flagId: f.id }, order: [["id", "ASC"]] })).map((d) => d.disposition);

beforeAll(async () => {
  s = await createShop();
});

describe("a newer in-spec reading closes a decided flag, history intact", () => {
  it("measure again → the station comes back in spec → closed by that reading", async () => {
    const f = await flagged("bore/1/top/A", 4.0312);
    await dispose(f.id, { kind: "measure_again", note: "Re-zero the gauge on the setting ring first" });
    const next = await push("bore/1/top/A", 4.0302);
    const after = await reload(f);
    expect(after).toMatchObject({
      state: "closed",
      closedByReadingId: next,
      disposition: "measure_again",
      dispositionReason: "Re-zero the gauge on the setting ring first",
      verdict: "out_of_spec",
    });
    expect(await history(f)).toEqual(["measure_again"]);
    expect(await Flag.count({ where: { jobId: s.job.id, stationId: "bore/1/top/A", state: "open" } })).toBe(0);
    const { body } = await call(DETAIL as never, await asUser(s.users.lead, "GET", `/api/flags/${f.id}`), {
      flagId: String(f.id),
    });
    expect(body.flag).toMatchObject({ state: "closed", closedByReadingId: next });
    expect(body.dispositions).toEqual([
      expect.objectContaining({ disposition: "measure_again", by: s.users.lead.name }),
    ]);
    expect(body.stations[0].readings.map((r: { id: string; current: boolean }) => [r.id, r.current])).toEqual([
      [f.readingId, false],
      [next, true],
    ]);
  });

  it("machine again (hone) → a correction after honing, in spec → closed", async () => {
    const f = await flagged("bore/2/mid/A", 4.0293);
    await dispose(f.id, { kind: "machine_again", operation: "hone" });
    const next = await push("bore/2/mid/A", 4.03, { supersedes: f.readingId! });
    expect(await reload(f)).toMatchObject({
      state: "closed",
      closedByReadingId: next,
      disposition: "machine_again",
      operation: "hone",
    });
    expect(await history(f)).toEqual(["machine_again"]);
  });

  it("a newer reading still out of spec: the decided flag closes and a new open flag asks again", async () => {
    const f = await flagged("bore/3/top/B", 4.0312);
    await dispose(f.id, { kind: "measure_again" });
    const next = await push("bore/3/top/B", 4.0311);
    expect(await reload(f)).toMatchObject({ state: "closed", closedByReadingId: next, disposition: "measure_again" });
    const fresh = await Flag.findOne({ where: { readingId: next } });
    expect(fresh).toMatchObject({ state: "open", disposition: null, verdict: "out_of_spec" });
  });
});

describe("accept keeps the verdict and the acceptance on the record", () => {
  it("stays decided while other readings of the job come in", async () => {
    const f = await flagged("bore/4/bottom/A", 4.0307);
    await dispose(f.id, {
      kind: "accept",
      reason: "Within the piston maker's service limit; customer agreed in writing",
    });
    await push("bore/5/top/A", 4.0301);
    await push("bore/6/top/A", 4.0302);
    expect(await reload(f)).toMatchObject({
      state: "disposed",
      disposition: "accept",
      verdict: "out_of_spec",
      dispositionReason: "Within the piston maker's service limit; customer agreed in writing",
    });
  });
});

describe("the tablet sees the decision", () => {
  it("measure again is in the job pack (revisit, the station) and in the change feed", async () => {
    const f = await flagged("bore/7/mid/B", 4.0312);
    await dispose(f.id, { kind: "measure_again" });
    const pack = await call(PACK as never, await asUser(s.users.machinist, "GET", `/api/bench/jobs/${s.job.id}`), {
      jobId: String(s.job.id),
    });
    expect(pack.status).toBe(200);
    const inPack = pack.body.flags.find((x: { id: number }) => x.id === f.id);
    expect(inPack).toMatchObject({ disposition: "measure_again", revisit: true, stations: ["bore/7/mid/B"] });
    const feed = await call(
      FEED as never,
      await asUser(s.users.machinist, "GET", `/api/sync?since=0&jobs=${s.job.id}`),
    );
    expect(feed.status).toBe(200);
    expect(feed.body.flags.find((x: { id: number }) => x.id === f.id)).toMatchObject({
      state: "disposed",
      disposition: "measure_again",
      revisit: true,
    });
  });

  it("an accepted flag is not a revisit", async () => {
    const f = await flagged("bore/8/mid/B", 4.0312);
    await dispose(f.id, { kind: "accept", reason: "Liner to be fitted; bore size is not used" });
    const pack = await call(PACK as never, await asUser(s.users.machinist, "GET", `/api/bench/jobs/${s.job.id}`), {
      jobId: String(s.job.id),
    });
    expect(pack.body.flags.find((x: { id: number }) => x.id === f.id)).toMatchObject({
      revisit: false,
      disposition: "accept",
    });
  });
});
