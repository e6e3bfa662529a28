// Test data for the release tests: a createShop() job filled in at every station of its bench
// route (taken from lib/domain's benchRoute, independent of the checklist under test), with a
// build plan. All figures are invented fixtures, not reference values.
import { randomUUID } from "node:crypto";
import { benchRoute } from "@/lib/domain";
import type { FlagState } from "@/lib/schemas/enums";
import { getSequelize } from "@/lib/server/core/db";
import { toEngineShape } from "@/lib/server/jobs/context";
import { Engine, Flag, FlagDisposition, Instrument, Job, Reading } from "@/models";
import { gaugeFor, type TestShop } from "../support/factories";

export const COMPLETE_PLAN = {
  lengthUnit: "in",
  bore: 4.03,
  stroke: 3.48,
  rodLength: 5.7,
  compressionHeight: 1.56,
  pistonTop: "dish",
  pistonVolumeCc: 5,
  chamberCc: 64,
  gasketBore: 4.1,
  gasketThickness: 0.04,
  deckHeight: 9.025,
  intakeLobeLift: 0.3,
  exhaustLobeLift: 0.31,
  rockerRatio: 1.5,
};

export async function routeStations(shop: TestShop) {
  getSequelize();
  const job = await Job.findByPk(shop.job.id);
  const engine = await Engine.findByPk(job!.engineId);
  return benchRoute(toEngineShape(engine!, job!)).sections.flatMap((s) => s.stations);
}

type ReadingOverrides = Partial<{
  skipped: boolean;
  skipReason: string;
  lubricant: string | null;
  instrumentId: number | null;
  takenAt: Date;
  valueCanonical: number;
}>;

/** Readings at every station of the route (or the ones given), in spec, with a gauge in calibration. */
export async function fillReadings(
  shop: TestShop,
  opts: { only?: string[]; except?: string[]; overrides?: Record<string, ReadingOverrides> } = {},
) {
  const stations = (await routeStations(shop)).filter(
    (s) => (!opts.only || opts.only.includes(s.id)) && !opts.except?.includes(s.id),
  );
  const takenAt = new Date(Date.now() - 60_000);
  const rows = stations.map((s) => {
    const o = opts.overrides?.[s.id] ?? {};
    return {
      id: randomUUID(),
      shopId: shop.shop.id,
      jobId: shop.job.id,
      stationId: s.id,
      characteristic: s.characteristic,
      valueCanonical: o.skipped ? null : (o.valueCanonical ?? (s.torque ? 94.9 : 50.8)),
      value: o.skipped ? null : s.torque ? 70 : 2,
      unit: s.unit,
      instrumentId: o.instrumentId === undefined ? gaugeFor(shop.shop.id, s.id) : o.instrumentId,
      lubricant: s.torque ? (o.lubricant === undefined ? "engine-oil" : o.lubricant) : null,
      skipped: o.skipped ?? false,
      skipReason: o.skipReason ?? null,
      takenBy: shop.users.machinist.id,
      takenAt: o.takenAt ?? takenAt,
      deviceId: "test-tablet",
      verdict: o.skipped ? null : ("in_spec" as const),
    };
  });
  await Reading.bulkCreate(rows);
  return rows;
}

export async function setPlan(shop: TestShop, plan: Record<string, unknown> | null = COMPLETE_PLAN) {
  getSequelize();
  await Job.update({ buildPlan: plan as never }, { where: { id: shop.job.id } });
}

/** A job with nothing left on its checklist. */
export async function completeJob(shop: TestShop) {
  const readings = await fillReadings(shop);
  await setPlan(shop);
  return readings;
}

export async function pastDueGauge(shop: TestShop) {
  getSequelize();
  const g = await Instrument.create({
    shopId: shop.shop.id,
    kind: "bore_gauge_dial",
    label: "Old dial bore gauge",
    serial: `OLD-${shop.job.code}`,
    unit: "in",
    resolution: 0.0001,
    expandedU: 0.00015,
    calibratedOn: "2024-01-10",
    calibrationDue: "2025-01-10",
  });
  return g.id;
}

export async function addFlag(
  shop: TestShop,
  stationId: string,
  fields: Partial<{
    state: FlagState;
    disposition: "measure_again" | "machine_again" | "accept";
    operation: string;
    dispositionReason: string;
  }> = {},
) {
  getSequelize();
  const flag = await Flag.create({
    shopId: shop.shop.id,
    jobId: shop.job.id,
    stationId,
    characteristic: "bore_diameter",
    value: 102.4,
    unit: "in",
    limitMin: 4.0295,
    limitMax: 4.0305,
    deviation: 0.0012,
    verdict: "out_of_spec",
    reason: "out_of_spec",
    state: fields.state ?? "open",
    disposition: fields.disposition ?? null,
    operation: fields.operation ?? null,
    dispositionReason: fields.dispositionReason ?? null,
    disposedBy: fields.disposition ? shop.users.lead.id : null,
    disposedAt: fields.disposition ? new Date() : null,
  });
  if (fields.disposition) {
    await FlagDisposition.create({
      flagId: flag.id,
      disposition: fields.disposition,
      operation: fields.operation ?? null,
      reason: fields.dispositionReason ?? null,
      userId: shop.users.lead.id,
    });
  }
  return flag.id;
}
