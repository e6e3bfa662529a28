import { describe, expect, it } from "vitest";
import type { LocalReading } from "@/lib/offline/db";
import { nextOpenStation, routeProgress, sectionCount, stationViews } from "@/lib/offline/route-status";
import { makePack } from "./fake-server";

const pack = makePack(1);
let t = 0;
function reading(stationId: string, value: number | null, extra: Partial<LocalReading> = {}): LocalReading {
  const takenAt = new Date(Date.UTC(2026, 0, 1, 8, 0, t++)).toISOString();
  return {
    id: `r${t}`,
    jobId: 1,
    stationId,
    value,
    unit: "in",
    entryMode: "direct",
    skipped: false,
    takenAt,
    deviceId: "d",
    takenBy: 7,
    state: "pending",
    updatedAt: takenAt,
    ...extra,
  };
}
const stateOf = (views: ReturnType<typeof stationViews>, id: string) => views.find((v) => v.station.id === id)?.state;

describe("route status", () => {
  it("judges each station's current reading with the core (4.0295–4.0305 in the test spec)", () => {
    const views = stationViews(pack, [
      reading("bore/1/top/A", 4.0302),
      reading("bore/1/top/B", 4.0312),
      reading("bore/1/mid/A", null, { skipped: true, skipReason: "cracked" }),
    ]);
    expect(stateOf(views, "bore/1/top/A")).toBe("in_spec");
    expect(stateOf(views, "bore/1/top/B")).toBe("confirm");
    expect(stateOf(views, "bore/1/mid/A")).toBe("skipped");
    expect(stateOf(views, "bore/1/mid/B")).toBe("todo");
    expect(stateOf(stationViews(pack, [reading("deck/block/front", 9.025)]), "deck/block/front")).toBe("no_limit");
    expect(views.find((v) => v.station.id === "bore/1/top/A")?.deviation).toBe(0.0002);
  });
  it("a confirming second reading stands; a correction supersedes, history stays", () => {
    const first = reading("bore/1/top/B", 4.0312);
    const second = reading("bore/1/top/B", 4.0311, { supersedes: first.id });
    const views = stationViews(pack, [first, second]);
    expect(stateOf(views, "bore/1/top/B")).toBe("out_of_spec");
    expect(views.find((v) => v.station.id === "bore/1/top/B")).toMatchObject({ count: 2, current: { id: second.id } });
    const fixed = stationViews(pack, [first, second, reading("bore/1/top/B", 4.0301, { supersedes: second.id })]);
    expect(stateOf(fixed, "bore/1/top/B")).toBe("in_spec");
  });
  it("a refused reading shows as refused and does not count", () => {
    const views = stationViews(pack, [
      reading("bore/1/top/A", 4.0302, { state: "rejected", rejection: { code: "job_locked", reason: "locked" } }),
    ]);
    expect(views.find((v) => v.station.id === "bore/1/top/A")).toMatchObject({ state: "rejected", count: 0 });
  });
  it("stations the lead sent back are marked until a newer reading is taken", () => {
    const old = reading("bore/1/top/A", 4.0312);
    const flag = {
      id: 1,
      jobId: 1,
      readingId: old.id,
      derivedKey: null,
      stationId: "bore/1/top/A",
      characteristic: "bore_diameter",
      value: 4.0312,
      unit: "in",
      limitMin: 4.0295,
      limitMax: 4.0305,
      deviation: 0.0012,
      verdict: "out_of_spec" as const,
      reason: "out_of_spec" as const,
      state: "disposed" as const,
      disposition: "machine_again" as const,
      operation: "hone",
      dispositionReason: null,
      disposedAt: new Date(Date.UTC(2026, 0, 1, 9)).toISOString(),
      closedAt: null,
      createdAt: old.takenAt,
      stations: ["bore/1/top/A"],
      revisit: true,
    };
    const sentBack = { ...pack, flags: [flag] };
    expect(stateOf(stationViews(sentBack, [old]), "bore/1/top/A")).toBe("revisit");
    const again = reading("bore/1/top/A", 4.0302, {
      supersedes: old.id,
      takenAt: new Date(Date.UTC(2026, 0, 1, 10)).toISOString(),
    });
    expect(stateOf(stationViews(sentBack, [old, again]), "bore/1/top/A")).toBe("in_spec");
  });
  it("counts required-station progress per section and finds the next open station, wrapping round", () => {
    const views = stationViews(pack, [reading("bore/1/top/A", 4.0302), reading("bore/1/top/B", 4.0302)]);
    const bores = routeProgress(pack, views).sections.find((s) => s.id === "bore")!;
    expect(bores).toMatchObject({ done: 2, required: 24, stations: 24, open: 22, label: "Cylinder bores" });
    expect(sectionCount(bores)).toBe("2 of 24 required");
    const deck = routeProgress(pack, views).sections.find((s) => s.id === "deck")!;
    expect(sectionCount(deck)).toBe("0 of 2 measured"); // the test spec requires no deck station
    expect(nextOpenStation(views, "bore/1/top/A")).toBe("bore/1/mid/A");
    expect(nextOpenStation(views)).toBe("bore/1/mid/A");
    const last = views[views.length - 1].station.id;
    expect(nextOpenStation(views, last)).toBe("bore/1/mid/A");
  });
  it("the job screen counts as the desk does: a skip is not done, nor is a refused reading; pending counts", () => {
    const views = stationViews(pack, [
      reading("bore/1/top/A", 4.0302),
      reading("bore/1/top/B", null, { skipped: true, skipReason: "cracked" }),
      reading("bore/1/mid/A", 4.0302, { state: "rejected", rejection: { code: "job_locked", reason: "locked" } }),
      reading("bore/1/mid/B", 4.0302, { state: "synced" }),
    ]);
    const p = routeProgress(pack, views);
    expect([p.done, p.required]).toEqual([2, 24]);
    // The skip is not waiting for the machinist (not open), yet not done toward release.
    expect(p.sections.find((s) => s.id === "bore")).toMatchObject({ done: 2, open: 21 });
  });
});
