import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { utcDate, utcText } from "@/lib/server/core/sql-driver";

// The driver hands DATETIME(3) back as "YYYY-MM-DD hh:mm:ss.fff" (UTC): read by position, it must
// give the instant ECMAScript's own ISO 8601 parse gives (ECMA-262, Date Time String Format).
const iso = (s: string) => new Date(`${s.replace(" ", "T")}Z`);

describe("utcDate", () => {
  it("reads the server's text as the same instant as an ISO 8601 parse, for any date", () => {
    const instants = fc.date({
      min: new Date("1000-01-01T00:00:00Z"),
      max: new Date("9999-12-31T23:59:59.999Z"),
      noInvalidDate: true,
    });
    fc.assert(
      fc.property(instants, (d) => {
        const text = utcText(d);
        expect(utcDate(text)!.getTime()).toBe(iso(text).getTime());
        expect(utcDate(text)!.getTime()).toBe(d.getTime());
      }),
      { numRuns: 2000 },
    );
  });

  it("reads other shapes as before: a day, whole seconds, six decimals, a Date, null", () => {
    expect(utcDate("2026-12-03")!.toISOString()).toBe("2026-12-03T00:00:00.000Z");
    expect(utcDate("2026-12-03 08:15:30")!.toISOString()).toBe("2026-12-03T08:15:30.000Z");
    expect(utcDate("2026-12-03 08:15:30.123456")!.toISOString()).toBe("2026-12-03T08:15:30.123Z");
    expect(utcDate("0999-12-31 23:59:59.999")!.toISOString()).toBe("0999-12-31T23:59:59.999Z");
    const d = new Date();
    expect(utcDate(d)).toBe(d);
    expect(utcDate(null)).toBeNull();
  });
});
