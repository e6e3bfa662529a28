// A job for the inspector's browser test, prepared in the test database of the demo shop: a copy
// of the demo vintage six (same engine shape, same limits as KF-2613) with every station read in
// spec EXCEPT the ones the test clears through the APIs as the machinist and the lead. Its own
// gauges are due a year from now, so the test does not age. INVENTED DEMO/TEST FIGURES (inch),
// picked inside the demo spec sheet's limits (scripts/seed/demo-specs.ts, VINTAGE_SIX_INCH).
import { randomUUID } from "node:crypto";
import { benchRoute, convertLength, convertTorque } from "@/lib/domain";
import { getSequelize } from "@/lib/server/core/db";
import { toEngineShape } from "@/lib/server/jobs/context";
import { Engine, Instrument, Job, JobLimit, Reading, Shop, User } from "@/models";

// Bore 3.5927 and skirt 3.5905 give 0.0022 piston-to-wall; bearing bores sit 0.0022 over their
// journals (oil clearance); bolts stretch 0.0058.
const INCH: Record<string, number> = {
  bore_diameter: 3.5927,
  main_journal_diameter: 2.4985,
  rod_journal_diameter: 2.1235,
  main_bearing_bore: 2.5007,
  rod_bearing_bore: 2.1257,
  piston_skirt_diameter: 3.5905,
  rod_side_clearance: 0.015,
  crank_end_play: 0.004,
  rod_bolt_free_length: 2.0,
  rod_bolt_loaded_length: 2.0058,
  deck_height: 9.38,
};
const RING_GAP: Record<string, number> = { top: 0.019, second: 0.021, third: 0.021, oil: 0.03 };
const TORQUE: Record<string, number> = { "main-caps": 72, "head-bolts": 67, "rod-bolts": 47, flywheel: 62, damper: 62 };
const GAUGE_OF: Record<string, string> = {
  bore_diameter: "bore",
  main_bearing_bore: "bore",
  rod_bearing_bore: "bore",
  deck_height: "deck",
  crank_end_play: "indicator",
  rod_bolt_free_length: "stretch",
  rod_bolt_loaded_length: "stretch",
  fastener_torque: "torque",
  ring_end_gap: "feeler",
  rod_side_clearance: "feeler",
  valve_lash: "feeler",
};

/** The entered value of a station (inch or lbf·ft), in spec for the demo six. */
export function inSpecValue(stationId: string, characteristic: string): number {
  const parts = stationId.split("/");
  if (characteristic === "ring_end_gap") return RING_GAP[parts[2]];
  if (characteristic === "valve_lash") return parts[2].startsWith("int") ? 0.018 : 0.02;
  if (characteristic === "fastener_torque") return TORQUE[parts[1]];
  return INCH[characteristic];
}

async function gauges(shopId: number, tag: string) {
  const due = new Date(Date.now() + 365 * 86_400_000).toISOString().slice(0, 10);
  const today = new Date().toISOString().slice(0, 10);
  const make = (kind: string, label: string, unit: string, resolution: number, expandedU: number) =>
    Instrument.create({
      shopId,
      kind,
      label: `${label} (test ${tag})`,
      serial: `T-${kind}-${tag}`,
      unit,
      resolution,
      expandedU,
      calibratedOn: today,
      calibrationDue: due,
    });
  return {
    bore: (await make("bore_gauge_digital", "Digital bore gauge", "in", 0.0001, 0.0001)).id,
    mic: (await make("outside_mic", "Outside micrometer", "in", 0.0001, 0.00008)).id,
    indicator: (await make("dial_indicator", "Dial indicator", "in", 0.0001, 0.0002)).id,
    stretch: (await make("stretch_gauge", "Stretch gauge", "in", 0.0001, 0.0001)).id,
    deck: (await make("deck_gauge", "Deck height gauge", "in", 0.0005, 0.0005)).id,
    feeler: (await make("feeler", "Feeler set", "in", 0.001, 0.0005)).id,
    torque: (await make("torque_wrench", "Torque wrench", "lbf_ft", 1, 2)).id,
  };
}

/** The prepared job, with the stations left for the test to send through /api/sync. */
export async function prepareInspectorJob(leaveOut: string[]) {
  getSequelize();
  const shop = (await Shop.findOne({ where: { slug: "kestrel-flats" } }))!;
  const six = (await Job.findOne({ where: { shopId: shop.id, code: "KF-2613" } }))!;
  const sixEngine = (await Engine.findByPk(six.engineId))!;
  const rosa = (await User.findOne({ where: { shopId: shop.id, role: "machinist" } }))!;
  const tag = randomUUID().slice(0, 4).toUpperCase();
  const { id: _id, createdAt: _c, updatedAt: _u, ...engineFields } = sixEngine.get({ plain: true });
  const engine = await Engine.create({
    ...engineFields,
    description: `Vintage inline six, second build (test ${tag})`,
  });
  const job = await Job.create({
    shopId: shop.id,
    customerId: six.customerId,
    engineId: engine.id,
    templateId: six.templateId,
    code: `KF-T${tag}`,
    title: `Vintage six, inspector path (test ${tag})`,
    unitSystem: "in",
    status: "review",
    notes: "Prepared by the inspector browser test.",
    finishedBore: six.finishedBore,
    finishedMainJournal: six.finishedMainJournal,
    finishedRodJournal: six.finishedRodJournal,
  });
  const limits = await JobLimit.findAll({ where: { jobId: six.id } });
  await JobLimit.bulkCreate(
    limits.map((l) => {
      const { id: _i, jobId: _j, createdAt: _a, updatedAt: _b, ...rest } = l.get({ plain: true });
      return { ...rest, jobId: job.id };
    }),
  );
  const g = await gauges(shop.id, tag);
  const stations = benchRoute(toEngineShape(engine, { unitSystem: "in" }))
    .sections.flatMap((s) => s.stations)
    .filter((s) => !leaveOut.includes(s.id));
  const takenAt = new Date(Date.now() - 3_600_000);
  await Reading.bulkCreate(
    stations.map((s) => {
      const value = inSpecValue(s.id, s.characteristic);
      return {
        id: randomUUID(),
        shopId: shop.id,
        jobId: job.id,
        stationId: s.id,
        characteristic: s.characteristic,
        value: value,
        unit: s.unit,
        valueCanonical: s.torque ? convertTorque(value, "lbf_ft", "nm") : convertLength(value, "in", "mm"),
        instrumentId: g[(GAUGE_OF[s.characteristic] ?? "mic") as keyof typeof g],
        lubricant: s.torque ? "engine-oil" : null,
        takenBy: rosa.id,
        takenAt,
        deviceId: "bench-tablet-2",
        verdict: "in_spec" as const,
      };
    }),
  );
  return { shopId: shop.id, jobId: job.id, code: job.code, gauges: g };
}
