// Nonsense refused where it is typed, with the field named and words that say what to fix: a new
// job's 40 in bore, spec-sheet limits no real engine has, build-plan sizes and a bore far from the
// engine's; a flat-head plan (0 cc chamber) is accepted. Ranges: lib/domain/plausible-range.ts.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as NEW_JOB } from "@/app/api/jobs/route";
import { PUT as PUT_PLAN } from "@/app/api/jobs/[jobId]/build-plan/route";
import { POST as NEW_SPEC } from "@/app/api/specs/route";
import { createShop, INCH_LIMITS, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
beforeAll(async () => {
  s = await createShop();
});

const engine = (over: Record<string, unknown> = {}) => ({
  description: "Small-block V8",
  cylinders: 8,
  layout: "v",
  mains: 5,
  valvesPerCylinder: 2,
  ringsPerPiston: 3,
  boltsPerRod: 2,
  nominalBore: 4.03,
  nominalStroke: 3.48,
  blockMaterial: "greyCastIron",
  ...over,
});
const newJob = async (over: Record<string, unknown>) =>
  call(
    NEW_JOB as never,
    await asUser(s.users.lead, "POST", "/api/jobs", {
      code: `P-${randomUUID().slice(0, 6)}`,
      title: "Plausibility",
      customer: { mode: "existing", id: s.customer.id },
      engine: engine(),
      unitSystem: "in",
      templateId: s.template.id,
      status: "intake",
      ...over,
    }),
  );
const plan = (over: Record<string, unknown> = {}) => ({
  lengthUnit: "in",
  bore: 4.03,
  stroke: 3.48,
  rodLength: 5.7,
  compressionHeight: 1.56,
  pistonTop: "flat",
  chamberCc: 64,
  gasketBore: 4.1,
  gasketThickness: 0.041,
  deckHeight: 9.025,
  ...over,
});
const putPlan = async (body: unknown) =>
  call(PUT_PLAN as never, await asUser(s.users.lead, "PUT", `/api/jobs/${s.job.id}/build-plan`, body), {
    jobId: String(s.job.id),
  });

describe("plausible figures", () => {
  it("refuses a new job with a 40 in nominal bore, naming the field", async () => {
    const res = await newJob({ engine: engine({ nominalBore: 40 }) });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["engine.nominalBore"][0]).toMatch(/40 in cannot be a cylinder bore diameter/);
    expect((await newJob({ engine: engine({ nominalBore: 104, nominalStroke: 132 }), unitSystem: "mm" })).status).toBe(
      201,
    );
  });

  it("refuses a finished bore far from the engine's nominal, on the field", async () => {
    const res = await newJob({ finishedSizes: { bore: 4.6 } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["finishedSizes.bore"][0]).toMatch(/10% away from the engine's 4.03 in bore/);
    expect((await newJob({ finishedSizes: { bore: 4.06 } })).status).toBe(201);
  });

  it("refuses a spec sheet with a negative taper maximum or a bore in mm on an inch sheet", async () => {
    const limits = INCH_LIMITS.map((l) => ({ ...l }));
    const res = await call(
      NEW_SPEC as never,
      await asUser(s.users.lead, "POST", "/api/specs", {
        name: "Nonsense",
        engineKind: "V8",
        buildKind: "street",
        unitSystem: "in",
        limits: [{ ...limits[0], nominal: 102.36 }, { ...limits[1], max: -0.001 }, ...limits.slice(2)],
      }),
    );
    expect(res.status).toBe(422);
    expect(res.body.error.fields["limits.0.nominal"][0]).toMatch(/Check the decimal point and the unit/);
    expect(res.body.error.fields["limits.1.max"][0]).toMatch(/bore taper cannot be negative/);
  });

  it("accepts a flat-head plan (0 cc chamber) and refuses a bore far from the engine's", async () => {
    expect((await putPlan(plan({ chamberCc: 0, pistonTop: "dish", pistonVolumeCc: 60 }))).status).toBe(200);
    const far = await putPlan(plan({ bore: 4.6, gasketBore: 4.7 }));
    expect(far.status).toBe(422);
    expect(far.body.error.fields.bore[0]).toMatch(/10% away from this engine's 4.03 in bore/);
    const mm = await putPlan(plan({ stroke: 88.4 }));
    expect(mm.status).toBe(422);
    expect(mm.body.error.fields.stroke[0]).toMatch(/cannot be a stroke/);
    expect((await putPlan(plan({ chamberCc: -1 }))).body.error.fields.chamberCc[0]).toMatch(/0 or more/);
  });
});
