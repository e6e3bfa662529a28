import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { READING_PRECISION, storedFigureProblem } from "@/lib/domain";
import { unstorableTextProblem } from "@/lib/schemas/canonical-text";
import { pushBatchSchema, pushReadingSchema } from "@/lib/schemas/sync";

// Property tests of the sync contract's edge: whatever a tablet (or anyone) sends, the schema
// either refuses it with words per field or hands back a reading in the stored form, which the
// database keeps exactly (so a resend compares equal to it).

const seed = Number(process.env.TW_FC_SEED ?? 20261203);
const runs = { seed, numRuns: 300 };

/** Mostly text a person types (composed or not), often hostile text. */
const anyText = fc.oneof(
  { arbitrary: fc.string({ unit: "grapheme-composite", maxLength: 30 }), weight: 3 },
  { arbitrary: fc.string({ unit: "binary", maxLength: 30 }), weight: 1 },
  {
    arbitrary: fc.constantFrom("\ud800", "a\u0000b", "e\u0301", "line\r\nnext", "\u001b[0m", "tab\there"),
    weight: 1,
  },
);
/** A decimal figure with up to `places` places, as a gauge or a keypad gives it. */
const decimal = (max: number, places: number) =>
  fc.tuple(fc.integer({ min: -max, max }), fc.integer({ min: 0, max: places })).map(([n, k]) => n / 10 ** k);
/** Mostly figures a column keeps; often many decimals, huge and tiny ones. */
const figure = (kept: fc.Arbitrary<number>) =>
  fc.oneof(
    { arbitrary: kept, weight: 6 },
    { arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }), weight: 1 },
    { arbitrary: decimal(1e12, 9), weight: 1 },
    { arbitrary: fc.constantFrom(20.123, 104.0180005, -100000000, 100000000, 1e-7, 99999999.999999), weight: 1 },
  );
const anyFigure = figure(decimal(99_999_999, 6));
const anySetting = figure(
  decimal(99_999_999, 6)
    .map(Math.abs)
    .filter((x) => x > 0),
);
const anyTemperature = figure(fc.integer({ min: -30_00, max: 150_00 }).map((n) => n / 100));
const reading = fc.record(
  {
    id: fc.uuid({ version: 4 }),
    jobId: fc.integer({ min: 1, max: 1000 }),
    stationId: fc.constantFrom("bore/1/top/A", "main-jrnl/2/front/A"),
    value: anyFigure,
    unit: fc.constantFrom("in", "mm"),
    entryMode: fc.constantFrom("direct", "dial"),
    dialSetting: anySetting,
    dialDeviation: anyFigure,
    instrumentId: fc.integer({ min: 1, max: 50 }),
    partTempC: anyTemperature,
    gaugeTempC: anyTemperature,
    note: anyText,
    takenAt: fc.constant("2026-12-03T08:00:00.123Z"),
  },
  { requiredKeys: ["id", "jobId", "stationId", "value", "unit", "takenAt"] },
);

const TEXT_FIELDS = ["note", "skipReason"] as const;
const FIGURES = Object.keys(READING_PRECISION) as (keyof typeof READING_PRECISION)[];

