// POST /api/flags/[flagId]/disposition: who may decide, what each kind needs, what is recorded
// (history row, flag state, audit before/after, change feed), and what is refused (closed flag,
// locked job, another shop's flag, bad bodies).
import { randomUUID } from "node:crypto";
import { Op } from "sequelize";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as DISPOSE } from "@/app/api/flags/[flagId]/disposition/route";
import { POST as SYNC } from "@/app/api/sync/route";
import { AuditEvent, Flag, FlagDisposition, Job, SyncChange } from "@/models";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
let a: TestShop;
let b: TestShop;

async function push(shop: TestShop, stationId: string, value: number, supersedes?: string): Promise<string> {
  const id = randomUUID();
  const reading = {
    id,
    jobId: shop.job.id,
    stationId,
    value,
    unit: "in",
    instrumentId: shop.instrument.id,
    takenAt: new Date().toISOString(),
    ...(supersedes ? { supersedes } : {}),
  };
  const res = await call(
    SYNC as never,
    await asUser(shop.users.machinist, "POST", "/api/sync", { deviceId: "test-tablet", readings: [reading] }),
  );
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return id;
}

/** A fresh out-of-spec flag at a bore station (4.04 in against a 4.0305 in maximum). */
async function newFlag(shop: TestShop, cyl: number): Promise<Flag> {
  const readingId = await push(shop, `bore/${cyl}/mid/B`, 4.04);
  return (await Flag.findOne({ where: { readingId } }))!;
}

const dispose = async (by: TestUser, id: number | string, body: unknown) =>
  call(DISPOSE as never, await asUser(by, "POST", `/api/flags/${id}/disposition`, body), { flagId: String(id) });

beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

describe("who may decide", () => {
  it.each(ROLES)("as %s", async (role) => {
    const f = await newFlag(a, 1);
    const res = await dispose(a.users[role], f.id, { kind: "measure_again" });
    expect(res.status).toBe(role === "lead" ? 201 : 403);
  });

  it("404 for another shop's flag and a junk id", async () => {
    const theirs = await newFlag(b, 1);
    expect((await dispose(a.users.lead, theirs.id, { kind: "measure_again" })).status).toBe(404);
    expect((await dispose(a.users.lead, "0", { kind: "measure_again" })).status).toBe(404);
    expect((await Flag.findByPk(theirs.id))?.state).toBe("open");
  });
});

describe("bad bodies", () => {
  it.each([
    ["no kind", {}, "kind"],
    ["an unknown kind", { kind: "scrap" }, "kind"],
    ["accept without a reason", { kind: "accept" }, "reason"],
    ["accept with a blank reason", { kind: "accept", reason: "   " }, "reason"],
    ["machine again without the operation", { kind: "machine_again" }, "operation"],
    ["machine again with a blank operation", { kind: "machine_again", operation: " " }, "operation"],
    ["a note that is not text", { kind: "measure_again", note: 5 }, "note"],
  ])("422 for %s, naming %s", async (_label, body, field) => {
    const f = await newFlag(a, 2);
    const res = await dispose(a.users.lead, f.id, body);
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]?.[0]).toBeTruthy();
    expect((await Flag.findByPk(f.id))?.state).toBe("open");
  });

  it("the accept refusal says a reason is required", async () => {
    const f = await newFlag(a, 2);
    const res = await dispose(a.users.lead, f.id, { kind: "accept", reason: "" });
    expect(res.body.error.fields.reason[0]).toMatch(/why/);
  });

  it("400 for a body that is not JSON", async () => {
    const f = await newFlag(a, 2);
    expect((await dispose(a.users.lead, f.id, "kind=accept")).status).toBe(400);
  });
});

