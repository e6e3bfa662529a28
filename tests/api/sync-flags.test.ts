// Flags raised by POST /api/sync: raw and derived values, corrections, and auto-close.
// Expected derived values follow from the definitions (taper = largest spread of one axis over the
// depths; oil clearance = bearing bore − journal; common practice, from memory) and the
// INCH_LIMITS of tests/support/factories.ts.
import { beforeEach, describe, expect, it } from "vitest";
import { GET as PACK } from "@/app/api/bench/jobs/[jobId]/route";
import { getSequelize } from "@/lib/server/core/db";
import { JobLimit } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { count, flagsOf, later, push, reading, syncedInAudit } from "./sync-fixtures";

let s: TestShop;
beforeEach(async () => {
  s = await createShop();
});

describe("flags for raw readings", () => {
  it("an out-of-spec bore opens one flag; a replay does not open another", async () => {
    const r = reading(s.job.id, "bore/1/top/A", 4.0312); // 0.0007 over the 4.0305 maximum
    const res = await push(s.users.machinist, [r]);
    expect(res.body.results[0].evaluation).toMatchObject({
      verdict: "out_of_spec",
      limitMax: 4.0305,
      deviation: 0.0012,
    });
    await push(s.users.machinist, [r]);
    expect(await flagsOf(s.job.id)).toMatchObject([
      { readingId: r.id, stationId: "bore/1/top/A", state: "open", reason: "out_of_spec", verdict: "out_of_spec" },
    ]);
    expect(
      await count("SELECT COUNT(*) AS n FROM audit_events WHERE action = 'flag.open' AND shop_id = ?", [s.shop.id]),
    ).toBe(1);
    expect(await count("SELECT COUNT(*) AS n FROM sync_changes WHERE entity = 'flag' AND job_id = ?", [s.job.id])).toBe(
      1,
    );
  });

  it("a reading within U of a limit is marginal and flagged as such", async () => {
    // 4.0305 is on the maximum: in the specification zone but within U = 0.0001 of it (ISO 14253-1 guard band)
    const r = reading(s.job.id, "bore/1/top/A", 4.0305, { instrumentId: s.instrument.id });
    const res = await push(s.users.machinist, [r]);
    expect(res.body.results[0].verdict).toBe("marginal");
    expect(await flagsOf(s.job.id)).toMatchObject([{ reason: "marginal", verdict: "marginal" }]);
  });

  it("a correction supersedes the old reading, keeps it as history and closes its flag when in spec", async () => {
    const bad = reading(s.job.id, "bore/2/mid/B", 4.0293);
    await push(s.users.machinist, [bad]);
    const fix = reading(s.job.id, "bore/2/mid/B", 4.0299, { supersedes: bad.id, takenAt: later(5) });
    const res = await push(s.users.machinist, [fix]);
    expect(res.status).toBe(200);
    expect(await flagsOf(s.job.id)).toMatchObject([{ readingId: bad.id, state: "closed", closedByReadingId: fix.id }]);
    expect(
      await count("SELECT COUNT(*) AS n FROM readings WHERE job_id = ? AND station_id = 'bore/2/mid/B'", [s.job.id]),
    ).toBe(2);
    expect((await syncedInAudit(s.shop.id)).filter((e) => e.id === fix.id)).toMatchObject([
      { stationId: "bore/2/mid/B", supersedes: bad.id, verdict: "in_spec" },
    ]);
    const pack = await call(PACK, await asUser(s.users.machinist, "GET", `/api/bench/jobs/${s.job.id}`), {
      jobId: String(s.job.id),
    });
    const old = pack.body.readings.find((r: { id: string }) => r.id === bad.id);
    expect(old).toMatchObject({ value: 4.0293, verdict: "out_of_spec", supersededBy: fix.id });
    expect(pack.body.flags).toEqual([]);
  });

  it("a newer reading that is still out of spec replaces the flag: old closed, new open", async () => {
    const first = reading(s.job.id, "bore/3/top/A", 4.0312);
    await push(s.users.machinist, [first]);
    const second = reading(s.job.id, "bore/3/top/A", 4.031, { takenAt: later(10) });
    await push(s.users.machinist, [second]);
    expect(await flagsOf(s.job.id)).toMatchObject([
      { readingId: first.id, state: "closed", closedByReadingId: second.id },
      { readingId: second.id, state: "open", reason: "out_of_spec" },
    ]);
  });

  it("an older reading arriving late does not replace the current one", async () => {
    const current = reading(s.job.id, "bore/4/top/A", 4.03, { takenAt: later(30) });
    const stale = reading(s.job.id, "bore/4/top/A", 4.0312, { takenAt: later(1) });
    await push(s.users.machinist, [current]);
    const res = await push(s.users.machinist, [stale]);
    expect(res.body.results[0].verdict).toBe("out_of_spec"); // its own verdict, kept as history
    expect(await flagsOf(s.job.id)).toEqual([]);
  });
});

