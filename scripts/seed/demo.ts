// DEMO DATA ONLY: an invented shop, people, customers, engines and jobs. Every name, serial
// and figure here is made up for the demo.
import bcrypt from "bcryptjs";
import { readFileSync } from "node:fs";
import type { Role, UnitSystem } from "@/lib/schemas/enums";
import { models } from "@/lib/server/core/db";
import { BCRYPT_COST } from "@/lib/server/passwords/hash";
import { DEMO_GAUGES, demoGaugeRow } from "./demo-gauges";
import { seedDemoReadings } from "./demo-readings";
import { DEMO_SIZES, STREET_V8_INCH, TRACTOR_DIESEL_MM, VINTAGE_SIX_INCH } from "./demo-specs";

type Demo = {
  shop: string;
  password: string;
  accounts: { role: Role; name: string; email: string }[];
};

export type DemoContext = {
  shopId: number;
  users: Record<string, number>;
  jobs: { v8: number; diesel: number; six: number };
  instruments: Record<string, number>;
};

async function template(
  shopId: number,
  name: string,
  engineKind: string,
  buildKind: string,
  unitSystem: UnitSystem,
  limits: typeof STREET_V8_INCH,
) {
  const { SpecLimit, SpecTemplate } = models();
  const t = await SpecTemplate.create({
    shopId,
    name,
    engineKind,
    buildKind,
    unitSystem,
    notes: "Demo spec sheet (invented figures).",
  });
  await SpecLimit.bulkCreate(limits.map((l, i) => ({ ...l, templateId: t.id, sortOrder: i })) as never[]);
  return t;
}

type FinishedSizes = { finishedBore: number; finishedMainJournal: number; finishedRodJournal: number };

async function job(
  shopId: number,
  customerId: number,
  engineId: number,
  t: { id: number },
  limits: typeof STREET_V8_INCH,
  fields: { code: string; title: string; unitSystem: UnitSystem; dueDate: string; notes: string } & FinishedSizes,
) {
  const { Job, JobLimit } = models();
  const j = await Job.create({ shopId, customerId, engineId, templateId: t.id, status: "measuring", ...fields });
  await JobLimit.bulkCreate(limits.map((l, i) => ({ ...l, jobId: j.id, sortOrder: i })) as never[]);
  return j.id;
}

export async function seedDemo(): Promise<DemoContext> {
  const { Customer, Engine, Instrument, Shop, User } = models();
  const demo = JSON.parse(readFileSync("scripts/demo-accounts.json", "utf8")) as Demo;
  const shop = await Shop.create({
    name: demo.shop,
    slug: "kestrel-flats",
    unitSystem: "in",
    email: "desk@kestrelflats.example",
    phone: "555-0142",
    address: "4 Quarry Lane, Kestrel Flats",
  });
  const hash = await bcrypt.hash(demo.password, BCRYPT_COST);
  const users: Record<string, number> = {};
  for (const a of demo.accounts)
    users[a.role] = (
      await User.create({ shopId: shop.id, name: a.name, email: a.email, passwordHash: hash, role: a.role })
    ).id;

  const pickup = await Customer.create({
    shopId: shop.id,
    name: "Ottoline Brisk",
    email: "ottoline@brisk-garage.example",
    phone: "555-0187",
    notes: "Restoring a 1970s pickup.",
  });
  const farm = await Customer.create({
    shopId: shop.id,
    name: "Fenwick Hollow Farm Co-op",
    email: "workshop@fenwickhollow.example",
    phone: "555-0133",
  });
  const vintage = await Customer.create({
    shopId: shop.id,
    name: "Aurelio Stavros",
    email: "aurelio.stavros@example.net",
  });

  const v8 = await Engine.create({
    shopId: shop.id,
    customerId: pickup.id,
    description: "Carbureted small-block V8, 0.030 in over",
    cylinders: 8,
    layout: "v",
    mains: 5,
    unitSystem: "in",
    ...DEMO_SIZES.v8.engine,
    nominalStroke: 3.48,
    blockMaterial: "greyCastIron",
    headMaterial: "greyCastIron",
    pistonMaterial: "aluminium356",
    blockSerial: "KF-V8-20391",
    crankSerial: "CR-55120",
    headSerials: "HD-7712 / HD-7713",
    fuel: "gasoline",
  });
  const diesel = await Engine.create({
    shopId: shop.id,
    customerId: farm.id,
    description: "Turbo-diesel inline four, tractor",
    cylinders: 4,
    layout: "inline",
    mains: 5,
    unitSystem: "mm",
    ...DEMO_SIZES.diesel.engine,
    nominalStroke: 132,
    blockMaterial: "greyCastIron",
    headMaterial: "greyCastIron",
    pistonMaterial: "aluminium319",
    blockSerial: "TD4-880214",
    crankSerial: "TDC-30917",
    headSerials: "TDH-5521",
    fuel: "diesel",
  });
  const six = await Engine.create({
    shopId: shop.id,
    customerId: vintage.id,
    description: "Vintage inline six, 0.030 in over",
    cylinders: 6,
    layout: "inline",
    mains: 7,
    unitSystem: "in",
    ...DEMO_SIZES.six.engine,
    nominalStroke: 3.75,
    blockMaterial: "greyCastIron",
    headMaterial: "greyCastIron",
    pistonMaterial: "aluminium356",
    blockSerial: "VS6-4471",
    crankSerial: "VSC-1190",
    headSerials: "VSH-0388",
    fuel: "gasoline",
  });

  const tV8 = await template(shop.id, "Street V8, cast iron block", "V8 gasoline", "street", "in", STREET_V8_INCH);
  const tDiesel = await template(
    shop.id,
    "Tractor diesel four (metric)",
    "Inline-4 diesel",
    "diesel",
    "mm",
    TRACTOR_DIESEL_MM,
  );
  const tSix = await template(
    shop.id,
    "Vintage inline six, mild street",
    "Inline-6 gasoline",
    "street",
    "in",
    VINTAGE_SIX_INCH,
  );

  const jobs = {
    v8: await job(shop.id, pickup.id, v8.id, tV8, STREET_V8_INCH, {
      code: "KF-2611",
      ...DEMO_SIZES.v8.job,
      title: "Pickup V8 rebuild",
      unitSystem: "in",
      dueDate: "2026-12-18",
      notes: "Stock rebuild, hydraulic cam swapped for a mild solid cam.",
    }),
    diesel: await job(shop.id, farm.id, diesel.id, tDiesel, TRACTOR_DIESEL_MM, {
      code: "KF-2612",
      ...DEMO_SIZES.diesel.job,
      title: "Tractor diesel overhaul",
      unitSystem: "mm",
      dueDate: "2026-12-11",
      notes: "Liner-less block, bored to first oversize.",
    }),
    six: await job(shop.id, vintage.id, six.id, tSix, VINTAGE_SIX_INCH, {
      code: "KF-2613",
      ...DEMO_SIZES.six.job,
      title: "Vintage six freshen-up",
      unitSystem: "in",
      dueDate: "2027-01-15",
      notes: "Keep original crank if it cleans up.",
    }),
  };

  const instruments: Record<string, number> = {};
  for (const g of DEMO_GAUGES)
    instruments[g.key] = (await Instrument.create({ shopId: shop.id, ...demoGaugeRow(g) })).id;

  return seedDemoReadings({ shopId: shop.id, users, jobs, instruments });
}