describe("the sync schema's stored form", () => {
  it("accepts only readings whose every text and figure the database keeps exactly", () => {
    let accepted = 0;
    fc.assert(
      fc.property(reading, (input) => {
        const parsed = pushReadingSchema.safeParse(input);
        if (!parsed.success) return;
        accepted++;
        for (const f of TEXT_FIELDS) {
          const text = parsed.data[f];
          if (text === undefined) continue;
          expect(unstorableTextProblem(text, f)).toBeUndefined();
          expect(text).toBe(text.normalize("NFC"));
          expect(text).not.toContain("\r");
        }
        for (const f of FIGURES) {
          const x = parsed.data[f];
          if (typeof x === "number") expect(storedFigureProblem(x, READING_PRECISION[f], f)).toBeUndefined();
        }
      }),
      runs,
    );
    // The generators reach accepted readings too, not only refusals.
    expect(accepted).toBeGreaterThan(runs.numRuns / 20);
  });

  it("refuses a figure its column cannot keep in every entry mode, naming the field", () => {
    fc.assert(
      fc.property(reading, fc.constantFrom(...FIGURES), (input, field) => {
        const x = input[field];
        if (x === undefined || !storedFigureProblem(x, READING_PRECISION[field], field)) return;
        const parsed = pushReadingSchema.safeParse(input);
        expect(parsed.success).toBe(false);
        expect(parsed.error?.issues.map((i) => i.path.join("."))).toContain(field);
      }),
      runs,
    );
  });

  it("is a fixed point: the stored form parses to itself, so a resend of it is the same reading", () => {
    fc.assert(
      fc.property(reading, (input) => {
        const once = pushReadingSchema.safeParse(input);
        if (once.success) expect(pushReadingSchema.parse(once.data)).toEqual(once.data);
      }),
      runs,
    );
  });

  it("refuses the fuzzed examples with words (issue 12)", () => {
    const base = { id: "6f1c2a8e-3b4d-4e5f-8a9b-0c1d2e3f4a5b", jobId: 1, stationId: "bore/1/top/A", unit: "mm" };
    const direct = { ...base, value: 101.6, takenAt: "2026-12-03T08:00:00Z" };
    const fields = (x: object) => pushReadingSchema.safeParse(x).error?.issues.map((i) => [i.path[0], i.message]);
    expect(fields({ ...direct, dialDeviation: -100000000 })).toEqual([
      [
        "dialDeviation",
        "The dial reading must lie between -99999999.999999 and 99999999.999999; -100000000 cannot be right, check it",
      ],
    ]);
    expect(fields({ ...direct, dialSetting: 100000000 })).toEqual([["dialSetting", expect.stringContaining("lie")]]);
    expect(fields({ ...direct, partTempC: 20.123 })).toEqual([
      ["partTempC", "Part temperature keeps 2 decimal places: 20.123 has 3; round it to 2 places"],
    ]);
    expect(fields({ ...direct, value: 104.0180005 })).toEqual([
      ["value", "The value keeps 6 decimal places: 104.0180005 has 7; round it to 6 places"],
    ]);
    expect(fields({ ...direct, note: "ok\ud800" })).toEqual([["note", expect.stringContaining("half of a character")]]);
    expect(fields({ ...direct, takenAt: "0001-01-01T00:00:00Z" })).toEqual([["takenAt", expect.any(String)]]);
    const batch = pushBatchSchema.safeParse({ deviceId: "\ud800", readings: [] });
    expect(batch.error?.issues.map((i) => [i.path[0], i.message])).toEqual([
      [
        "deviceId",
        "deviceId holds half of a character (U+D800) at character 1; delete it and type that character again",
      ],
    ]);
  });

  it("stores the device id and the note composed (NFC), line ends as LF, ids in lower case", () => {
    expect(pushBatchSchema.parse({ deviceId: " tablet-e\u0301 ", readings: [] }).deviceId).toBe("tablet-\u00e9");
    const r = pushReadingSchema.parse({
      id: "6f1c2a8e-3b4d-4e5f-8a9b-0c1d2e3f4a5b",
      jobId: 1,
      stationId: "bore/1/top/A",
      value: 4.0302,
      unit: "in",
      note: "honed\r\ncheck e\u0301",
      takenAt: "2026-12-03T08:00:00Z",
    });
    expect(r.note).toBe("honed\ncheck \u00e9");
    // RFC 9562, section 4: a UUID is written in lower case and read in either case.
    const upper = pushReadingSchema.parse({
      ...r,
      id: "6F1C2A8E-3B4D-4E5F-8A9B-0C1D2E3F4A5B",
      supersedes: "7F1C2A8E-3B4D-4E5F-8A9B-0C1D2E3F4A5B",
    });
    expect([upper.id, upper.supersedes]).toEqual([
      "6f1c2a8e-3b4d-4e5f-8a9b-0c1d2e3f4a5b",
      "7f1c2a8e-3b4d-4e5f-8a9b-0c1d2e3f4a5b",
    ]);
  });
});
