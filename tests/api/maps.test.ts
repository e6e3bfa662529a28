// GET /api/jobs/[jobId]/maps: roles, another shop's job, the engine's layout (cylinders, mains,
// crankpins, deck corners), figures with limits and verdicts, taper and out-of-round from the core.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { GET } from "@/app/api/jobs/[jobId]/maps/route";
import { POST as SYNC } from "@/app/api/sync/route";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
const READERS = new Set(["lead", "inspector"]);
let a: TestShop;
let b: TestShop;

const maps = async (by: TestUser, jobId: number | string) =>
  call(GET as never, await asUser(by, "GET", `/api/jobs/${jobId}/maps`), { jobId: String(jobId) });

async function push(shop: TestShop, readings: { stationId: string; value: number; unit?: string }[]) {
  const rows = readings.map((r) => ({
    id: randomUUID(),
    jobId: shop.job.id,
    stationId: r.stationId,
    value: r.value,
    unit: r.unit ?? "in",
    instrumentId: shop.instrument.id,
    takenAt: new Date().toISOString(),
  }));
  const res = await call(
    SYNC as never,
    await asUser(shop.users.machinist, "POST", "/api/sync", { deviceId: "maps-test", readings: rows }),
  );
  expect(res.status, JSON.stringify(res.body)).toBe(200);
}

beforeAll(async () => {
  a = await createShop();
  b = await createShop();
  // Invented figures: cylinder 1 leans on axis A (top 4.0312, bottom 4.0299), B stays near 4.0300.
  await push(a, [
    { stationId: "bore/1/top/A", value: 4.0312 },
    { stationId: "bore/1/mid/A", value: 4.03 },
    { stationId: "bore/1/bottom/A", value: 4.0299 },
    { stationId: "bore/1/top/B", value: 4.0301 },
    { stationId: "bore/1/mid/B", value: 4.03 },
    { stationId: "bore/1/bottom/B", value: 4.03 },
    { stationId: "bore/2/top/A", value: 102.362, unit: "mm" },
  ]);
});

describe("GET /api/jobs/[jobId]/maps", () => {
  it.each(ROLES)("as %s; another shop's job is 404", async (role) => {
    expect((await maps(a.users[role], a.job.id)).status).toBe(READERS.has(role) ? 200 : 403);
    expect((await maps(a.users[role], b.job.id)).status).toBe(READERS.has(role) ? 404 : 403);
    expect((await maps(a.users[role], "x")).status).toBe(READERS.has(role) ? 404 : 403);
  });

  it("follows the engine: a V8 with 5 mains has 8 bores, 5 mains, 4 crankpins and 4 deck corners", async () => {
    const { body } = await maps(a.users.lead, a.job.id);
    expect(body.unit).toBe("in");
    expect(body.bores.map((p: { label: string }) => p.label)).toEqual(
      [1, 2, 3, 4, 5, 6, 7, 8].map((n) => `Cylinder ${n}`),
    );
    expect(body.mains).toHaveLength(5);
    expect(body.rods).toHaveLength(4);
    expect(body.bores[0].rows.map((r: { at: string }) => r.at)).toEqual(["top", "mid", "bottom"]);
    expect(body.mains[0].rows.map((r: { at: string }) => r.at)).toEqual(["front", "rear"]);
    expect(body.deck.map((d: { bank: string; corner: string }) => `${d.bank}/${d.corner}`)).toEqual([
      "left/front",
      "left/rear",
      "right/front",
      "right/rear",
    ]);
  });

  it("each figure carries its limits and verdict; taper and out-of-round come from the core", async () => {
    const { body } = await maps(a.users.inspector, a.job.id);
    const c1 = body.bores[0];
    // Limits: nominal 4.03 in ± 0.0005 in (the test spec).
    expect(c1.rows[0].A).toEqual({ value: 4.0312, min: 4.0295, max: 4.0305, verdict: "out_of_spec" });
    expect(c1.rows[1].B).toEqual({ value: 4.03, min: 4.0295, max: 4.0305, verdict: "in_spec" });
    // Taper = max − min on one axis (worst axis): 4.0312 − 4.0299 = 0.0013 in; out-of-round =
    // |A − B| at one depth (worst depth): 4.0312 − 4.0301 = 0.0011 in. Common practice, as in
    // engine service manuals; both over the 0.001 in maximum.
    expect(c1.taper).toMatchObject({ value: 0.0013, max: 0.001, verdict: "out_of_spec", missing: 0 });
    expect(c1.outOfRound).toMatchObject({ value: 0.0011, max: 0.001, verdict: "out_of_spec" });
    const empty = body.bores[3];
    // A bore not read yet still shows its limit lines (findLimit/resolveLimit through the core).
    expect(empty.rows[0].A).toEqual({ value: null, min: 4.0295, max: 4.0305, verdict: null });
    expect(empty.taper).toMatchObject({ value: null, missing: 6 });
  });

  it("a figure entered in mm is shown in the job's inch: 102.362 mm = 4.03 in (25.4 mm per in exactly, NIST SP 811 B.8)", async () => {
    const { body } = await maps(a.users.lead, a.job.id);
    expect(body.bores[1].rows[0].A).toMatchObject({ value: 4.03, verdict: "in_spec" });
    expect(body.bores[1].taper.missing).toBe(5);
  });
});
