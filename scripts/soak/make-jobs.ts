// Adds `--count` V8 jobs (codes `--prefix`-1 … -N) to the demo shop of a seeded database, with the
// demo's street V8 spec sheet, for the soak and burst runs (benchmark data only). Run as the schema
// owner through tsx with scripts/bench/tsconfig.sync.json; prints { code: jobId } as JSON on its last line.
// The same codes on two databases let two runs of the same readings be compared job by job.
import { closeSequelize, connectAsOwner, getSequelize } from "@/lib/server/core/db";
import { hasOwnerAccount } from "@/lib/server/core/env";
import { Customer, Engine, Job, JobLimit, Shop } from "@/models";
import { STREET_V8_INCH } from "../seed/demo-specs";

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : fallback;
}

async function main() {
  if (hasOwnerAccount()) connectAsOwner();
  getSequelize(); // binds the model classes
  const count = Number(arg("count", "10"));
  const prefix = arg("prefix", "SOAK");
  const shop = await Shop.findOne({ where: { slug: "kestrel-flats" } });
  if (!shop) throw new Error("The demo shop is missing: run db:setup --seed first");
  const customer = await Customer.create({ shopId: shop.id, name: `${prefix} customer (benchmark data)` });
  const engine = await Engine.create({
    shopId: shop.id,
    customerId: customer.id,
    description: `${prefix} V8 (benchmark data)`,
    cylinders: 8,
    layout: "v",
    mains: 5,
    unitSystem: "in",
    nominalBore: 4.03,
    nominalStroke: 3.48,
    blockMaterial: "greyCastIron",
  });
  const ids: Record<string, number> = {};
  for (let i = 1; i <= count; i++) {
    const code = `${prefix}-${i}`;
    const job = await Job.create({
      shopId: shop.id,
      customerId: customer.id,
      engineId: engine.id,
      code,
      title: `${prefix} job ${i} (benchmark data)`,
      unitSystem: "in",
      status: "measuring",
      finishedBore: 4.03,
      finishedMainJournal: 2.449,
      finishedRodJournal: 2.099,
    });
    await JobLimit.bulkCreate(STREET_V8_INCH.map((l, k) => ({ ...l, jobId: job.id, sortOrder: k })) as never[]);
    ids[code] = job.id;
  }
  await closeSequelize();
  console.log(JSON.stringify(ids));
}

main().catch(async (err) => {
  console.error(`[soak] making jobs failed: ${err instanceof Error ? err.message : String(err)}`);
  await closeSequelize().catch(() => undefined);
  process.exit(1);
});
