// The measuring half of bench:scale (started by scripts/bench/scale.ts with the services' env).
import { cpus, loadavg } from "node:os";
import { closeSequelize } from "@/lib/server/core/db";
import { loadScale } from "./load";

const READINGS = Number(process.env.TW_SCALE_READINGS ?? 1_000_000);
const load = () =>
  `load average ${loadavg()
    .map((l) => l.toFixed(1))
    .join(" ")} on ${cpus().length} cores`;

async function main() {
  console.log(`bench:scale  loading ${READINGS.toLocaleString("en-US")} readings [${load()}]`);
  const summary = await loadScale({ readings: READINGS, log: (l) => console.log(l) });
  console.log(
    `  loaded ${summary.readings.toLocaleString("en-US")} readings over ${summary.jobs} jobs in ${summary.shops.length} shops in ${(summary.ms / 1000).toFixed(0)} s [${load()}]`,
  );
  await closeSequelize();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
