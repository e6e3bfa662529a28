// Bearing shells on a job's shelf and its housing bores: every role, another shop's job (404),
// field errors that say what to fix, a set in use refused on delete, and one audit event per change.
import { beforeAll, describe, expect, it } from "vitest";
import { GET } from "@/app/api/jobs/[jobId]/bearings/route";
import { POST } from "@/app/api/jobs/[jobId]/bearings/shells/route";
import { DELETE, PUT } from "@/app/api/jobs/[jobId]/bearings/shells/[shellId]/route";
import { PUT as PUT_HOUSINGS } from "@/app/api/jobs/[jobId]/bearings/housings/route";
import { AuditEvent, BearingPoint } from "@/models";
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
const standard = (over: Record<string, unknown> = {}) => ({
  series: "Shop series A",
  role: "main",
  step: "standard",
  wallSource: "nominal",
  wall: 0.0622,
  halvesUpper: 5,
  halvesLower: 5,
  ...over,
});
const url = (id: number) => `/api/jobs/${id}/bearings`;
const get = async (by: TestUser, id: number) =>
  call(GET as never, await asUser(by, "GET", url(id)), { jobId: String(id) });
const post = async (by: TestUser, id: number, body: unknown) =>
  call(POST as never, await asUser(by, "POST", `${url(id)}/shells`, body), { jobId: String(id) });
const put = async (by: TestUser, id: number, shellId: number, body: unknown) =>
  call(PUT as never, await asUser(by, "PUT", `${url(id)}/shells/${shellId}`, body), {
    jobId: String(id),
    shellId: String(shellId),
  });
const del = async (by: TestUser, id: number, shellId: number) =>
  call(DELETE as never, await asUser(by, "DELETE", `${url(id)}/shells/${shellId}`), {
    jobId: String(id),
    shellId: String(shellId),
  });
const housings = async (by: TestUser, id: number, body: unknown) =>
  call(PUT_HOUSINGS as never, await asUser(by, "PUT", `${url(id)}/housings`, body), { jobId: String(id) });

describe("/api/jobs/[jobId]/bearings", () => {
  it.each(ROLES)("as %s: GET the view, POST a set", async (role) => {
    expect((await get(a.users[role], a.job.id)).status).toBe(role === "machinist" ? 403 : 200);
    expect((await post(a.users[role], a.job.id, standard())).status).toBe(role === "lead" ? 200 : 403);
  });

  it("lists the V8's five mains and eight rods, and the set in the job's unit", async () => {
    const res = await get(a.users.lead, a.job.id);
    const view = res.body as { points: { point: string }[]; shells: { unit: string; wall: number }[] };
    expect(view.points.map((p) => p.point)).toEqual([
      ...[1, 2, 3, 4, 5].map((m) => `main/${m}`),
      ...[1, 2, 3, 4, 5, 6, 7, 8].map((r) => `rod/${r}`),
    ]);
    expect(view.shells[0]).toMatchObject({ unit: "in", wall: 0.0622 });
  });

  it("404 for another shop's job whatever the body", async () => {
    expect((await get(a.users.lead, b.job.id)).status).toBe(404);
    expect((await post(a.users.lead, b.job.id, {})).status).toBe(404);
  });

  it("422 naming what to fix", async () => {
    const cases: [Record<string, unknown>, string][] = [
      [standard({ series: "" }), "series"],
      [standard({ step: "thicker", wallSource: null, wall: null }), "stepAmount"],
      [standard({ step: "graded" }), "grade"],
      [standard({ wallSource: "range", wall: null, wallMin: 0.0625, wallMax: 0.062 }), "wallMax"],
      [standard({ wallSource: "measured", wall: null, wallUpper: 0.0621 }), "wallLower"],
      [standard({ halvesUpper: -1 }), "halvesUpper"],
      [standard({ wall: 0.00000001 }), "wall"],
      // A wall in mm typed into an inch job, and a slipped decimal point: a shell wall of an
      // engine bearing is a few hundredths of an inch (from memory: about 0.06 in / 1.5 mm).
      [standard({ wall: 1.5 }), "wall"],
      [
        standard({ wallSource: "measured", wall: null, wallUpper: 0.0062, wallLower: 0.0621, wallGaugeId: 1 }),
        "wallUpper",
      ],
    ];
    for (const [body, field] of cases) {
      const res = await post(a.users.lead, a.job.id, body);
      expect(res.status).toBe(422);
      const out = res.body as { error: { fields: Record<string, string[]> } };
      expect(Object.keys(out.error.fields)).toContain(field);
    }
  });

  it("edits and removes a set, refusing while the saved choice uses it; one audit event each", async () => {
    const view = (await post(a.users.lead, a.job.id, standard({ series: "Edit me" }))).body as {
      shells: { id: number; series: string }[];
    };
    const id = view.shells.find((s) => s.series === "Edit me")!.id;
    expect((await put(a.users.lead, a.job.id, id, standard({ series: "Edited", halvesUpper: 3 }))).status).toBe(200);
    await BearingPoint.create({ shopId: a.shop.id, jobId: a.job.id, point: "main/1", upperShellId: id });
    const refused = await del(a.users.lead, a.job.id, id);
    expect(refused.status).toBe(409);
    expect((refused.body as { error: { message: string } }).error.message).toMatch(/main\/1/);
    await BearingPoint.destroy({ where: { jobId: a.job.id, point: "main/1" } });
    expect((await del(a.users.lead, a.job.id, id)).status).toBe(200);
    const actions = (await AuditEvent.findAll({ where: { shopId: a.shop.id } })).map((e) => e.action);
    expect(actions.filter((x) => x === "bearings.shell_edit")).toHaveLength(1);
    expect(actions.filter((x) => x === "bearings.shell_remove")).toHaveLength(1);
  });

  it("saves housing bores with their gauge and the thrust main; refuses a rod as thrust", async () => {
    const body = {
      points: [
        { point: "main/3", housingBore: 2.6412, housingGaugeId: a.instrument.id, thrust: true },
        { point: "rod/1", housingBore: 2.2251, housingGaugeId: a.instrument.id },
      ],
    };
    expect((await housings(a.users.lead, a.job.id, body)).status).toBe(200);
    const view = (await get(a.users.lead, a.job.id)).body as {
      points: { point: string; housingBore: number | null; role: string }[];
    };
    expect(view.points.find((p) => p.point === "main/3")).toMatchObject({ housingBore: 2.6412, role: "thrust" });
    const bad = await housings(a.users.lead, a.job.id, { points: [{ ...body.points[1], thrust: true }] });
    expect(bad.status).toBe(422);
    const other = await housings(a.users.lead, a.job.id, {
      points: [{ ...body.points[0], housingGaugeId: b.instrument.id }],
    });
    expect(other.status).toBe(422);
  });
});
