// Limits that follow the job: a job made from the demo street-V8 sheet (bore, main and rod journal
// as tolerances around the job's own finished sizes) judges its bores against its own finished
// bore; changing that size re-judges readings and flags like a limits edit, with an audit event.
// Figures: the demo sheet's bore is finished size −0.0001/+0.0004 in (scripts/seed/demo-specs.ts,
// invented demo data); the arithmetic is plain (4.040 − 0.0001 = 4.0399, 4.040 + 0.0004 = 4.0404).
import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import { beforeAll, describe, expect, it } from "vitest";
import { POST } from "@/app/api/jobs/route";
import { POST as IMPORT } from "@/app/api/specs/import/route";
import { GET as PACK } from "@/app/api/bench/jobs/[jobId]/route";
import { evaluateReading } from "@/lib/domain";
import { GET as ONE, PATCH } from "@/app/api/jobs/[jobId]/route";
import { getSequelize } from "@/lib/server/core/db";
import { AuditEvent, Instrument, SpecLimit, SpecTemplate } from "@/models";
import { STREET_V8_INCH } from "../../scripts/seed/demo-specs";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { flagsOf, later, push, reading } from "./sync-fixtures";

let a: TestShop;
let templateId: number;
let boreGauge: number;

beforeAll(async () => {
  a = await createShop();
  const t = await SpecTemplate.create({
    shopId: a.shop.id,
    name: "Street V8, cast iron block (demo sheet)",
    engineKind: "V8 gasoline",
    buildKind: "street",
    unitSystem: "in",
  });
  await SpecLimit.bulkCreate(STREET_V8_INCH.map((l, i) => ({ ...l, templateId: t.id, sortOrder: i })) as never[]);
  templateId = t.id;
  const g = await Instrument.create({
    shopId: a.shop.id,
    kind: "bore_gauge_digital",
    label: "Test bore gauge",
    serial: `BG-${randomUUID().slice(0, 6)}`,
    unit: "in",
    resolution: 0.0001,
    expandedU: 0.0001,
    calibratedOn: "2026-06-01",
    calibrationDue: "2027-06-01",
  });
  boreGauge = g.id;
});

const engine = {
  description: "Small-block V8, 0.040 in over",
  cylinders: 8,
  layout: "v",
  mains: 5,
  valvesPerCylinder: 2,
  ringsPerPiston: 3,
  boltsPerRod: 2,
  nominalBore: 4.0,
  nominalStroke: 3.48,
  nominalMainJournal: 2.449,
  nominalRodJournal: 2.099,
  blockMaterial: "greyCastIron",
};
const body = (over: Record<string, unknown> = {}) => ({
  code: `S-${randomUUID().slice(0, 6)}`,
  title: "Pickup V8, second overbore",
  customer: { mode: "existing", id: a.customer.id },
  engine,
  unitSystem: "in",
  templateId,
  status: "measuring",
  finishedSizes: { bore: 4.04, mainJournal: 2.449, rodJournal: 2.099 },
  ...over,
});
const create = async (b: unknown) => call(POST as never, await asUser(a.users.lead, "POST", "/api/jobs", b));
const one = async (id: number) =>
  call(ONE as never, await asUser(a.users.lead, "GET", `/api/jobs/${id}`), { jobId: String(id) });
const patch = async (id: number, b: unknown) =>
  call(PATCH as never, await asUser(a.users.lead, "PATCH", `/api/jobs/${id}`, b), { jobId: String(id) });

