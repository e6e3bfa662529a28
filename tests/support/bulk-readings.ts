// Many readings on a factory shop's job at once (the streaming exports' tests), in bulk inserts.
import { randomUUID } from "node:crypto";
import { Reading } from "@/models";
import type { TestShop } from "./factories";

/** The last reading's skip reason: a comma and quotes, for RFC 4180 quoting. */
export const SKIP_REASON = 'Sleeved, "dry" liner';

/** `count` readings over the top bores of the V8 (station n % 8), a second apart; the last a skip. */
export async function fillReadings(s: TestShop, count: number) {
  const start = Date.UTC(2026, 10, 1, 8, 0, 0);
  for (let from = 0; from < count; from += 1000) {
    const rows = [];
    for (let i = from; i < Math.min(count, from + 1000); i++) {
      const skip = i === count - 1;
      const value = 4.03 + (i % 10) / 10_000;
      rows.push({
        id: randomUUID(),
        shopId: s.shop.id,
        jobId: s.job.id,
        stationId: `bore/${(i % 8) + 1}/top/A`,
        characteristic: "bore_diameter",
        value: skip ? null : value,
        valueCanonical: skip ? null : value * 25.4,
        unit: "in",
        takenBy: s.users.machinist.id,
        takenAt: new Date(start + i * 1000),
        deviceId: "bulk",
        skipped: skip,
        skipReason: skip ? SKIP_REASON : null,
        verdict: skip ? null : ("in_spec" as const),
      });
    }
    await Reading.bulkCreate(rows);
  }
}
