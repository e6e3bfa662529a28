// The job limits route: every role, other shops' jobs (404), bad bodies (400/422 naming the
// field), a stale revision and a locked job (409). What an edit does to verdicts and flags is
// in tests/integration/reevaluate.test.ts.
import { beforeAll, describe, expect, it } from "vitest";
import { GET, PUT } from "@/app/api/jobs/[jobId]/limits/route";
import { Job } from "@/models";
import { createShop, INCH_LIMITS, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
let a: TestShop;
let b: TestShop;
beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

const get = async (by: TestUser, id: number | string) =>
  call(GET as never, await asUser(by, "GET", `/api/jobs/${id}/limits`), { jobId: String(id) });
const put = async (by: TestUser, id: number | string, body: unknown) =>
  call(PUT as never, await asUser(by, "PUT", `/api/jobs/${id}/limits`, body), { jobId: String(id) });
const revision = async (id: number) => (await Job.findByPk(id))!.specRevision;
const body = async (s: TestShop, limits: unknown[] = [...INCH_LIMITS]) => ({
  specRevision: await revision(s.job.id),
  limits,
});

describe("/api/jobs/[jobId]/limits", () => {
  it.each(ROLES)("GET as %s", async (role) => {
    const res = await get(a.users[role], a.job.id);
    expect(res.status).toBe(role === "machinist" ? 403 : 200);
    if (res.status === 200) expect(res.body.limits).toHaveLength(INCH_LIMITS.length);
  });

  it.each(ROLES)("PUT as %s", async (role) => {
    expect((await put(a.users[role], a.job.id, await body(a))).status).toBe(role === "lead" ? 200 : 403);
  });

  it("404 for another shop's job, whatever the body", async () => {
    expect((await get(a.users.lead, b.job.id)).status).toBe(404);
    expect((await put(a.users.lead, b.job.id, await body(b))).status).toBe(404);
    expect((await put(a.users.lead, b.job.id, { nonsense: true })).status).toBe(404);
  });

  it.each([
    ["a limit without its maximum", [{ ...INCH_LIMITS[3], max: null }], "limits.0.max"],
    ["a pattern no station has", [{ ...INCH_LIMITS[0], stationPattern: "bore/*/low/*" }], "limits.0.stationPattern"],
    ["no limits", [], "limits"],
  ])("422 for %s, naming %s", async (_w, limits, field) => {
    const res = await put(a.users.lead, a.job.id, await body(a, limits));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]?.[0]).toEqual(expect.any(String));
  });

  it("422 without the revision edited from; 400 for a body that is not JSON", async () => {
    expect(
      (await put(a.users.lead, a.job.id, { limits: [...INCH_LIMITS] })).body.error.fields.specRevision,
    ).toBeDefined();
    expect((await put(a.users.lead, a.job.id, "{")).status).toBe(400);
  });

  it("409 when someone saved since the form was opened", async () => {
    const stale = await body(a);
    expect((await put(a.users.lead, a.job.id, stale)).status).toBe(200);
    const res = await put(a.users.lead, a.job.id, stale);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain("reload");
  });

  it("409 job_locked for a released job", async () => {
    const s = await createShop();
    await Job.update({ status: "released", lockedAt: new Date() }, { where: { id: s.job.id } });
    const res = await put(s.users.lead, s.job.id, await body(s));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("job_locked");
  });
});
