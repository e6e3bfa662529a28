// GET /api/bench/jobs and GET /api/bench/jobs/:jobId (the tablet's offline job pack).
import { beforeAll, describe, expect, it } from "vitest";
import { benchRoute } from "@/lib/domain";
import { getSequelize } from "@/lib/server/core/db";
import { GET as LIST } from "@/app/api/bench/jobs/route";
import { GET as PACK } from "@/app/api/bench/jobs/[jobId]/route";
import { Job } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { push, reading } from "./sync-fixtures";

let s: TestShop;
let other: TestShop;
const pack = async (user: TestShop["users"]["machinist"] | null, id: string) =>
  call(PACK, await asUser(user, "GET", `/api/bench/jobs/${id}`), { jobId: id });

beforeAll(async () => {
  s = await createShop();
  other = await createShop();
  await push(s.users.machinist, [reading(s.job.id, "bore/1/top/A", 4.0312), reading(s.job.id, "bore/1/mid/A", 4.0301)]);
});

describe("GET /api/bench/jobs", () => {
  it("lists the shop's open jobs with progress, not other shops' or released ones", async () => {
    const res = await call(LIST, await asUser(s.users.machinist, "GET", "/api/bench/jobs"));
    expect(res.status).toBe(200);
    expect(res.body.jobs).toHaveLength(1);
    expect(res.body.jobs[0]).toMatchObject({
      id: s.job.id,
      code: s.job.code,
      status: "measuring",
      locked: false,
      lockReason: null,
      // Both readings are at required bore stations; 93 required on the factory V8 (the board agrees, jobs.test.ts).
      progress: { done: 2, required: 93 },
      openFlags: 1,
      engine: "Test V8",
    });
    getSequelize();
    await Job.update({ status: "released", lockedAt: new Date() }, { where: { id: other.job.id } });
    const theirs = await call(LIST, await asUser(other.users.lead, "GET", "/api/bench/jobs"));
    expect(theirs.body.jobs).toEqual([]);
  });
  it("401 signed out, 403 for inspector and admin", async () => {
    expect((await call(LIST, await asUser(null, "GET", "/api/bench/jobs"))).status).toBe(401);
    expect((await call(LIST, await asUser(s.users.inspector, "GET", "/api/bench/jobs"))).status).toBe(403);
    expect((await call(LIST, await asUser(s.users.admin, "GET", "/api/bench/jobs"))).status).toBe(403);
  });
});

describe("GET /api/bench/jobs/:jobId", () => {
  it("packs job, engine shape, spec, route, gauges, readings, unclosed flags and a cursor", async () => {
    const res = await pack(s.users.machinist, String(s.job.id));
    expect(res.status).toBe(200);
    const p = res.body;
    expect(p.job).toMatchObject({ id: s.job.id, code: s.job.code, unitSystem: "in", locked: false, specRevision: 1 });
    expect(p.shape).toMatchObject({ cylinders: 8, layout: "v", mains: 5, unitSystem: "inch" });
    expect(p.spec.map((l: { characteristic: string }) => l.characteristic)).toContain("bore_diameter");
    expect(p.route.total).toBe(benchRoute(p.shape).total);
    expect(p.instruments).toHaveLength(Object.keys(s.gauges).length + 1);
    expect(p.instruments).toContainEqual(
      expect.objectContaining({
        id: s.instrument.id,
        kind: "bore_gauge_digital",
        unit: "in",
        resolution: 0.0001,
        expandedU: 0.0001,
        rangeMin: 2,
        rangeMax: 6,
        calibrationDue: "2027-06-01",
        dialPlusMeansSmaller: true,
      }),
    );
    expect(p.readings).toHaveLength(2);
    expect(p.readings.find((r: { stationId: string }) => r.stationId === "bore/1/top/A")).toMatchObject({
      stationId: "bore/1/top/A",
      value: 4.0312,
      unit: "in",
      verdict: "out_of_spec",
      supersededBy: null,
    });
    expect(p.flags).toEqual([
      expect.objectContaining({ stationId: "bore/1/top/A", state: "open", stations: ["bore/1/top/A"], revisit: false }),
    ]);
    expect(p.cursor).toMatch(/^\d+$/);
  });
  it("404 for another shop's job and for junk ids, 401/403 as the list", async () => {
    for (const id of [String(other.job.id), "abc", "0", "99999999"]) {
      const res = await pack(s.users.machinist, id);
      expect(res.status).toBe(404);
      expect(res.body.error).toEqual({ code: "not_found", message: "Job not found" });
    }
    expect((await pack(null, String(s.job.id))).status).toBe(401);
    expect((await pack(s.users.inspector, String(s.job.id))).status).toBe(403);
  });
  it("a released job still packs, marked locked with the reason", async () => {
    const res = await pack(other.users.machinist, String(other.job.id));
    expect(res.status).toBe(200);
    expect(res.body.job).toMatchObject({ status: "released", locked: true });
    expect(res.body.job.lockReason).toMatch(
      /readings are locked\. Only a lead can reopen it, with a reason, from the job page or the release page/,
    );
  });
});
