import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { BenchDb } from "@/lib/offline/db";
import { recordReading } from "@/lib/offline/readings";
import { pushReadingSchema } from "@/lib/schemas/sync";
import { SKIP_REASON_MAX, skipReasonProblem } from "@/lib/schemas/text-limits";

// The skip reason's cap is the readings.skip_reason column (VARCHAR(255)); the tablet and the
// server refuse the same text in the same words.
const skip = (skipReason: string) => ({
  id: "6f1c2a8e-3b4d-4e5f-8a9b-0c1d2e3f4a5b",
  jobId: 1,
  stationId: "bore/1/top/A",
  value: null,
  unit: "in" as const,
  skipped: true,
  skipReason,
  takenAt: "2026-12-03T08:00:00Z",
});

describe("skip reason length", () => {
  it("takes 255 characters and refuses 256, on the tablet and on the server alike", () => {
    expect(SKIP_REASON_MAX).toBe(255);
    expect(skipReasonProblem("a".repeat(255))).toBeUndefined();
    const words = "The skip reason is 256 characters long; shorten it to 255 or fewer";
    expect(skipReasonProblem("a".repeat(256))).toBe(words);
    expect(pushReadingSchema.safeParse(skip("a".repeat(255))).success).toBe(true);
    const refused = pushReadingSchema.safeParse(skip("a".repeat(256)));
    expect(refused.success).toBe(false);
    expect(refused.error?.issues).toEqual([expect.objectContaining({ path: ["skipReason"], message: words })]);
  });

  it("counts the text without the spaces around it, and an empty reason says what to do", () => {
    expect(skipReasonProblem(`  ${"a".repeat(255)}  `)).toBeUndefined();
    expect(skipReasonProblem("   ")).toBe("Say why the station is skipped");
  });

  it("refuses on the tablet, in the server's words, text the server cannot store", () => {
    const reason = "worn\u0000";
    const words = skipReasonProblem(reason);
    expect(words).toBe(
      "The skip reason holds an invisible control character (U+0000) at character 5, which cannot be stored; " +
        "delete it (tabs and line breaks are fine)",
    );
    expect(pushReadingSchema.safeParse(skip(reason)).error?.issues[0].message).toBe(words);
    // Counted as stored: 255 composed letters typed decomposed (Unicode Standard Annex #15, NFC) fit.
    expect(skipReasonProblem("e\u0301".repeat(255))).toBeUndefined();
  });

  it("is refused by the tablet's store before anything is written", async () => {
    const db = new BenchDb(`skip-limit-${Date.now()}`);
    const ctx = { deviceId: "tab-test", takenBy: 7 };
    const { id: _id, takenAt: _at, ...reading } = skip("a".repeat(300));
    await expect(recordReading(db, reading, ctx)).rejects.toThrow(/300 characters long; shorten it to 255/);
    expect(await db.readings.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
  });
});
