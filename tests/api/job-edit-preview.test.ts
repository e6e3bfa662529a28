// A finished-size change re-judges a job like a limits edit, so it gets the same preview and the
// same second question: POST /api/jobs/:id/preview runs the very edit and rolls it back, and a
// PATCH that opens more than a handful of flags needs that number confirmed. Figures: the demo
// sheet's bore is finished size −0.0001/+0.0004 in (scripts/seed/demo-specs.ts, invented demo
// data): with a 4.040 in finished bore, 4.0402 is in spec; with 4.030, its maximum is 4.0304.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { POST } from "@/app/api/jobs/route";
import { GET as ONE, PATCH } from "@/app/api/jobs/[jobId]/route";
import { POST as PREVIEW } from "@/app/api/jobs/[jobId]/preview/route";
import { AuditEvent, SpecLimit, SpecTemplate } from "@/models";
import { STREET_V8_INCH } from "../../scripts/seed/demo-specs";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { flagsOf, push, reading } from "./sync-fixtures";

let a: TestShop;
let jobId: number;
const lead = () => a.users.lead;
const one = async (id: number) =>
  call(ONE as never, await asUser(lead(), "GET", `/api/jobs/${id}`), { jobId: String(id) });
async function editBody(over: Record<string, unknown> = {}) {
  const d = (await one(jobId)).body;
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
const preview = async (b: unknown) =>
  call(PREVIEW as never, await asUser(lead(), "POST", `/api/jobs/${jobId}/preview`, b), { jobId: String(jobId) });
const patch = async (b: unknown) =>
  call(PATCH as never, await asUser(lead(), "PATCH", `/api/jobs/${jobId}`, b), { jobId: String(jobId) });
const openFlags = async () => (await flagsOf(jobId)).filter((f) => f.state === "open").length;
const sizeEdits = () => AuditEvent.count({ where: { action: "job_sizes.update", entityId: String(jobId) } });

beforeAll(async () => {
  a = await createShop();
  const t = await SpecTemplate.create({
    shopId: a.shop.id,
    name: "Street V8 (demo sheet)",
    engineKind: "V8 gasoline",
    buildKind: "street",
    unitSystem: "in",
  });
  await SpecLimit.bulkCreate(STREET_V8_INCH.map((l, i) => ({ ...l, templateId: t.id, sortOrder: i })) as never[]);
  const res = await call(
    POST as never,
    await asUser(lead(), "POST", "/api/jobs", {
      code: `E-${randomUUID().slice(0, 6)}`,
      title: "Pickup V8, 0.040 in over",
      customer: { mode: "existing", id: a.customer.id },
      engine: {
        description: "Small-block V8",
        cylinders: 8,
        layout: "v",
        mains: 5,
        valvesPerCylinder: 2,
        ringsPerPiston: 3,
        boltsPerRod: 2,
        nominalBore: 4.0,
        nominalStroke: 3.48,
        blockMaterial: "greyCastIron",
      },
      unitSystem: "in",
      templateId: t.id,
      status: "measuring",
      finishedSizes: { bore: 4.04 },
    }),
  );
  expect(res.status).toBe(201);
  jobId = res.body.id;
  const bores = Array.from({ length: 8 }, (_, i) => reading(jobId, `bore/${i + 1}/top/A`, 4.0402));
  expect((await push(a.users.machinist, bores)).status).toBe(200);
  expect(await openFlags()).toBe(0);
});

describe("a finished-size change, previewed and confirmed", () => {
  it("the preview counts what the change would do and leaves the job as it was", async () => {
    const res = await preview(await editBody({ finishedSizes: { bore: 4.03 } }));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      consequences: { flagsOpened: 8, flagsClosed: 0, verdictsChanged: 8, requiredStations: 8 },
      words: "opens 8 flags, changes 8 verdicts, affects 8 required stations",
      wide: true,
    });
    expect((await one(jobId)).body.job.finishedSizes.bore).toBe(4.04);
    expect([await openFlags(), await sizeEdits()]).toEqual([0, 0]);
  });

  it("the wide change is saved only with that number, and then opens exactly those flags", async () => {
    const body = await editBody({ finishedSizes: { bore: 4.03 } });
    const refused = await patch(body);
    expect(refused.status).toBe(409);
    expect(refused.body.error.fields.confirmedFlagsOpened[0]).toMatch(/Type 8/);
    expect((await one(jobId)).body.job.finishedSizes.bore).toBe(4.04);
    const saved = await patch({ ...body, confirmedFlagsOpened: 8 });
    expect(saved.status).toBe(200);
    expect(saved.body.job.finishedSizes.bore).toBe(4.03);
    expect([await openFlags(), await sizeEdits()]).toEqual([8, 1]);
  });

  it("going back closes them without the second question; an edit of the title changes nothing", async () => {
    const back = await editBody({ finishedSizes: { bore: 4.04 } });
    expect((await preview(back)).body).toMatchObject({ wide: false, consequences: { flagsClosed: 8 } });
    expect((await patch(back)).status).toBe(200);
    expect(await openFlags()).toBe(0);
    const rename = await preview(await editBody({ title: "Renamed" }));
    expect(rename.body.words).toBe("changes no verdict and no flag");
  });

  it("refuses a finished bore far from the engine's, on the field", async () => {
    const res = await preview(await editBody({ finishedSizes: { bore: 4.6 } }));
    expect(res.status).toBe(422);
    expect(res.body.error.fields["finishedSizes.bore"][0]).toMatch(/10% away from the engine's 4 in bore/);
  });
});