describe("each kind is recorded with who, when and why", () => {
  it.each([
    [
      "measure_again",
      { kind: "measure_again", note: "Gauge may have rocked; re-zero on the ring" },
      null,
      "Gauge may have rocked; re-zero on the ring",
    ],
    [
      "machine_again",
      { kind: "machine_again", operation: "hone", note: "Take 0.0005 in, then re-check" },
      "hone",
      "Take 0.0005 in, then re-check",
    ],
    [
      "accept",
      { kind: "accept", reason: "  Customer accepts: race block, clearance checked with the piston maker  " },
      null,
      "Customer accepts: race block, clearance checked with the piston maker",
    ],
  ])("%s", async (kind, body, operation, why) => {
    const f = await newFlag(a, 3);
    const before = Date.now();
    const res = await dispose(a.users.lead, f.id, body);
    expect(res.status).toBe(201);
    expect(res.body.flag).toMatchObject({
      id: f.id,
      state: "disposed",
      disposition: kind,
      operation,
      dispositionReason: why,
      disposedBy: a.users.lead.name,
      verdict: "out_of_spec",
    });
    const rows = await FlagDisposition.findAll({ where: { flagId: f.id } });
    expect(rows.map((r) => ({ d: r.disposition, op: r.operation, reason: r.reason, user: r.userId }))).toEqual([
      { d: kind, op: operation, reason: why, user: a.users.lead.id },
    ]);
    expect(rows[0].createdAt.getTime()).toBeGreaterThanOrEqual(before - 1000);
    const audit = await AuditEvent.findOne({
      where: { entityType: "flag", entityId: String(f.id), action: `flag.${kind}` },
    });
    expect(audit?.userId).toBe(a.users.lead.id);
    expect(audit?.before).toMatchObject({ state: "open", disposition: null });
    expect(audit?.after).toMatchObject({ state: "disposed", disposition: kind });
    const change = await SyncChange.findOne({
      where: { entity: "flag", entityId: String(f.id), jobId: a.job.id },
      order: [["id", "DESC"]],
    });
    expect(change).not.toBeNull();
    expect(change!.createdAt.getTime()).toBeGreaterThanOrEqual(rows[0].createdAt.getTime() - 1000);
  });

  it("an operation typed by the lead (not one of the offered ones) is kept as typed", async () => {
    const f = await newFlag(a, 4);
    const res = await dispose(a.users.lead, f.id, { kind: "machine_again", operation: "sleeve cylinder" });
    expect(res.body.flag.operation).toBe("sleeve cylinder");
  });

  it("a second decision is appended; the first stays in the history", async () => {
    const f = await newFlag(a, 5);
    await dispose(a.users.lead, f.id, { kind: "measure_again" });
    const res = await dispose(a.users.lead, f.id, {
      kind: "accept",
      reason: "Re-measured twice with the master ring; within the maker's service limit",
    });
    expect(res.body.flag.disposition).toBe("accept");
    const kinds = (await FlagDisposition.findAll({ where: { flagId: f.id }, order: [["id", "ASC"]] })).map(
      (r) => r.disposition,
    );
    expect(kinds).toEqual(["measure_again", "accept"]);
  });
});

describe("refused", () => {
  it("a closed flag: 409 with words; nothing is appended", async () => {
    const f = await newFlag(a, 6);
    await push(a, "bore/6/mid/B", 4.0301, f.readingId!); // the correction is in spec: the flag closes
    expect((await Flag.findByPk(f.id))?.state).toBe("closed");
    const res = await dispose(a.users.lead, f.id, { kind: "accept", reason: "Too late" });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/closed/);
    expect(await FlagDisposition.count({ where: { flagId: f.id } })).toBe(0);
  });

  it("a released (locked) job: 409 job_locked", async () => {
    const c = await createShop();
    const f = await newFlag(c, 1);
    await Job.update({ status: "released", lockedAt: new Date() }, { where: { id: c.job.id } });
    const res = await dispose(c.users.lead, f.id, { kind: "measure_again" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("job_locked");
    expect(await FlagDisposition.count({ where: { flagId: f.id } })).toBe(0);
  });

  it("leaves other flags alone", async () => {
    const f = await newFlag(a, 7);
    const other = await Flag.count({ where: { jobId: a.job.id, state: "open", id: { [Op.ne]: f.id } } });
    await dispose(a.users.lead, f.id, { kind: "measure_again" });
    expect(await Flag.count({ where: { jobId: a.job.id, state: "open", id: { [Op.ne]: f.id } } })).toBe(other);
  });
});
