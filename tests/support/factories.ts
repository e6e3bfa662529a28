// Isolated test data: each createShop() call makes a fresh shop with one user per role, a
// customer, an engine, a spec template and a job with its own snapshot of the limits.
// The figures are test fixtures (invented), not reference values.
import bcrypt from "bcryptjs";
import { randomUUID } from "node:crypto";
import { getSequelize } from "@/lib/server/core/db";
import { Customer, Engine, Instrument, Job, JobLimit, Reading, Shop, SpecLimit, SpecTemplate, User } from "@/models";
import type { Role, UnitSystem } from "@/lib/schemas/enums";
import { parseStationId, usualGaugeKind, type GaugeKind } from "@/lib/domain";

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
    kind: "bore_gauge_digital",
    label: "Test bore gauge",
    serial: `BG-${tag}`,
    unit: "in",
    resolution: 0.0001,
    expandedU: 0.0001,
    rangeMin: 2,
    rangeMax: 6,
    calibratedOn: "2026-06-01",
    calibrationDue: "2027-06-01",
  });
  const gauges = await createGaugeKit(shop.id, tag);
  return {
    shop: { id: shop.id, name: shop.name },
    users,
    customer: { id: customer.id },
    engine: { id: engine.id },
    template: { id: template.id },
    job: { id: job.id, code: job.code },
    /** The shop's bore gauge (2–6 in), the gauge most tests read bores with. */
    instrument: { id: instrument.id },
    gauges,
  };
}

export type TestShop = Awaited<ReturnType<typeof createShop>>;

// One gauge of each kind a test station needs (invented test gauges), proposed for a reading that
// names none (sync-fixtures push). No range on file and U = 0, so they hold any figure and add no
// guard band: a test's verdicts stay those of its figures. `instrument` (above) is the one with a U.
const KIT = {
  bore: ["bore_gauge_digital", "Kit bore gauge"],
  mic: ["outside_mic", "Kit micrometer"],
  feeler: ["feeler", "Kit feeler set"],
  indicator: ["dial_indicator", "Kit dial indicator"],
  stretch: ["stretch_gauge", "Kit stretch gauge"],
  deck: ["deck_gauge", "Kit deck gauge"],
  torque: ["torque_wrench", "Kit torque wrench"],
} as const;
export type GaugeKit = Record<keyof typeof KIT, number>;
const kits = new Map<number, GaugeKit>();
const KIT_OF_KIND: Record<GaugeKind, keyof GaugeKit> = {
  micrometer: "mic",
  "bore-gauge": "bore",
  "dial-bore-gauge": "bore",
  feeler: "feeler",
  "dial-indicator": "indicator",
  "stretch-gauge": "stretch",
  "deck-gauge": "deck",
  "torque-wrench": "torque",
};

async function createGaugeKit(shopId: number, tag: string): Promise<GaugeKit> {
  const kit = {} as GaugeKit;
  for (const [key, [kind, label]] of Object.entries(KIT)) {
    const torque = kind === "torque_wrench";
    const g = await Instrument.create({
      shopId,
      kind,
      label,
      serial: `KIT-${key.toUpperCase()}-${tag}`,
      unit: torque ? "lbf_ft" : "in",
      resolution: torque ? 1 : 0.0001,
      expandedU: 0,
      calibratedOn: "2026-06-01",
      calibrationDue: "2027-06-01",
    });
    kit[key as keyof GaugeKit] = g.id;
  }
  kits.set(shopId, kit);
  return kit;
}

/** The test shop's gauge of a kind that measures the station (the bore gauge for bores, and so on). */
export function gaugeFor(shopId: number, stationId: string): number {
  const kit = kits.get(shopId);
  if (!kit) throw new Error(`Shop ${shopId} was not made by createShop; name the gauge yourself`);
  const kind = usualGaugeKind(parseStationId(stationId).characteristic ?? "bore_diameter");
  return kit[KIT_OF_KIND[kind ?? "micrometer"]];
}

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
