// The canonical release document (lib/server/release/hash.ts): order-independent, digit-exact.
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import {
  canonicalJson,
  canonicalReleaseDocument,
  decimalString,
  isoUtc,
  itemDigests,
  releaseHash,
  sha256Hex,
  type ReleaseSnapshot,
} from "@/lib/server/release/hash";

// Invented test fixture (not reference values): two readings, one correcting the other.
function snapshot(): ReleaseSnapshot {
  return {
    release: { jobId: 7, inspectorId: 3, signedName: "Hanne Test", signedAt: "2026-12-01T14:03:07.250Z" },
    job: {
      id: 7,
      shopId: 1,
      code: "T-1",
      customerId: 2,
      engineId: 4,
      unitSystem: "in",
      specRevision: 2,
      buildPlan: { bore: 4.03, rockerRatio: 1.5, notes: null },
    },
    readings: [
      {
        id: "b2c1e0f4-0000-4000-8000-000000000002",
        stationId: "bore/1/top/A",
        valueCanonical: "102.362540",
        supersedes: "a1c1e0f4-0000-4000-8000-000000000001",
        takenAt: "2026-11-30T09:00:00.000Z",
        skipped: false,
      },
      {
        id: "a1c1e0f4-0000-4000-8000-000000000001",
        stationId: "bore/1/top/A",
        valueCanonical: "102.365080",
        supersedes: null,
        takenAt: "2026-11-30T08:55:00.000Z",
        skipped: false,
      },
    ],
    limits: [
      { id: 11, characteristic: "bore_diameter", min: "4.029900", max: "4.030400" },
      { id: 10, characteristic: "bore_taper", min: null, max: "0.000500" },
    ],
    flags: [{ id: 5, state: "closed", disposition: "measure_again" }],
    dispositions: [
      { id: 9, flagId: 5, disposition: "measure_again", reason: null },
      { id: 8, flagId: 5, disposition: "measure_again", reason: "re-zero" },
    ],
    gauges: [{ id: 2, serial: "KF-DB-07", resolution: "0.000100", calibrationDue: "2027-05-12" }],
  };
}

/** The same content, every array reversed and every object's keys inserted in reverse order. */
function reordered(s: ReleaseSnapshot): ReleaseSnapshot {
  const flip = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(flip).reverse();
    if (v && typeof v === "object")
      return Object.fromEntries(
        Object.entries(v)
          .reverse()
          .map(([k, x]) => [k, flip(x)]),
      );
    return v;
  };
  return flip(s) as ReleaseSnapshot;
}

describe("sha256Hex", () => {
  it("gives the published digest of 'abc'", () => {
    // FIPS 180-2, Appendix B.1 (SHA-256 example "abc")
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
});

describe("canonicalJson", () => {
  it("sorts keys, drops undefined, writes no whitespace", () => {
    expect(canonicalJson({ b: 1, a: [true, null, "x"], c: undefined, A: { z: 0, y: -0 } })).toBe(
      '{"A":{"y":0,"z":0},"a":[true,null,"x"],"b":1}',
    );
  });
  it("orders keys by UTF-16 code units as RFC 8785 does", () => {
    // RFC 8785, 3.2.3: sorting is by UTF-16 code units, so "\u20ac" (€) sorts before "\ud83d\ude00" (😀)
    expect(canonicalJson({ "😀": 1, "€": 2, a: 3 })).toBe('{"a":3,"€":2,"😀":1}');
  });
  it("writes numbers as ECMAScript does and refuses NaN and Infinity", () => {
    // RFC 8785, 3.2.2.3 (ECMAScript Number serialisation): 1e21 → "1e+21", 0.000001 → "0.000001"
    expect(canonicalJson([1e21, 0.000001, 4.03])).toBe("[1e+21,0.000001,4.03]");
    expect(() => canonicalJson(Number.NaN)).toThrow(/NaN/);
    expect(() => canonicalJson(Number.POSITIVE_INFINITY)).toThrow(/Infinity/);
  });
});

describe("decimalString and isoUtc", () => {
  it("writes DECIMALs with the column's scale, as the database stores them", () => {
    expect(decimalString(101.6, 6)).toBe("101.600000");
    expect(decimalString("4.0301", 6)).toBe("4.030100");
    expect(decimalString(21.5, 2)).toBe("21.50");
    expect(decimalString(12345678.123456, 6)).toBe("12345678.123456"); // 14 digits: the widest DECIMAL(14,6)
    expect(decimalString(null, 6)).toBeNull();
  });
  it("writes times in UTC with milliseconds whatever the offset given", () => {
    expect(isoUtc("2026-12-01T15:03:07.25+01:00")).toBe("2026-12-01T14:03:07.250Z");
    expect(isoUtc(new Date(Date.UTC(2026, 11, 1, 14, 3, 7, 250)))).toBe("2026-12-01T14:03:07.250Z");
  });
});

describe("releaseHash", () => {
  it("gives the same hash for the same record in another order", () => {
    const a = snapshot();
    const b = reordered(a);
    expect(JSON.stringify(b)).not.toBe(JSON.stringify(a));
    expect(canonicalReleaseDocument(b)).toBe(canonicalReleaseDocument(a));
    expect(releaseHash(b)).toBe(releaseHash(a));
  });
  it("is the SHA-256 of the document, which has version 1 and sorted sections", () => {
    const doc = canonicalReleaseDocument(snapshot());
    expect(doc.startsWith('{"dispositions":[{"disposition":"measure_again","flagId":5,"id":8,')).toBe(true);
    expect(doc.endsWith('"version":1}')).toBe(true);
    expect(doc.indexOf('"id":"a1c1e0f4')).toBeLessThan(doc.indexOf('"id":"b2c1e0f4'));
    expect(releaseHash(snapshot())).toBe(createHash("sha256").update(doc, "utf8").digest("hex"));
  });
  it("changes when one digit of one stored value changes", () => {
    const changed = snapshot();
    changed.readings[1].valueCanonical = "102.365081";
    expect(releaseHash(changed)).not.toBe(releaseHash(snapshot()));
  });
  it("changes when a superseded reading is dropped from the history, or the signer's name changes", () => {
    const dropped = snapshot();
    dropped.readings.pop();
    const renamed = snapshot();
    renamed.release.signedName = "Hanne Tost";
    expect(releaseHash(dropped)).not.toBe(releaseHash(snapshot()));
    expect(releaseHash(renamed)).not.toBe(releaseHash(snapshot()));
  });
});

describe("itemDigests", () => {
  it("names the one record that changed", () => {
    const before = itemDigests(snapshot());
    const s = snapshot();
    s.limits[0].max = "4.030500";
    const after = itemDigests(s);
    expect(after.limits["11"]).not.toBe(before.limits["11"]);
    expect(after.limits["10"]).toBe(before.limits["10"]);
    expect(after.readings).toEqual(before.readings);
    expect(itemDigests(reordered(snapshot()))).toEqual(before);
  });
});
