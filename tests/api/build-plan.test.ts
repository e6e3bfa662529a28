// The build plan route: every role, other shops' jobs (404), bad bodies (400/422 naming the
// field), the job's unit system, locked jobs, and the saved plan read back with its units.
import { beforeAll, describe, expect, it } from "vitest";
import { GET, PUT } from "@/app/api/jobs/[jobId]/build-plan/route";
import { AuditEvent, Job } from "@/models";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
let a: TestShop;
let b: TestShop;
beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

// Test fixture (invented figures).
const plan = (over: Record<string, unknown> = {}) => ({
  lengthUnit: "in",
  bore: 4.03,
  stroke: 3.48,
  rodLength: 5.7,
  compressionHeight: 1.56,
  pistonTop: "dish",
  pistonVolumeCc: 5,
  chamberCc: 64,
  gasketBore: 4.1,
  gasketThickness: 0.041,
  deckHeight: 9.025,
  intakeLobeLift: 0.3,
  exhaustLobeLift: 0.31,
  rockerRatio: 1.5,
  intakeLash: 0.016,
  exhaustLash: 0.018,
  notes: "Mild street build",
  ...over,
});
const IN_MM = Object.fromEntries(
  (["bore", "stroke", "rodLength", "compressionHeight", "gasketBore", "gasketThickness", "deckHeight"] as const).map(
    (k) => [k, Number(((plan()[k] as number) * 25.4).toFixed(3))],
  ),
);
const IN_MM_LIFTS = { intakeLobeLift: 7.62, exhaustLobeLift: 7.874, intakeLash: 0.406, exhaustLash: 0.457 };
const get = async (by: TestUser, id: number | string) =>
  call(GET as never, await asUser(by, "GET", `/api/jobs/${id}/build-plan`), { jobId: String(id) });
const put = async (by: TestUser, id: number | string, body: unknown) =>
  call(PUT as never, await asUser(by, "PUT", `/api/jobs/${id}/build-plan`, body), { jobId: String(id) });

describe("/api/jobs/[jobId]/build-plan", () => {
  it.each(ROLES)("GET as %s", async (role) => {
    expect((await get(a.users[role], a.job.id)).status).toBe(role === "machinist" ? 403 : 200);
  });

  it.each(ROLES)("PUT as %s", async (role) => {
    expect((await put(a.users[role], a.job.id, plan())).status).toBe(role === "lead" ? 200 : 403);
  });

  it("404 for another shop's job, for GET and for PUT whatever the body", async () => {
    expect((await get(a.users.lead, b.job.id)).status).toBe(404);
    expect((await put(a.users.lead, b.job.id, plan())).status).toBe(404);
    expect((await put(a.users.lead, b.job.id, { bore: "x" })).status).toBe(404);
  });

  it("saves the plan with its units and reads it back; audited", async () => {
    const res = await put(a.users.lead, a.job.id, plan({ compressionHeight: 1.55 }));
    expect(res.status).toBe(200);
    expect(res.body.plan).toMatchObject({
      format: "tenthwise.build-plan",
      version: 1,
      lengthUnit: "in",
      volumeUnit: "cc",
      compressionHeight: 1.55,
      pistonTop: "dish",
    });
    expect(res.body.engine).toMatchObject({ cylinders: 8 });
    const stored = await Job.findByPk(a.job.id);
    expect(stored?.buildPlan).toMatchObject({ lengthUnit: "in", bore: 4.03 });
    const e = await AuditEvent.findOne({
      where: { action: "job.build_plan", entityId: String(a.job.id) },
      order: [["id", "DESC"]],
    });
    expect(e?.after).toMatchObject({ compressionHeight: 1.55 });
    expect((await get(a.users.inspector, a.job.id)).body.plan.compressionHeight).toBe(1.55);
  });

  it("accepts a plan still being worked out (empty figures)", async () => {
    const res = await put(a.users.lead, a.job.id, { lengthUnit: "in", pistonTop: "flat", bore: 4.03, stroke: null });
    expect(res.status).toBe(200);
    expect(res.body.plan.stroke).toBeNull();
  });

  it.each([
    ["a negative bore", { bore: -4.03 }, "bore"],
    ["a dish with no volume", { pistonVolumeCc: null }, "pistonVolumeCc"],
    ["a signed dome volume", { pistonTop: "dome", pistonVolumeCc: -5 }, "pistonVolumeCc"],
    ["a gasket bore under the bore", { gasketBore: 4.0 }, "gasketBore"],
    ["negative lash", { intakeLash: -0.001 }, "intakeLash"],
    ["a rocker ratio of 0", { rockerRatio: 0 }, "rockerRatio"],
    // The same plan in mm (× 25.4), so only the unit rule refuses it.
    ["mm on an inch job", { lengthUnit: "mm", ...IN_MM, ...IN_MM_LIFTS }, "lengthUnit"],
    ["a piston top we do not know", { pistonTop: "pop-up" }, "pistonTop"],
    ["an unknown field", { camDuration: 270 }, "_"],
  ])("422 for %s, naming %s", async (_w, over, field) => {
    const res = await put(a.users.lead, a.job.id, plan(over));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]?.[0]).toEqual(expect.any(String));
  });

  it("400 for a body that is not JSON", async () => {
    expect((await put(a.users.lead, a.job.id, "nope")).status).toBe(400);
  });

  it("refuses a released job with 409 job_locked", async () => {
    const s = await createShop();
    await Job.update({ status: "released", lockedAt: new Date() }, { where: { id: s.job.id } });
    const res = await put(s.users.lead, s.job.id, plan());
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("job_locked");
  });
});
