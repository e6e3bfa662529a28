// Jobs board, create and edit: every role, other shops' ids (404), bad bodies (400/422 with
// the field named), the template snapshot, status moves, locked jobs and the audit trail.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as BOARD, POST } from "@/app/api/jobs/route";
import { GET as ONE, PATCH } from "@/app/api/jobs/[jobId]/route";
import { GET as CUSTOMERS, POST as NEW_CUSTOMER } from "@/app/api/customers/route";
import { AuditEvent, Job, JobLimit, Reading, SpecLimit, SyncChange } from "@/models";
import { createShop, insertReading, INCH_LIMITS, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
let a: TestShop;
let b: TestShop;

beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

const engine = (over: Record<string, unknown> = {}) => ({
  description: "Small-block V8, 0.030 in over",
  cylinders: 8,
  layout: "v",
  mains: 5,
  valvesPerCylinder: 2,
  ringsPerPiston: 3,
  boltsPerRod: 2,
  nominalBore: 4.03,
  nominalStroke: 3.48,
  blockMaterial: "greyCastIron",
  pistonMaterial: "aluminium356",
  blockSerial: "BLK-1",
  crankSerial: null,
  headSerials: "",
  fuel: "gasoline",
  ...over,
});
const body = (s: TestShop, over: Record<string, unknown> = {}) => ({
  code: `J-${randomUUID().slice(0, 6)}`,
  title: "Marine V8 freshen-up",
  customer: { mode: "existing", id: s.customer.id },
  engine: engine(),
  unitSystem: "in",
  templateId: s.template.id,
  dueDate: "2027-02-01",
  status: "intake",
  notes: "",
  ...over,
});

const create = async (by: TestUser | null, b0: unknown) =>
  call(POST as never, await asUser(by, "POST", "/api/jobs", b0));
const patch = async (by: TestUser, id: number | string, b0: unknown) =>
  call(PATCH as never, await asUser(by, "PATCH", `/api/jobs/${id}`, b0), { jobId: String(id) });
const one = async (by: TestUser, id: number | string) =>
  call(ONE as never, await asUser(by, "GET", `/api/jobs/${id}`), { jobId: String(id) });

/** The edit body of an existing job (from its detail), with changes on top. */
async function editBody(id: number, over: Record<string, unknown> = {}) {
  const d = (await one(a.users.lead, id)).body;
  return {
    code: d.job.code,
    title: d.job.title,
    customer: { mode: "existing", id: d.customer.id },
    engine: d.engine,
    unitSystem: d.job.unitSystem,
    dueDate: d.job.dueDate ?? "",
    status: d.job.status,
    notes: d.job.notes ?? "",
    ...over,
  };
}

describe("GET /api/jobs (the board)", () => {
  it.each(ROLES)("as %s", async (role) => {
    const res = await call(BOARD as never, await asUser(a.users[role], "GET", "/api/jobs"));
    expect(res.status).toBe(role === "lead" || role === "admin" ? 200 : 403);
    if (res.status === 200) expect(res.body.jobs.every((j: { id: number }) => j.id !== b.job.id)).toBe(true);
  });

  it("refuses the signed-out with 401", async () => {
    expect((await call(BOARD as never, await asUser(null, "GET", "/api/jobs"))).status).toBe(401);
  });

  it("counts required stations done from current readings, and open flags", async () => {
    // The factory's V8 and limits, counted by hand: bore_diameter is required on every bore
    // station (8 cylinders × 3 depths × 2 axes = 48) and fastener_torque on every torque group
    // (the core's 5 default groups); the required main oil clearance needs both of its inputs,
    // main bearing bores and main journals (5 mains × 2 ends × 2 axes = 20 each): 93 in all.
    // Bore taper and out-of-round need the bore stations already counted.
    const s = await createShop();
    const add = (stationId: string, value: number | null, min: number, extra: Record<string, unknown> = {}) =>
      insertReading(s, stationId, value, min, extra);
    await add("bore/1/top/A", 4.0301, 1);
    const old = await add("bore/1/top/B", 4.0301, 2);
    await add("bore/1/top/B", 4.0302, 3, { supersedes: old.id });
    await add("bore/2/top/A", 4.0301, 4);
    await add("bore/2/top/A", null, 5, { skipReason: "Cylinder sleeved later" }); // the latest is a skip: not done
    await add("skirt/1", 4.0285, 6); // no limit on the job: not required, not counted
    const res = await call(BOARD as never, await asUser(s.users.lead, "GET", "/api/jobs"));
    const row = res.body.jobs.find((j: { id: number }) => j.id === s.job.id);
    expect(row.progress).toEqual({ done: 2, required: 93 });
    expect(row.flags).toEqual({ open: 0, disposed: 0 });
  });
});

describe("POST /api/jobs", () => {
  it.each(ROLES)("as %s", async (role) => {
    const res = await create(a.users[role], body(a));
    expect(res.status).toBe(role === "lead" ? 201 : 403);
  });

  it("snapshots the template's limits into the job, audits it and puts it on the change feed", async () => {
    const res = await create(
      a.users.lead,
      body(a, { customer: { mode: "new", name: "Tamsin Ledger", email: "tamsin@example.net", phone: "" } }),
    );
    expect(res.status).toBe(201);
    const id = res.body.id;
    const [limits, template] = await Promise.all([
      JobLimit.findAll({ where: { jobId: id }, order: [["sortOrder", "ASC"]] }),
      SpecLimit.findAll({ where: { templateId: a.template.id }, order: [["sortOrder", "ASC"]] }),
    ]);
    expect(
      limits.map((l) => [l.characteristic, l.stationPattern, l.limitType, l.unit, l.nominal, l.min, l.max, l.required]),
    ).toEqual(
      template.map((l) => [
        l.characteristic,
        l.stationPattern,
        l.limitType,
        l.unit,
        l.nominal,
        l.min,
        l.max,
        l.required,
      ]),
    );
    expect(limits).toHaveLength(INCH_LIMITS.length);
    const job = await Job.findByPk(id);
    expect(job).toMatchObject({ status: "intake", templateId: a.template.id, specRevision: 1, dueDate: "2027-02-01" });
    const audit = await AuditEvent.findOne({ where: { action: "job.create", entityId: String(id) } });
    expect(audit?.after).toMatchObject({
      templateId: a.template.id,
      limitCount: INCH_LIMITS.length,
      engine: { cylinders: 8, blockSerial: "BLK-1", headSerials: null },
    });
    expect(await SyncChange.count({ where: { jobId: id, entity: "job" } })).toBe(1);
    const detail = await one(a.users.lead, id);
    expect(detail.body.customer.name).toBe("Tamsin Ledger");
  });

  it.each([
    ["a V8 with 7 cylinders", { engine: engine({ cylinders: 7 }) }, "engine.cylinders"],
    ["no description", { engine: engine({ description: " " }) }, "engine.description"],
    ["an unknown material", { engine: engine({ blockMaterial: "cheese" }) }, "engine.blockMaterial"],
    ["6 valves per cylinder", { engine: engine({ valvesPerCylinder: 6 }) }, "engine.valvesPerCylinder"],
    ["a negative bore", { engine: engine({ nominalBore: -4 }) }, "engine.nominalBore"],
    ["status released", { status: "released" }, "status"],
    ["a date that does not exist", { dueDate: "2027-02-30" }, "dueDate"],
    ["a code with spaces", { code: "KF 1" }, "code"],
    ["no template", { templateId: undefined }, "templateId"],
    ["a new customer with no name", { customer: { mode: "new", name: "" } }, "customer.name"],
    ["an unknown field", { colour: "red" }, "_"],
  ])("422 for %s, naming %s", async (_what, over, field) => {
    const res = await create(a.users.lead, body(a, over));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]?.[0]).toEqual(expect.any(String));
  });

  it("400 for a body that is not JSON", async () => {
    const res = await create(a.users.lead, "{not json");
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("bad_json");
  });

  it("422 for another shop's template or customer, without saying it exists", async () => {
    const t = await create(a.users.lead, body(a, { templateId: b.template.id }));
    expect(t.status).toBe(422);
    expect(t.body.error.fields.templateId).toBeDefined();
    const c = await create(a.users.lead, body(a, { customer: { mode: "existing", id: b.customer.id } }));
    expect(c.status).toBe(422);
    expect(c.body.error.fields["customer.id"]).toBeDefined();
  });

  it("409 naming the code when it is taken", async () => {
    const res = await create(a.users.lead, body(a, { code: a.job.code }));
    expect(res.status).toBe(409);
    expect(res.body.error.fields.code[0]).toContain(a.job.code);
  });
});

