import { describe, expect, it } from "vitest";
import { gaugeBudget } from "../../../../lib/domain";

describe("gaugeBudget", () => {
  it("takes the certificate's standard uncertainty as U/k", () => {
    // JCGM 100:2008 H.1.3.1 (from memory): a certificate's U = 0.075 µm at k = 3 gives u = 25 nm
    const b = gaugeBudget({ expandedU: 0.075, coverageK: 3 });
    expect(b.lines).toEqual([{ source: "certificate", standardU: expect.closeTo(0.025, 15) }]);
    expect(b.uc).toBeCloseTo(0.025, 15);
    expect(b.U).toBeCloseTo(0.05, 15);
  });

  it("combines certificate, one reading's repeatability s and resolution δ/√12 in quadrature, U = 2·uc", () => {
    // JCGM 100:2008 eq. (10), 4.2.3 (s of one observation), F.2.2.1 (δ/√12), 6.2 (U = k·uc)
    const b = gaugeBudget({ expandedU: 0.002, coverageK: 2, resolution: 0.001, study: { repeatSd: 0.0012 } });
    expect(b.lines.map((l) => l.source)).toEqual(["certificate", "repeatability", "resolution"]);
    expect(b.lines[0].standardU).toBeCloseTo(0.001, 15);
    expect(b.lines[1].standardU).toBeCloseTo(0.0012, 15);
    expect(b.lines[2].standardU).toBeCloseTo(0.000288675134595, 14);
    // √(0.001² + 0.0012² + 0.000288675²) = 0.0015885003
    expect(b.uc).toBeCloseTo(0.00158850034, 11);
    expect(b.U).toBeCloseTo(0.00317700068, 11);
  });

  it("leaves out a line it has no figure for, and refuses a k that is not above zero", () => {
    expect(gaugeBudget({ expandedU: 0.002, coverageK: 2, resolution: 0 }).lines).toHaveLength(1);
    expect(() => gaugeBudget({ expandedU: 0.002, coverageK: 0 })).toThrow(/coverage factor k/);
  });
});
