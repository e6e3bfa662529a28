// POST /api/sync against the real MariaDB with hostile input, as property tests (fast-check):
// arbitrary unicode (lone surrogates, NUL, control characters, decomposed letters), figures with
// many decimals, huge and tiny figures, in direct and dial mode, and a resend after a lost answer.
// Whatever is sent: never a 5xx; a refused batch writes nothing; an accepted batch sent again
// exactly (or in another spelling of the same canonical form) is a replay, never a conflict.
// The seed is fixed (TW_FC_SEED overrides it, TW_FC_RUNS the number of batches); fast-check prints
// the seed and path of a failure.
import { randomUUID } from "node:crypto";
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import { dialDiameter } from "@/lib/domain";
import { canonicalText } from "@/lib/schemas/canonical-text";
import { Instrument } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { count, push } from "./sync-fixtures";

const seed = Number(process.env.TW_FC_SEED ?? 20261203);

let a: TestShop;
let dialId: number;

beforeAll(async () => {
  a = await createShop();
  const dial = await Instrument.create({
    shopId: a.shop.id,
    kind: "bore_gauge_dial",
    label: "Dial bore gauge",
    serial: `DB-${randomUUID().slice(0, 6)}`,
    unit: "in",
    resolution: 0.0001,
    expandedU: 0,
    calibrationDue: "2027-06-01",
    dialPlusMeansSmaller: true,
  });
  dialId = dial.id;
});

/** Mostly text a person types, often hostile text. */
const anyText = fc.oneof(
  { arbitrary: fc.string({ unit: "grapheme-composite", maxLength: 20 }), weight: 6 },
  { arbitrary: fc.string({ unit: "binary", maxLength: 20 }), weight: 1 },
  { arbitrary: fc.constantFrom("\ud800", "a\u0000b", "e\u0301", "x\r\ny", "\u001b[0m", "\udfff!"), weight: 1 },
);
const decimal = (min: number, max: number, places: number) =>
  fc.tuple(fc.integer({ min, max }), fc.integer({ min: 0, max: places })).map(([n, k]) => n / 10 ** k);
/** Mostly a figure its column keeps; often one with too many places, a huge or a tiny one. */
const hostile = (kept: fc.Arbitrary<number>) =>
  fc.oneof(
    { arbitrary: kept, weight: 12 },
    { arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }), weight: 1 },
    { arbitrary: fc.constantFrom(20.123, 4.0302005, -100000000, 100000000, 1e-7, 99999999.999999), weight: 1 },
  );
// Bores of the test engine's 8 cylinders, near its 4.03 in bore (tests/support/factories.ts).
const station = fc
  .tuple(fc.integer({ min: 1, max: 8 }), fc.constantFrom("top", "mid", "bottom"), fc.constantFrom("A", "B"))
  .map(([c, at, ax]) => `bore/${c}/${at}/${ax}`);
const bore = hostile(fc.integer({ min: 4_025_000, max: 4_035_000 }).map((n) => n / 1_000_000));

const temperature = fc.integer({ min: -30_00, max: 150_00 }).map((n) => n / 100);

const direct = fc.record(
  {
    stationId: station,
    value: bore,
    dialSetting: hostile(decimal(1, 99_999_999, 6)),
    dialDeviation: hostile(decimal(-99_999_999, 99_999_999, 6)),
    partTempC: hostile(temperature),
    gaugeTempC: hostile(temperature),
    note: anyText,
  },
  { requiredKeys: ["stationId", "value"] },
);
const dial = fc
  .record({
    stationId: station,
    dialSetting: hostile(fc.constantFrom(4.03, 4.0312, 4.030001)),
    dialDeviation: hostile(fc.integer({ min: -50, max: 50 }).map((d) => d / 10_000)),
    note: fc.option(anyText, { nil: undefined }),
  })
  .map(({ dialSetting, dialDeviation, ...rest }) => {
    let value: number;
    try {
      // What the tablet computes and sends (lib/offline/entry.ts).
      value = dialDiameter({ setting: dialSetting, deviation: dialDeviation, plusMeansSmaller: true });
    } catch {
      value = dialSetting;
    }
    return { ...rest, value, dialSetting, dialDeviation, entryMode: "dial", instrumentId: dialId };
  });
const skip = fc.record({ stationId: station, skipReason: anyText });

/** Now and then a job that is not there, a time the table cannot hold, a correction of nothing. */
const rarely = <T>(usual: T, odd: fc.Arbitrary<T>) =>
  fc.oneof({ arbitrary: fc.constant(usual), weight: 15 }, { arbitrary: odd, weight: 1 });
const item = fc
  .tuple(
    fc.oneof({ arbitrary: direct, weight: 3 }, { arbitrary: dial, weight: 2 }, { arbitrary: skip, weight: 1 }),
    fc.record({
      // Chained: the test shop exists only once beforeAll has run.
      jobId: fc.constant(0).chain(() => rarely(a.job.id, fc.integer({ min: 1, max: 2 ** 31 }))),
      takenAt: rarely(
        "2026-11-30T09:00:00.123Z",
        fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
      ),
      supersedes: rarely<string | undefined>(undefined, fc.uuid({ version: 4 })),
    }),
  )
  .map(([r, { supersedes, ...odd }]) => ({
    id: randomUUID(),
    unit: "in",
    ...odd,
    ...(supersedes ? { supersedes } : {}),
    ...("skipReason" in r ? { value: null, skipped: true } : {}),
    ...r,
  }));
const batch = fc.record({
  deviceId: fc.oneof(
    { arbitrary: fc.constant("tablet-prop"), weight: 2 },
    { arbitrary: anyText, weight: 1 },
    { arbitrary: fc.constantFrom("\ud800", "t\u0000", "e\u0301"), weight: 1 },
  ),
  readings: fc.array(item, { minLength: 1, maxLength: 3 }),
});