async function editBody(id: number, over: Record<string, unknown> = {}) {
  const d = (await one(id)).body;
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

async function stored(jobId: number) {
  return getSequelize().query<{ station: string; verdict: string | null; min: string; max: string }>(
    "SELECT station_id AS station, verdict, limit_min AS min, limit_max AS max " +
      "FROM readings WHERE job_id = ? ORDER BY station_id",
    { replacements: [jobId], type: QueryTypes.SELECT },
  );
}
async function revisionOf(jobId: number): Promise<string> {
  const [row] = await getSequelize().query<{ r: string }>("SELECT context_revision AS r FROM jobs WHERE id = ?", {
    replacements: [jobId],
    type: QueryTypes.SELECT,
  });
  return String(row.r);
}

describe("a job from the demo sheet with its own finished bore", () => {
  let jobId: number;

  it("states its sizes on create and shows them with the engine's", async () => {
    const res = await create(body());
    expect(res.status).toBe(201);
    jobId = res.body.id;
    const d = (await one(jobId)).body;
    expect(d.job.finishedSizes).toEqual({ bore: 4.04, mainJournal: 2.449, rodJournal: 2.099 });
    expect(d.engine).toMatchObject({ nominalBore: 4, nominalMainJournal: 2.449, nominalRodJournal: 2.099 });
  });

  it("judges a synced bore against its own finished bore, not the sheet's demo job's", async () => {
    const res = await push(a.users.machinist, [
      reading(jobId, "bore/1/top/A", 4.0402, { instrumentId: boreGauge }),
      reading(jobId, "bore/2/top/A", 4.0302, { instrumentId: boreGauge }),
    ]);
    expect(res.status).toBe(200);
    const [first, second] = res.body.results;
    expect(first.evaluation).toMatchObject({ limitMin: 4.0399, limitMax: 4.0404, deviation: 0.0002 });
    expect(first.verdict).toBe("in_spec");
    expect(second.verdict).toBe("out_of_spec"); // 4.0302 is 0.0097 under a 4.040 finished bore
    const open = (await flagsOf(jobId)).filter((f) => f.state === "open");
    expect(open.map((f) => f.stationId)).toEqual(["bore/2/top/A"]);
  });

  it("re-judges when the finished bore changes: flags open and close, one audit event, a new context", async () => {
    const before = await revisionOf(jobId);
    const res = await patch(jobId, await editBody(jobId, { finishedSizes: { bore: 4.03 } }));
    expect(res.status).toBe(200);
    expect(res.body.job.finishedSizes).toEqual({ bore: 4.03, mainJournal: 2.449, rodJournal: 2.099 });
    expect(await revisionOf(jobId)).not.toBe(before); // the trigger on jobs renews the sync cache key
    expect(await stored(jobId)).toEqual([
      { station: "bore/1/top/A", verdict: "out_of_spec", min: expect.anything(), max: expect.anything() },
      { station: "bore/2/top/A", verdict: "in_spec", min: expect.anything(), max: expect.anything() },
    ]);
    expect((await stored(jobId)).map((r) => [Number(r.min), Number(r.max)])).toEqual([
      [4.0299, 4.0304],
      [4.0299, 4.0304],
    ]);
    const flags = await flagsOf(jobId);
    expect(flags.filter((f) => f.state === "open").map((f) => f.stationId)).toEqual(["bore/1/top/A"]);
    expect(flags.filter((f) => f.state === "closed").map((f) => f.stationId)).toEqual(["bore/2/top/A"]);
    const events = await AuditEvent.findAll({ where: { action: "job_sizes.update", entityId: String(jobId) } });
    expect(events).toHaveLength(1);
    expect(events[0].before).toMatchObject({ finishedBore: 4.04, nominalBore: 4 });
    expect(events[0].after).toMatchObject({ finishedBore: 4.03, reevaluated: 2 });
    expect((events[0].after as { flagsOpened: number[] }).flagsOpened).toHaveLength(1);
    expect((events[0].after as { flagsClosed: number[] }).flagsClosed).toHaveLength(1);
  });

  it("an edit that changes no size re-judges nothing and keeps the sizes", async () => {
    const res = await patch(jobId, await editBody(jobId, { title: "Pickup V8, renamed" }));
    expect(res.status).toBe(200);
    expect(res.body.job.finishedSizes.bore).toBe(4.03);
    expect(await AuditEvent.count({ where: { action: "job_sizes.update", entityId: String(jobId) } })).toBe(1);
  });

  it("the tablet's pack carries the sizes, so its offline verdict agrees with the server's", async () => {
    const req = await asUser(a.users.machinist, "GET", `/api/bench/jobs/${jobId}`);
    const pack = (await call(PACK as never, req, { jobId: String(jobId) })).body;
    expect(pack.shape.finishedSizes).toEqual({ bore: 4.03, mainJournal: 2.449, rodJournal: 2.099 });
    const offline = evaluateReading({ stationId: "bore/4/top/A", value: 4.0302, unit: "in" }, pack.shape, pack.spec);
    expect(offline).toMatchObject({ verdict: "in_spec", limits: { min: 4.0299, max: 4.0304 } });
  });

  it("a later reading is judged with the new size at once (no stale cached limits)", async () => {
    const res = await push(a.users.machinist, [
      reading(jobId, "bore/3/top/A", 4.0302, { instrumentId: boreGauge, takenAt: later(5) }),
    ]);
    expect(res.body.results[0]).toMatchObject({ verdict: "in_spec", evaluation: { limitMin: 4.0299 } });
  });
});

describe("finished sizes on create and edit", () => {
  it("takes the engine's sizes when the request states none", async () => {
    const res = await create(body({ finishedSizes: undefined }));
    expect(res.status).toBe(201);
    expect((await one(res.body.id)).body.job.finishedSizes).toEqual({ bore: 4, mainJournal: 2.449, rodJournal: 2.099 });
  });

  it.each([
    ["a zero bore", { bore: 0 }, "finishedSizes.bore"],
    ["a negative main journal", { mainJournal: -2.449 }, "finishedSizes.mainJournal"],
    ["a rod journal as text", { rodJournal: "2.099" }, "finishedSizes.rodJournal"],
    ["an unknown size", { stroke: 3.48 }, "finishedSizes"],
  ])("refuses %s with 422 naming %s", async (_what, sizes, field) => {
    const res = await create(body({ finishedSizes: sizes }));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]?.[0]).toMatch(/size|number|Unrecognized|unknown/i);
  });

  it("refuses a zero size on edit and keeps the stored one", async () => {
    const id = (await create(body())).body.id;
    const res = await patch(id, await editBody(id, { finishedSizes: { bore: 0 } }));
    expect(res.status).toBe(422);
    expect(res.body.error.fields["finishedSizes.bore"][0]).toContain("above zero");
    expect((await one(id)).body.job.finishedSizes.bore).toBe(4.04);
  });
});

