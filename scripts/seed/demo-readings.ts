// DEMO DATA ONLY: invented bench readings for the three invented demo jobs, written through the
// real ingest (lib/server/sync/ingest.ts), so every verdict and flag is the server's own.
//   KF-2611 pickup V8: bores 1–7 and the top of 8 (dial bore gauge), all five mains with their
//     installed bearing bores, end play and two torque groups. Cylinder 3 tapers past 0.0005 in
//     (top over size, bottom on the lower limit: marginal with the gauge's U), main 3 front has a
//     tight oil clearance, and the end play was read with the dial indicator that is past its
//     calibration due date (flagged for that reason).
//   KF-2612 tractor diesel (mm): all bores and mains with bearing bores; bore 2 top B is marginal.
//   KF-2613 vintage six: the first two bores at the top only, and the deck.
import { randomUUID } from "node:crypto";
import type { PushReadingInput } from "@/lib/schemas/sync";
import { ingestBatch } from "@/lib/server/sync/ingest";
import { models } from "@/lib/server/core/db";
import type { DemoContext } from "./demo";

type Entry = [stationId: string, value: number, extra?: Partial<PushReadingInput>];
const AXES = ["A", "B"] as const;
const at = (day: number, minute: number) => new Date(Date.UTC(2026, 10, day, 8, 0) + minute * 60_000).toISOString();

/** Dial bore gauge zeroed on `setting`; plus on the dial means a smaller bore (that gauge's setting). */
function dial(stationId: string, setting: number, deviation: number, gauge: number): Entry {
  const value = Number((setting - deviation).toFixed(4));
  return [stationId, value, { entryMode: "dial", dialSetting: setting, dialDeviation: deviation, instrumentId: gauge }];
}

function v8(g: DemoContext["instruments"]): Entry[] {
  const bores: Entry[] = [];
  const depthDial = { top: -0.0002, mid: -0.0001, bottom: -0.0001 }; // 4.0302, 4.0301, 4.0301
  for (let c = 1; c <= 7; c++) {
    for (const [d, dev] of Object.entries(depthDial)) {
      for (const a of AXES) {
        // Cylinder 3, axis A: 4.0305 / 4.0302 / 4.0299, a taper of 0.0006 (out-of-round at the top 0.0003).
        const cyl3 = c === 3 && a === "A" ? { top: -0.0005, mid: -0.0002, bottom: 0.0001 }[d]! : dev;
        bores.push(dial(`bore/${c}/${d}/${a}`, 4.03, cyl3, g.dialBore));
      }
    }
  }
  bores.push(dial("bore/8/top/A", 4.03, -0.0002, g.dialBore), dial("bore/8/top/B", 4.03, -0.0001, g.dialBore));
  const mains: Entry[] = [];
  for (let m = 1; m <= 5; m++) {
    for (const p of ["front", "rear"]) {
      for (const a of AXES) {
        const journal = a === "A" ? 2.449 : 2.4491;
        const tight = m === 3 && p === "front" && a === "A";
        mains.push([`main/${m}/${p}/${a}`, journal, { instrumentId: g.mic }]);
        mains.push([
          `main-brg/${m}/${p}/${a}`,
          tight ? 2.4507 : Number((journal + 0.0022).toFixed(4)),
          { instrumentId: g.dialBore },
        ]);
      }
    }
  }
  return [
    ...bores,
    ...mains,
    ["end-play", 0.0045, { instrumentId: g.indicator }],
    ["torque/main-caps", 72, { unit: "lbf_ft", instrumentId: g.torque, lubricant: "engine-oil" }],
    ["torque/flywheel", 62, { unit: "lbf_ft", instrumentId: g.torque, lubricant: "thread-sealant" }],
  ];
}

function diesel(g: DemoContext["instruments"]): Entry[] {
  const out: Entry[] = [];
  const bore = { top: 104.018, mid: 104.014, bottom: 104.012 };
  // Bore 2 runs large; its top on axis B, 104.033 mm, is 2 µm under the H7 maximum (104.035) and
  // within the gauge's U = 3 µm of it: marginal. Taper and out-of-round stay well inside.
  const bore2 = {
    "top/A": 104.028,
    "mid/A": 104.025,
    "bottom/A": 104.024,
    "top/B": 104.033,
    "mid/B": 104.029,
    "bottom/B": 104.027,
  } as Record<string, number>;
  for (let c = 1; c <= 4; c++) {
    for (const [d, v] of Object.entries(bore)) {
      for (const a of AXES) {
        const value = c === 2 ? bore2[`${d}/${a}`] : Number((v + (a === "B" ? 0.002 : 0)).toFixed(3));
        out.push([`bore/${c}/${d}/${a}`, value, { unit: "mm", instrumentId: g.boreMm }]);
      }
    }
  }
  for (let m = 1; m <= 5; m++) {
    for (const p of ["front", "rear"]) {
      for (const a of AXES) {
        out.push([`main/${m}/${p}/${a}`, a === "A" ? 84.99 : 84.991, { unit: "mm", instrumentId: g.micMm }]);
        out.push([`main-brg/${m}/${p}/${a}`, 85.052, { unit: "mm", instrumentId: g.boreMm }]);
      }
    }
  }
  return out;
}

function six(g: DemoContext["instruments"]): Entry[] {
  return [
    dial("bore/1/top/A", 3.5925, -0.0002, g.dialBore),
    dial("bore/1/top/B", 3.5925, -0.0001, g.dialBore),
    dial("bore/2/top/A", 3.5925, -0.0002, g.dialBore),
    dial("bore/2/top/B", 3.5925, -0.0003, g.dialBore),
    ["deck/block/front", 9.381, { instrumentId: g.deck }],
    ["deck/block/rear", 9.379, { instrumentId: g.deck }],
  ];
}

async function push(
  actor: Parameters<typeof ingestBatch>[0],
  jobId: number,
  day: number,
  device: string,
  entries: Entry[],
) {
  const readings = entries.map(([stationId, value, extra], i): PushReadingInput => ({
    id: randomUUID(),
    jobId,
    stationId,
    value,
    unit: "in",
    entryMode: "direct",
    takenAt: at(day, i * 2),
    ...extra,
  }));
  const reply = await ingestBatch(actor, { deviceId: device, readings });
  if (reply.status !== 200)
    throw new Error(`Demo readings for job ${jobId} were refused: ${JSON.stringify(reply.body).slice(0, 800)}`);
}

/** Adds the demo readings; returns the context unchanged so seedDemo can end with it. */
export async function seedDemoReadings(ctx: DemoContext): Promise<DemoContext> {
  const rosa = await models().User.findByPk(ctx.users.machinist);
  if (!rosa) throw new Error("The demo machinist is missing; seed the people first");
  const actor = { userId: rosa.id, shopId: ctx.shopId, role: "machinist" as const, name: rosa.name, email: rosa.email };
  await push(actor, ctx.jobs.v8, 24, "demo-tablet-1", v8(ctx.instruments));
  await push(actor, ctx.jobs.diesel, 26, "demo-tablet-2", diesel(ctx.instruments));
  await push(actor, ctx.jobs.six, 27, "demo-tablet-1", six(ctx.instruments));
  return ctx;
}
