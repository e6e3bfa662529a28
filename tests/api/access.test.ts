// The shared guard every route handler goes through: roles, shop scoping and the envelope.
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { getJobOrThrow } from "@/lib/server/jobs/repo";
import { authed, parseId, readJson } from "@/lib/server/core/route";
import { createShop, insertReading } from "../support/factories";
import { asUser, call } from "../support/requests";

const adminOnly = authed(["admin"], async ({ actor }) => ({ shopId: actor.shopId }));
const jobOfMyShop = authed<{ jobId: string }>("any", async ({ actor, params }) => {
  const job = await getJobOrThrow(actor.shopId, parseId(params.jobId, "Job"));
  return { id: job.id };
});
const schema = z.object({ name: z.string().min(1, "Give the gauge a name"), count: z.number().int() });
const validated = authed("any", async ({ req }) => readJson(req, schema));

describe("authed()", () => {
  it("401 when signed out, 403 for the wrong role, 200 for the right one", async () => {
    const { users } = await createShop();
    expect((await call(adminOnly, await asUser(null, "GET", "/x"))).status).toBe(401);
    const refused = await call(adminOnly, await asUser(users.machinist, "GET", "/x"));
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe("forbidden");
    expect((await call(adminOnly, await asUser(users.admin, "GET", "/x"))).status).toBe(200);
  });

  it("answers 404 for another shop's job, the same as for one that does not exist", async () => {
    const a = await createShop();
    const b = await createShop();
    const other = await call(jobOfMyShop, await asUser(a.users.lead, "GET", "/x"), { jobId: String(b.job.id) });
    const missing = await call(jobOfMyShop, await asUser(a.users.lead, "GET", "/x"), { jobId: "99999999" });
    expect(other.status).toBe(404);
    expect(other.body).toEqual(missing.body);
    expect((await call(jobOfMyShop, await asUser(a.users.lead, "GET", "/x"), { jobId: String(a.job.id) })).status).toBe(
      200,
    );
  });

  it("400 on bad JSON, 422 with field errors on a schema failure", async () => {
    const { users } = await createShop();
    const bad = await call(validated, await asUser(users.lead, "POST", "/x", "{oops"));
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe("bad_json");
    const invalid = await call(validated, await asUser(users.lead, "POST", "/x", { name: "", count: "two" }));
    expect(invalid.status).toBe(422);
    expect(invalid.body.error.fields.name).toEqual(["Give the gauge a name"]);
    expect(invalid.body.error.fields.count).toBeDefined();
  });
});

describe("shops started with createShop stay apart", () => {
  it("ticks the first-job guide from the caller's shop only, for leads and admins", async () => {
    const { createShop: createRealShop } = await import("@/lib/server/shops/create-shop");
    const { GET: GUIDE } = await import("@/app/api/shops/guide/route");
    const { User } = await import("@/models");
    const busy = await createShop();
    await insertReading(busy, "bore/1/top/A", 4.0302, 0);
    const tag = Math.random().toString(36).slice(2, 10);
    const made = await createRealShop({
      shopName: `Apart Machine ${tag}`,
      unitSystem: "in",
      adminName: "Ida Apart",
      email: `ida-${tag}@apart.example`,
      passwordHash: "x",
      activatedAt: new Date(),
      via: "command",
    });
    const admin = (await User.findByPk(made.adminId))!;
    const fresh = { id: admin.id, shopId: admin.shopId, role: "admin" as const, name: admin.name, email: admin.email };
    const own = await call(GUIDE, await asUser(fresh, "GET", "/api/shops/guide"));
    expect(own.status).toBe(200);
    expect(own.body).toEqual({ done: { gauge: false, sheet: false, job: false, bench: false }, firstJobId: null });
    const other = await call(GUIDE, await asUser(busy.users.lead, "GET", "/api/shops/guide"));
    expect(other.body.done).toMatchObject({ job: true, bench: true });
    expect(other.body.firstJobId).not.toBeNull();
    expect((await call(GUIDE, await asUser(busy.users.machinist, "GET", "/api/shops/guide"))).status).toBe(403);
    expect((await call(GUIDE, await asUser(null, "GET", "/api/shops/guide"))).status).toBe(401);
  });
});