describe("flags for derived values", () => {
  it("bore taper over its maximum opens a derived flag; a re-measured bore in spec closes it", async () => {
    // axis A: top 4.0304, mid 4.0300, bottom 4.0292 → spread 0.0012 > 0.001 (bottom is also under 4.0295)
    const depths = { top: 4.0304, mid: 4.03, bottom: 4.0292 };
    const batch = Object.entries(depths).flatMap(([d, v]) => [
      reading(s.job.id, `bore/5/${d}/A`, v),
      reading(s.job.id, `bore/5/${d}/B`, 4.03),
    ]);
    await push(s.users.machinist, batch);
    const flags = await flagsOf(s.job.id);
    const taper = flags.find((f) => f.derivedKey === "bore_taper@bore/5");
    expect(taper).toMatchObject({ stationId: "bore/5", state: "open", verdict: "out_of_spec" });
    expect(Number(taper!.value)).toBe(0.0012);
    expect(flags.find((f) => f.derivedKey === "bore_out_of_round@bore/5")).toBeUndefined(); // 0.0008 ≤ 0.001
    expect(flags.some((f) => f.stationId === "bore/5/bottom/A" && f.reason === "out_of_spec")).toBe(true);

    const pack = await call(PACK, await asUser(s.users.machinist, "GET", `/api/bench/jobs/${s.job.id}`), {
      jobId: String(s.job.id),
    });
    const packed = pack.body.flags.find((f: { derivedKey: string }) => f.derivedKey === "bore_taper@bore/5");
    expect(packed.stations).toEqual([
      "bore/5/top/A",
      "bore/5/mid/A",
      "bore/5/bottom/A",
      "bore/5/top/B",
      "bore/5/mid/B",
      "bore/5/bottom/B",
    ]);

    const again = reading(s.job.id, "bore/5/bottom/A", 4.0298, { takenAt: later(20) }); // spread now 0.0006
    await push(s.users.machinist, [again]);
    const after = await flagsOf(s.job.id);
    expect(after.filter((f) => f.state !== "closed")).toEqual([]);
    expect(after.find((f) => f.derivedKey === "bore_taper@bore/5")).toMatchObject({
      state: "closed",
      closedByReadingId: again.id,
    });
  });

  it("main oil clearance out of spec is flagged on the bearing point although neither input has a limit", async () => {
    // 2.4520 − 2.4490 = 0.0030 in > 0.0025 in maximum
    await push(s.users.machinist, [
      reading(s.job.id, "main-brg/2/front/A", 2.452),
      reading(s.job.id, "main/2/front/A", 2.449),
    ]);
    const flags = await flagsOf(s.job.id);
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({
      derivedKey: "main_oil_clearance@main-brg/2/front/A",
      stationId: "main-brg/2/front/A",
      state: "open",
      verdict: "out_of_spec",
    });
    expect(Number(flags[0].value)).toBe(0.003);
    const reground = reading(s.job.id, "main/2/front/A", 2.4498, { takenAt: later(60) }); // 0.0022 in spec
    await push(s.users.machinist, [reground]);
    expect((await flagsOf(s.job.id))[0]).toMatchObject({ state: "closed", closedByReadingId: reground.id });
  });
});

describe("a value whose limit depends on other readings", () => {
  it("a ring gap judged on the nominal bore is judged again when its bore arrives", async () => {
    // Ring gap 0.004–0.005 in per inch of bore (common practice, from memory): on the 4.03 in
    // nominal bore that is 0.01612–0.02015 in; on a measured 4.10 in bore, 0.0164–0.0205 in.
    getSequelize();
    await JobLimit.create({
      jobId: s.job.id,
      characteristic: "ring_end_gap",
      stationPattern: "*",
      limitType: "per_inch",
      unit: "in",
      perInchMin: 0.004,
      perInchMax: 0.005,
      required: true,
      sortOrder: 99,
    });
    const gap = reading(s.job.id, "ring-gap/1/top", 0.0162);
    expect((await push(s.users.machinist, [gap])).body.results[0].evaluation).toMatchObject({
      verdict: "in_spec",
      limitMin: 0.01612,
    });
    const bores = ["top", "mid", "bottom"].flatMap((d) =>
      ["A", "B"].map((a) => reading(s.job.id, `bore/1/${d}/${a}`, 4.1, { takenAt: later(5) })),
    );
    await push(s.users.machinist, bores);
    expect(
      await count(
        "SELECT COUNT(*) AS n FROM readings WHERE id = ? AND verdict = 'out_of_spec' AND limit_min = 0.0164",
        [gap.id],
      ),
    ).toBe(1);
    expect((await flagsOf(s.job.id)).filter((f) => f.readingId === gap.id)).toMatchObject([
      { state: "open", reason: "out_of_spec" },
    ]);
    expect(
      await count("SELECT COUNT(*) AS n FROM audit_events WHERE action = 'reading.re-evaluate' AND entity_id = ?", [
        gap.id,
      ]),
    ).toBe(1);
  });
});