describe("GET and PATCH /api/jobs/[jobId]", () => {
  it.each(ROLES)("GET as %s", async (role) => {
    expect((await one(a.users[role], a.job.id)).status).toBe(role === "machinist" ? 403 : 200);
  });

  it.each([
    ["another shop's job", () => b.job.id],
    ["a junk id", () => "abc"],
    ["no such job", () => 99999999],
  ])("404 for %s", async (_w, id) => {
    expect((await one(a.users.lead, id())).status).toBe(404);
    expect((await patch(a.users.lead, id(), { title: "x" })).status).toBe(404);
  });

  it("PATCH another shop's job with a valid body is 404", async () => {
    const res = await patch(a.users.lead, b.job.id, await editBody(a.job.id));
    expect(res.status).toBe(404);
  });

  it.each(ROLES)("PATCH as %s", async (role) => {
    const res = await patch(a.users[role], a.job.id, await editBody(a.job.id));
    expect(res.status).toBe(role === "lead" ? 200 : 403);
  });

  it("moves the status intake → measuring → review, audited with before and after", async () => {
    const created = await create(a.users.lead, body(a));
    const id = created.body.id;
    for (const status of ["measuring", "review"]) {
      const res = await patch(a.users.lead, id, await editBody(id, { status }));
      expect(res.status).toBe(200);
      expect(res.body.job.status).toBe(status);
    }
    const events = await AuditEvent.findAll({
      where: { action: "job.status", entityId: String(id) },
      order: [["id", "ASC"]],
    });
    expect(
      events.map((e) => [(e.before as { status: string }).status, (e.after as { status: string }).status]),
    ).toEqual([
      ["intake", "measuring"],
      ["measuring", "review"],
    ]);
  });

  it("refuses a released job with 409 job_locked", async () => {
    const created = await create(a.users.lead, body(a));
    await Job.update({ status: "released", lockedAt: new Date() }, { where: { id: created.body.id } });
    const res = await patch(a.users.lead, created.body.id, await editBody(created.body.id, { status: "review" }));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("job_locked");
  });

  it("keeps the unit system once readings exist", async () => {
    const res = await patch(a.users.lead, a.job.id, await editBody(a.job.id));
    expect(res.status).toBe(200);
    await Reading.create({
      id: randomUUID(),
      shopId: a.shop.id,
      jobId: a.job.id,
      stationId: "bore/1/top/A",
      characteristic: "bore_diameter",
      value: 4.03,
      valueCanonical: 102.362,
      unit: "in",
      takenBy: a.users.machinist.id,
      takenAt: new Date(),
      deviceId: "t",
    });
    // The engine's sizes in mm too (4.03 in = 102.362 mm, 3.48 in = 88.392 mm), so only the unit rule refuses.
    const d = (await one(a.users.lead, a.job.id)).body;
    const engineMm = { ...d.engine, nominalBore: 102.362, nominalStroke: 88.392 };
    const refused = await patch(
      a.users.lead,
      a.job.id,
      await editBody(a.job.id, { unitSystem: "mm", engine: engineMm }),
    );
    expect(refused.status).toBe(409);
    expect(refused.body.error.fields.unitSystem).toBeDefined();
  });
});

describe("/api/customers", () => {
  it.each(ROLES)("GET as %s", async (role) => {
    const res = await call(CUSTOMERS as never, await asUser(a.users[role], "GET", "/api/customers"));
    expect(res.status).toBe(role === "lead" || role === "admin" ? 200 : 403);
    if (res.status === 200) expect(res.body.customers.map((c: { id: number }) => c.id)).not.toContain(b.customer.id);
  });

  it.each(ROLES)("POST as %s", async (role) => {
    const res = await call(
      NEW_CUSTOMER as never,
      await asUser(a.users[role], "POST", "/api/customers", { name: `C ${role}`, email: "", phone: "555-0100" }),
    );
    expect(res.status).toBe(role === "lead" ? 201 : 403);
  });

  it("422 naming the e-mail", async () => {
    const res = await call(
      NEW_CUSTOMER as never,
      await asUser(a.users.lead, "POST", "/api/customers", { name: "X", email: "not-an-email" }),
    );
    expect(res.status).toBe(422);
    expect(res.body.error.fields.email).toBeDefined();
  });
});
