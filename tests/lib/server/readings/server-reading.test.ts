// The tablet's view of a stored reading (job pack and sync feed): every stored field but the shop,
// in the stored order (READING_COLUMNS), times as ISO 8601 UTC text, and what corrects it.
import { describe, expect, it } from "vitest";
import { READING_FIELDS, type StoredReading } from "@/lib/schemas/readings";
import { toServerReading } from "@/lib/server/readings/server-reading";

// Invented test figures, every field set to something other than its default.
const stored: StoredReading = {
  id: "8c0e3f0e-1b7a-4a53-9a35-4f0c8e1d2b11",
  shopId: 7,
  jobId: 42,
  stationId: "bore/3/mid/B",
  characteristic: "bore_diameter",
  valueCanonical: 102.36962,
  value: 4.0303,
  unit: "in",
  entryMode: "dial",
  dialSetting: 4.03,
  dialDeviation: 0.0003,
  instrumentId: 9,
  partTempC: 21.5,
  gaugeTempC: 20.5,
  lubricant: "oil",
  skipped: false,
  skipReason: "none needed",
  note: "second try",
  takenBy: 3,
  takenAt: new Date("2026-11-30T09:30:01.234Z"),
  receivedAt: new Date("2026-11-30T09:30:05.678Z"),
  deviceId: "tablet-2",
  supersedes: "0a4b7a5e-7c1b-4e51-8d0e-3c2b1a0f9e88",
  verdict: "marginal",
  verdictNote: "gauge_past_due",
  limitMin: 4.03,
  limitMax: 4.0315,
  deviation: 0.00005,
};

describe("toServerReading", () => {
  it("carries every stored field but the shop, in the stored order, then what corrects it", () => {
    const out = toServerReading(stored, "c1");
    expect(Object.keys(out)).toEqual([...READING_FIELDS.filter((k) => k !== "shopId"), "supersededBy"]);
    const { shopId: _shop, ...rest } = stored;
    expect(out).toEqual({
      ...rest,
      takenAt: "2026-11-30T09:30:01.234Z",
      receivedAt: "2026-11-30T09:30:05.678Z",
      supersededBy: "c1",
    });
  });

  it("says nothing corrects a current reading", () => {
    expect(toServerReading(stored, null).supersededBy).toBeNull();
  });
});
