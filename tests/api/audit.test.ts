// The audit trail: filterable and paged through GET /api/audit, before/after as readable
// changes. (That the app's database account cannot rewrite it: tests/integration/db-rights.test.ts.)
import { beforeAll, describe, expect, it } from "vitest";
import { GET as audit } from "@/app/api/audit/route";
import { GET as facets } from "@/app/api/audit/facets/route";
import { POST as sign } from "@/app/api/release/[jobId]/route";
import { POST as reopen } from "@/app/api/release/[jobId]/reopen/route";
import { recordAudit } from "@/lib/server/log/repo";
import { getSequelize } from "@/lib/server/core/db";
import { createShop, TEST_PASSWORD, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { completeJob } from "./release-fixtures";

let s: TestShop;
let other: TestShop;
const list = async (query: string, who = s.users.lead) => call(audit, await asUser(who, "GET", `/api/audit?${query}`));

beforeAll(async () => {
  s = await createShop();
  other = await createShop();
  await completeJob(s);
  const p = { jobId: String(s.job.id) };
  expect(
    (
      await call(
        sign,
        await asUser(s.users.inspector, "POST", `/api/release/${s.job.id}`, {
          fullName: s.users.inspector.name,
          password: TEST_PASSWORD,
        }),
        p,
      )
    ).status,
  ).toBe(201);
  expect(
    (
      await call(
        reopen,
        await asUser(s.users.lead, "POST", `/api/release/${s.job.id}/reopen`, {
          reason: "Main cap torque to be re-checked",
        }),
        p,
      )
    ).status,
  ).toBe(200);
  // Events of other kinds, written the way other features write them.
  await getSequelize().transaction(async (t) => {
    await recordAudit(t, {
      shopId: s.shop.id,
      userId: s.users.lead.id,
      action: "job.update",
      entityType: "job",
      entityId: s.job.id,
      before: { title: "Old", dueDate: null },
      after: { title: "New", dueDate: "2027-01-04" },
    });
    await recordAudit(t, {
      shopId: s.shop.id,
      userId: s.users.admin.id,
      action: "user.invited",
      entityType: "user",
      entityId: s.users.machinist.id,
      after: { name: "Rosa", role: "machinist" },
    });
    await recordAudit(t, {
      shopId: other.shop.id,
      userId: other.users.lead.id,
      action: "job.update",
      entityType: "job",
      entityId: other.job.id,
      after: { title: "Not yours" },
    });
  });
});

describe("GET /api/audit", () => {
  it("filters by job, action, user and entity, newest first, with readable changes", async () => {
    const byJob = await list(`job=${s.job.id}`);
    expect(byJob.status).toBe(200);
    expect(byJob.body.events.map((e: { action: string }) => e.action)).toEqual([
      "job.update",
      "release.void",
      "release.sign",
    ]);
    expect(byJob.body.events.every((e: { jobCode: string }) => e.jobCode === s.job.code)).toBe(true);
    const update = byJob.body.events[0];
    expect(update.userName).toBe(s.users.lead.name);
    expect(update.changes).toEqual([
      { path: "title", label: "Title", kind: "changed", before: "Old", after: "New" },
      { path: "dueDate", label: "Due date", kind: "changed", before: "null", after: "2027-01-04" },
    ]);
    const voided = byJob.body.events[1];
    expect(voided.changes).toContainEqual({
      path: "jobStatus",
      label: "Job status",
      kind: "changed",
      before: "released",
      after: "review",
    });
    expect(voided.changes).toContainEqual({
      path: "voidReason",
      label: "Reason for voiding",
      kind: "added",
      before: null,
      after: "Main cap torque to be re-checked",
    });

    expect((await list("action=release.sign")).body.events).toHaveLength(1);
    expect((await list(`user=${s.users.admin.id}`)).body.events.map((e: { action: string }) => e.action)).toEqual([
      "user.invited",
    ]);
    expect((await list("entity=release")).body.total).toBe(2);
  });

  it("pages on the server and filters by date range (UTC days, inclusive)", async () => {
    const p1 = await list("pageSize=2&page=1");
    expect(p1.body).toMatchObject({ page: 1, pageSize: 2, total: 4, pages: 2 });
    const p2 = await list("pageSize=2&page=2");
    expect(p2.body.events).toHaveLength(2);
    const ids = [...p1.body.events, ...p2.body.events].map((e: { id: number }) => e.id);
    expect(new Set(ids).size).toBe(4);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    const today = new Date().toISOString().slice(0, 10);
    expect((await list(`from=${today}&to=${today}`)).body.total).toBe(4);
    expect((await list("from=2001-01-01&to=2001-12-31")).body.total).toBe(0);
  });

  it("never shows another shop's events", async () => {
    const mine = await list("pageSize=100");
    expect(
      mine.body.events.some(
        (e: { action: string; entityId: string }) => e.entityId === String(other.job.id) && e.action === "job.update",
      ),
    ).toBe(false);
    expect((await list(`job=${other.job.id}`)).body.total).toBe(0);
  });

  it("refuses bad filters with field errors that say what to fix", async () => {
    const dates = await list("from=2026-12-05&to=2026-12-01");
    expect(dates.status).toBe(422);
    expect(dates.body.error.fields.to).toEqual(["The end date is before the start date; swap them"]);
    const res = await list("page=0&job=abc&from=yesterday");
    expect(res.status).toBe(422);
    expect(res.body.error.fields.page).toEqual(["Pages start at 1"]);
    expect(res.body.error.fields.from).toEqual(["From must be a date like 2026-12-01"]);
    expect(res.body.error.fields.job).toEqual(["Job must be a number"]);
  });

  it.each([
    { role: "lead", status: 200 },
    { role: "inspector", status: 200 },
    { role: "admin", status: 200 },
    { role: "machinist", status: 403 },
  ] as const)("$role gets $status (list and facets)", async ({ role, status }) => {
    expect((await list("", s.users[role])).status).toBe(status);
    expect((await call(facets, await asUser(s.users[role], "GET", "/api/audit/facets"))).status).toBe(status);
  });

  it("offers the shop's own actions, entities, people and jobs as filter values", async () => {
    const res = await call(facets, await asUser(s.users.inspector, "GET", "/api/audit/facets"));
    expect(res.body.actions).toEqual(["job.update", "release.sign", "release.void", "user.invited"]);
    expect(res.body.entities).toEqual(["job", "release", "user"]);
    expect(res.body.jobs).toEqual([{ id: s.job.id, code: s.job.code, title: expect.any(String) }]);
    expect(res.body.users).toHaveLength(4);
  });
});