type Item = Record<string, unknown> & { id: string };
const stored = (ids: string[]) =>
  count(`SELECT COUNT(*) AS n FROM readings WHERE id IN (${ids.map(() => "?").join(",")})`, ids);
const written = async () => ({
  changes: await count("SELECT COUNT(*) AS n FROM sync_changes WHERE job_id = ?", [a.job.id]),
  audits: await count("SELECT COUNT(*) AS n FROM audit_events WHERE shop_id = ?", [a.shop.id]),
});
/** Another spelling of the same stored text: decomposed letters (NFD), CRLF line ends. */
const respelled = (r: Item): Item => {
  const out: Item = { ...r };
  for (const k of ["note", "skipReason"] as const)
    if (typeof r[k] === "string")
      out[k] = canonicalText(r[k] as string)
        .normalize("NFD")
        .replace(/\n/g, "\r\n");
  return out;
};

describe("POST /api/sync: the fuzzed batches of issue 12", () => {
  const valid = () => ({
    id: randomUUID(),
    jobId: a.job.id,
    stationId: "bore/1/top/A",
    value: 4.0302,
    unit: "in",
    takenAt: "2026-11-30T09:00:00.123Z",
  });
  it("refuses with words, never 500, and writes nothing", async () => {
    const cases: [unknown, unknown[], string][] = [
      ["\ud800", [valid()], "deviceId"],
      ["tablet-a\u0000", [valid()], "deviceId"],
      ["tablet-prop", [{ ...valid(), dialDeviation: -100000000 }], "readings.0.dialDeviation"],
      ["tablet-prop", [{ ...valid(), dialSetting: 100000000 }], "readings.0.dialSetting"],
      ["tablet-prop", [{ ...valid(), note: "ok \udc00" }], "readings.0.note"],
      ["tablet-prop", [valid(), { ...valid(), partTempC: 20.123 }], "readings.1.partTempC"],
    ];
    for (const [deviceId, readings, field] of cases) {
      const before = await written();
      const res = await push(a.users.machinist, readings, deviceId);
      expect(res.status).toBe(422);
      expect(Object.keys(res.body.error.fields)).toEqual([field]);
      expect(await stored(readings.map((r) => (r as Item).id))).toBe(0);
      expect(await written()).toEqual(before);
    }
  });

  it("takes a resend of figures at the column's precision and of decomposed text as a replay", async () => {
    const r = { ...valid(), stationId: "bore/2/top/A", value: 4.030001, partTempC: 20.12 };
    const first = await push(a.users.machinist, [{ ...r, note: "caf\u00e9\nline" }]);
    expect(first.status).toBe(200);
    const again = await push(a.users.machinist, [{ ...r, note: "cafe\u0301\r\nline", partTempC: 20.12 }]);
    expect(again.status).toBe(200);
    expect(again.body.results[0]).toMatchObject({ status: "accepted", replay: true });
  });

  it("takes an id in capitals as the same reading: a replay, one row, a correction's target", async () => {
    const r = { ...valid(), stationId: "bore/3/top/A" };
    expect((await push(a.users.machinist, [r])).status).toBe(200);
    const upper = await push(a.users.machinist, [{ ...r, id: r.id.toUpperCase() }]);
    expect(upper.status).toBe(200);
    expect(upper.body.results[0]).toMatchObject({ status: "accepted", replay: true, id: r.id });
    const s = { ...valid(), stationId: "bore/3/mid/A" };
    const both = await push(a.users.machinist, [{ ...s, id: s.id.toUpperCase() }, s]);
    expect(both.status).toBe(200);
    expect(await stored([s.id])).toBe(1);
    const fix = { ...valid(), stationId: "bore/3/top/A", value: 4.0303, supersedes: r.id.toUpperCase() };
    expect((await push(a.users.machinist, [fix])).status).toBe(200);
  });
});

describe("POST /api/sync with hostile input (property)", () => {
  it("never answers 5xx, writes nothing of a refused batch, and takes a resend as a replay", async () => {
    let accepted = 0;
    let refused = 0;
    await fc.assert(
      fc.asyncProperty(batch, async ({ deviceId, readings }) => {
        // Fresh ids for every run, so a shrunk counterexample is a new batch too.
        const sent: Item[] = readings.map((r) => ({ ...r, id: randomUUID() }));
        const ids = sent.map((r) => r.id);
        const before = await written();
        const res = await push(a.users.machinist, sent, deviceId);
        expect(res.status, JSON.stringify(res.body)).toBeLessThan(500);
        if (res.status !== 200) {
          refused++;
          expect([409, 422]).toContain(res.status);
          expect(await stored(ids)).toBe(0);
          expect(await written()).toEqual(before);
          return;
        }
        accepted++;
        expect(res.body.results.map((r: { status: string }) => r.status)).toEqual(sent.map(() => "accepted"));
        expect(await stored(ids)).toBe(new Set(ids).size);
        const after = await written();
        // The answer was lost: the tablet sends the batch again, exactly, then respelled.
        for (const again of [sent, sent.map(respelled)]) {
          const replay = await push(a.users.machinist, again, deviceId);
          expect(replay.status, JSON.stringify(replay.body)).toBe(200);
          for (const r of replay.body.results) expect(r).toMatchObject({ status: "accepted", replay: true });
        }
        expect(await stored(ids)).toBe(new Set(ids).size);
        expect(await written()).toEqual(after);
      }),
      { seed, numRuns: Number(process.env.TW_FC_RUNS ?? 60), endOnFailure: true },
    );
    // The generators reach both sides.
    expect(accepted).toBeGreaterThan(6);
    expect(refused).toBeGreaterThan(6);
  }, 120_000);
});