describe("the spec template file accepts a job-size limit (format version 1)", () => {
  const file = (limits: unknown[]) => ({
    format: "tenthwise.spec-template",
    version: 1,
    template: { name: "Follows the job", engineKind: "V8 gasoline", buildKind: "street", unitSystem: "in", limits },
  });
  const bore = { characteristic: "bore_diameter", stationPattern: "*", limitType: "job_size_tol", unit: "in" };
  const send = async (b: unknown) => call(IMPORT as never, await asUser(a.users.lead, "POST", "/api/specs/import", b));

  it("imports a finished-bore tolerance as it was written", async () => {
    const res = await send(file([{ ...bore, tolPlus: 0.0005, tolMinus: 0, required: true }]));
    expect(res.status).toBe(201);
    expect(res.body.template.limits).toEqual([{ ...bore, tolPlus: 0.0005, tolMinus: 0, required: true }]);
  });

  it.each([
    ["on a piston skirt, which is the piston maker's size", { characteristic: "piston_skirt_diameter" }, "limitType"],
    ["without its minus tolerance", { tolMinus: null }, "tolMinus"],
    ["with a negative tolerance", { tolPlus: -0.0005 }, "tolPlus"],
  ])("refuses one %s (422 naming %s)", async (_what, over, field) => {
    const res = await send(file([{ ...bore, tolPlus: 0.0005, tolMinus: 0, required: true, ...over }]));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[`template.limits.0.${field}`]?.[0]).toEqual(expect.any(String));
  });
});
