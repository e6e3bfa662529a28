// Isolated test data: each createShop() call makes a fresh shop with one user per role, a
// customer, an engine, a spec template and a job with its own snapshot of the limits.
// The figures are test fixtures (invented), not reference values.
import bcrypt from "bcryptjs";
import { randomUUID } from "node:crypto";
import { getSequelize } from "@/lib/server/core/db";
import { Customer, Engine, Instrument, Job, JobLimit, Reading, Shop, SpecLimit, SpecTemplate, User } from "@/models";
import type { Role, UnitSystem } from "@/lib/schemas/enums";

export const TEST_PASSWORD = "test-pass-1234";
const HASH = bcrypt.hashSync(TEST_PASSWORD, 4);

export type TestUser = { id: number; shopId: number; role: Role; name: string; email: string };

export const INCH_LIMITS = [
  {
    characteristic: "bore_diameter",
    stationPattern: "*",
    limitType: "nominal_tol",
    unit: "in",
    nominal: 4.03,
    tolPlus: 0.0005,
    tolMinus: 0.0005,
    required: true,
  },
  { characteristic: "bore_taper", stationPattern: "*", limitType: "max_only", unit: "in", max: 0.001, required: true },
  {
    characteristic: "bore_out_of_round",
    stationPattern: "*",
    limitType: "max_only",
    unit: "in",
    max: 0.001,
    required: true,
  },
  {
    characteristic: "main_oil_clearance",
    stationPattern: "*",
    limitType: "min_max",
    unit: "in",
    min: 0.0015,
    max: 0.0025,
    required: true,
  },
  {
    characteristic: "fastener_torque",
    stationPattern: "*",
    limitType: "min_max",
    unit: "lbf_ft",
    min: 65,
    max: 70,
    required: true,
  },
] as const;

export async function createShop(opts: { unitSystem?: UnitSystem; name?: string } = {}) {
  getSequelize();
  const tag = randomUUID().slice(0, 8);
  const unitSystem = opts.unitSystem ?? "in";
  const shop = await Shop.create({ name: opts.name ?? `Test shop ${tag}`, slug: `test-${tag}`, unitSystem });
  const users = {} as Record<Role, TestUser>;
  for (const role of ["machinist", "lead", "inspector", "admin"] as const) {
    const u = await User.create({
      shopId: shop.id,
      name: `${role} ${tag}`,
      email: `${role}-${tag}@test.example`,
      passwordHash: HASH,
      role,
    });
    users[role] = { id: u.id, shopId: shop.id, role, name: u.name, email: u.email };
  }
  const customer = await Customer.create({
    shopId: shop.id,
    name: `Customer ${tag}`,
    email: `customer-${tag}@test.example`,
  });
  const engine = await Engine.create({
    shopId: shop.id,
    customerId: customer.id,
    description: "Test V8",
    cylinders: 8,
    layout: "v",
    mains: 5,
    unitSystem,
    nominalBore: 4.03,
    nominalStroke: 3.48,
    blockMaterial: "greyCastIron",
  });
  const template = await SpecTemplate.create({
    shopId: shop.id,
    name: `Street V8 ${tag}`,
    engineKind: "V8 gasoline",
    buildKind: "street",
    unitSystem,
  });
  for (const [i, l] of INCH_LIMITS.entries()) await SpecLimit.create({ ...l, templateId: template.id, sortOrder: i });
  const job = await Job.create({
    shopId: shop.id,
    customerId: customer.id,
    engineId: engine.id,
    templateId: template.id,
    code: `T-${tag}`,
    title: `Test job ${tag}`,
    unitSystem,
    status: "measuring",
  });
  for (const [i, l] of INCH_LIMITS.entries()) await JobLimit.create({ ...l, jobId: job.id, sortOrder: i });
  const instrument = await Instrument.create({
    shopId: shop.id,
    kind: "outside_mic",
    label: "Test micrometer",
    serial: `MIC-${tag}`,
    unit: "in",
    resolution: 0.0001,
    expandedU: 0.0001,
    calibratedOn: "2026-06-01",
    calibrationDue: "2027-06-01",
  });
  return {
    shop: { id: shop.id, name: shop.name },
    users,
    customer: { id: customer.id },
    engine: { id: engine.id },
    template: { id: template.id },
    job: { id: job.id, code: job.code },
    instrument: { id: instrument.id },
  };
}

export type TestShop = Awaited<ReturnType<typeof createShop>>;

/**
 * A reading written straight to the table, with no ingest and no verdict, for tests of the rules
 * that count readings (current reading, progress). Taken `min` minutes after 09:00 UTC, 1 Dec 2026.
 */
export function insertReading(
  s: TestShop,
  stationId: string,
  value: number | null,
  min: number,
  extra: Record<string, unknown> = {},
) {
  const torque = stationId.startsWith("torque");
  return Reading.create({
    id: randomUUID(),
    shopId: s.shop.id,
    jobId: s.job.id,
    stationId,
    characteristic: torque ? "fastener_torque" : "bore_diameter",
    value,
    valueCanonical: value === null || torque ? value : value * 25.4,
    unit: torque ? "lbf_ft" : "in",
    takenBy: s.users.machinist.id,
    takenAt: new Date(Date.UTC(2026, 11, 1, 9, min)),
    deviceId: "test",
    skipped: value === null,
    ...extra,
  });
}
