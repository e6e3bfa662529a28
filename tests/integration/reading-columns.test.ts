// One readings data path: the Sequelize model and the sync path's raw SQL read and write the same
// columns under the same field names, because both take them from READING_COLUMNS.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { READING_COLUMNS, READING_FIELDS, type StoredReading } from "@/lib/schemas/readings";
import { getSequelize } from "@/lib/server/core/db";
import { readingsOfJobs } from "@/lib/server/readings/repo";
import { Reading } from "@/models";
import { createShop, type TestShop } from "../support/factories";

let s: TestShop;
beforeAll(async () => {
  s = await createShop();
});

describe("the readings column map", () => {
  it("names every column of the migrated readings table, and the model maps each field to it", async () => {
    const columns = await getSequelize().query<{ Field: string }>("SHOW COLUMNS FROM readings", {
      type: "SELECT" as never,
    });
    expect(columns.map((c) => c.Field).sort()).toEqual(
      [...Object.values(READING_COLUMNS), "created_at", "updated_at"].sort(),
    );
    const attributes = Reading.getAttributes();
    for (const field of READING_FIELDS) expect(attributes[field].field).toBe(READING_COLUMNS[field]);
  });

  it("a reading written through the model reads back field for field through the raw SQL", async () => {
    // Every field set to something other than its default (invented test figures).
    const written: StoredReading = {
      id: randomUUID(),
      shopId: s.shop.id,
      jobId: s.job.id,
      stationId: "bore/3/mid/B",
      characteristic: "bore_diameter",
      valueCanonical: 102.36962,
      value: 4.0303,
      unit: "in",
      entryMode: "dial",
      dialSetting: 4.03,
      dialDeviation: -0.0003,
      instrumentId: s.instrument.id,
      partTempC: 21.5,
      gaugeTempC: 20.25,
      lubricant: "engine_oil",
      skipped: false,
      skipReason: null,
      note: "second pass",
      takenBy: s.users.machinist.id,
      takenAt: new Date("2026-12-01T08:30:00.123Z"),
      receivedAt: new Date("2026-12-01T08:31:00.456Z"),
      deviceId: "tab-columns",
      supersedes: null,
      verdict: "marginal",
      verdictNote: "gauge_past_due",
      limitMin: 4.0295,
      limitMax: 4.0305,
      deviation: 0.0003,
    };
    await Reading.create(written);
    // The columns by their migrated names, written out here as the independent check of the map.
    const [row] = await getSequelize().query<Record<string, unknown>>("SELECT * FROM readings WHERE id = ?", {
      replacements: [written.id],
      type: "SELECT" as never,
    });
    expect({
      value: Number(row.value_entered),
      unit: row.unit_entered,
      canonical: Number(row.value_canonical),
      dial: [Number(row.dial_setting), Number(row.dial_deviation)],
      temps: [Number(row.part_temp_c), Number(row.gauge_temp_c)],
      limits: [Number(row.limit_min), Number(row.limit_max), Number(row.deviation)],
      who: [row.taken_by, row.device_id, row.instrument_id, row.entry_mode, row.lubricant, row.note],
      verdict: [row.verdict, row.verdict_note],
      station: [row.station_id, row.characteristic, row.shop_id, row.job_id],
    }).toEqual({
      value: 4.0303,
      unit: "in",
      canonical: 102.36962,
      dial: [4.03, -0.0003],
      temps: [21.5, 20.25],
      limits: [4.0295, 4.0305, 0.0003],
      who: [s.users.machinist.id, "tab-columns", s.instrument.id, "dial", "engine_oil", "second pass"],
      verdict: ["marginal", "gauge_past_due"],
      station: ["bore/3/mid/B", "bore_diameter", s.shop.id, s.job.id],
    });
    const [raw] = await readingsOfJobs([s.job.id], [written.id]);
    expect(raw).toEqual(written);
    const viaModel = (await Reading.findByPk(written.id))!.get({ plain: true });
    const { createdAt: _c, updatedAt: _u, ...fields } = viaModel;
    expect(fields).toEqual(written);
  });
});
