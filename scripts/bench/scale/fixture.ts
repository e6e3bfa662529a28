// The shops of the scaled history (benchmark data only, invented names): each with its people
// (one per office role and three machinists), forty customers, and the V8 jobs' engine and
// limits made the way sync-setup.ts makes them (the demo street spec sheet, copied per job), and
// the demo's gauges, all in calibration (every reading names one whose kind and range suit it).
import bcrypt from "bcryptjs";
import { Customer, Engine, Job, JobLimit, Shop, User } from "@/models";
import { gaugesHolding } from "@/lib/domain";
import type { Actor } from "@/lib/schemas/session";
import type { Role } from "@/lib/schemas/enums";
import { STREET_V8_INCH } from "../../seed/demo-specs";
import { createDemoGauges, type BenchGauge } from "../bench-gauges";
import { BENCH_PLAN } from "../record-fixture-parties";
import { BENCH_PASSWORD } from "./password";

const HASH = bcrypt.hashSync(BENCH_PASSWORD, 8);
const ROLES: Role[] = ["machinist", "machinist", "machinist", "lead", "inspector", "admin"];
const CUSTOMERS = 40;

export type BenchShop = { id: number; people: Actor[]; customerIds: number[]; gauges: BenchGauge[] };

export const benchEmail = (shop: number, role: Role, n = 0) => `${role}${n || ""}@shop-${shop}.bench.example`;

export async function createShops(count: number, from = 1): Promise<BenchShop[]> {
  const shops: BenchShop[] = [];
  for (let s = from; s < from + count; s++) {
    const shop = await Shop.create({
      name: `Bench engine shop ${s} (benchmark data)`,
      slug: `bench-shop-${s}`,
      unitSystem: "in",
      activatedAt: new Date(),
    });
    const people: Actor[] = [];
    for (const [i, role] of ROLES.entries()) {
      const n = role === "machinist" ? i + 1 : 0;
      const email = benchEmail(s, role, n);
      const name = `${role[0].toUpperCase()}${role.slice(1)} ${n || ""} of shop ${s}`.replace("  ", " ");
      const u = await User.create({ shopId: shop.id, name, email, passwordHash: HASH, role });
      people.push({ userId: u.id, shopId: shop.id, role, name, email });
    }
    const customers = await Customer.bulkCreate(
      Array.from({ length: CUSTOMERS }, (_, i) => ({ shopId: shop.id, name: `Customer ${i + 1} of shop ${s}` })),
    );
    const gauges = await createDemoGauges(shop.id);
    shops.push({ id: shop.id, people, customerIds: customers.map((c) => c.id), gauges });
  }
  return shops;
}

/** A V8 job in "measuring" with its own copy of the street spec sheet's limits and bench:record's build plan. */
export async function createV8Job(shop: BenchShop, code: string): Promise<number> {
  const customerId = shop.customerIds[0];
  const engine = await Engine.create({
    shopId: shop.id,
    customerId,
    description: "Small-block V8 (benchmark data)",
    cylinders: 8,
    layout: "v",
    mains: 5,
    unitSystem: "in",
    nominalBore: 4.03,
    nominalStroke: 3.48,
    blockMaterial: "greyCastIron",
  });
  const job = await Job.create({
    shopId: shop.id,
    customerId,
    engineId: engine.id,
    code,
    title: `Street V8 rebuild ${code}`,
    unitSystem: "in",
    status: "measuring",
    finishedBore: 4.03,
    finishedMainJournal: 2.449,
    finishedRodJournal: 2.099,
    buildPlan: BENCH_PLAN,
  });
  await JobLimit.bulkCreate(STREET_V8_INCH.map((l, k) => ({ ...l, jobId: job.id, sortOrder: k })) as never[]);
  return job.id;
}

/** The shop's person in the same role (and number) as a template shop's person. */
export function peopleMap(from: BenchShop, to: BenchShop): Map<number, number> {
  return new Map(from.people.map((p, i) => [p.userId, to.people[i].userId]));
}

/** The first of the shop's gauges that may measure this value at this station (gauge-range.ts). */
export function gaugeFor(shop: BenchShop, stationId: string, value: number, unit: string): number {
  const g = gaugesHolding({ stationId, value, unit: unit as never }, shop.gauges)[0];
  if (!g) throw new Error(`No bench gauge holds ${value} ${unit} at ${stationId}`);
  return g.id;
}

/** Each template gauge's counterpart in another shop (the same demo gauge). */
export function gaugeMap(from: BenchShop, to: BenchShop): Map<number, number> {
  return new Map(from.gauges.map((g, i) => [g.id, to.gauges[i].id]));
}

/** The shop's people who live a template job: its first machinist, its lead and its inspector. */
export function actorsOf(shop: BenchShop) {
  const one = (role: Role) => shop.people.find((p) => p.role === role)!;
  return {
    machinist: one("machinist"),
    lead: one("lead"),
    inspector: one("inspector"),
    gauge: (stationId: string, value: number, unit: string) => gaugeFor(shop, stationId, value, unit),
  };
}
