import { describe, expect, it } from "vitest";
import { benchRoute } from "../../../lib/domain/bench-route";
import {
  jobProgress,
  requiredProgress,
  requiredStationIds,
  requiredStations,
  stationDone,
} from "../../../lib/domain/progress";
import type { EngineShape, SpecLimit } from "../../../lib/domain/types";

// Rules of this product: what "required" and "done" mean for progress toward release. The route
// sizes come from bench-route (4 cylinders × 3 depths × 2 axes = 24 bore stations, and so on).
const i4: EngineShape = { cylinders: 4, layout: "inline", mains: 5, valvesPerCylinder: 4, unitSystem: "metric" };
const route = benchRoute(i4);
const stations = route.sections.flatMap((s) => s.stations);
const limit = (l: Partial<SpecLimit> & Pick<SpecLimit, "characteristic">): SpecLimit => ({
  stationPattern: "*",
  limitType: "max_only",
  max: 1,
  unit: "mm",
  required: true,
  ...l,
});
let n = 0;
type Row = { id: string; stationId: string; takenAt: string; skipped: boolean; supersedes?: string; state?: string };
const reading = (stationId: string, extra: Partial<Row> = {}): Row => ({
  id: `r${String(++n).padStart(4, "0")}`,
  stationId,
  takenAt: new Date(Date.UTC(2026, 0, 1, 8, 0, n)).toISOString(),
  skipped: false,
  ...extra,
});

describe("required stations (rule of this product)", () => {
  it("a required limit on the station's own characteristic makes it required", () => {
    const req = requiredStations(i4, [limit({ characteristic: "bore_diameter" })], stations);
    expect(req).toHaveLength(24);
    expect(req.every((r) => r.own && r.station.section === "bore" && r.neededFor.size === 0)).toBe(true);
  });

  it("a limit that is not required adds nothing", () => {
    expect(requiredStations(i4, [limit({ characteristic: "bore_diameter", required: false })], stations)).toEqual([]);
  });

  it("a pattern narrows it to the stations it matches", () => {
    const ids = requiredStationIds(i4, [limit({ characteristic: "bore_diameter", stationPattern: "bore/1/*" })], route);
    expect([...ids].sort()).toEqual([
      "bore/1/bottom/A",
      "bore/1/bottom/B",
      "bore/1/mid/A",
      "bore/1/mid/B",
      "bore/1/top/A",
      "bore/1/top/B",
    ]);
  });

  it("a required derived value makes every input required (piston-to-wall: bore mid A and the skirt)", () => {
    const req = requiredStations(i4, [limit({ characteristic: "piston_to_wall" })], stations);
    expect(req.map((r) => r.station.id)).toEqual([
      "bore/1/mid/A",
      "bore/2/mid/A",
      "bore/3/mid/A",
      "bore/4/mid/A",
      "skirt/1",
      "skirt/2",
      "skirt/3",
      "skirt/4",
    ]);
    expect(req.every((r) => !r.own && r.neededFor.has("piston_to_wall"))).toBe(true);
  });

  it("own and derived reasons add up on one station", () => {
    const spec = [limit({ characteristic: "main_oil_clearance" }), limit({ characteristic: "main_journal_diameter" })];
    const req = requiredStations(i4, spec, stations);
    expect(req).toHaveLength(40); // 20 journal stations + 20 installed bearing bores
    const journal = req.find((r) => r.station.id === "main/1/front/A")!;
    expect(journal.own).toBe(true);
    expect([...journal.neededFor]).toEqual(["main_oil_clearance"]);
    expect(req.find((r) => r.station.id === "main-brg/1/front/A")!.own).toBe(false);
  });

  it("an engine the core cannot lay out gives no derived inputs instead of throwing", () => {
    const bad = { ...i4, cylinders: 0 };
    expect(requiredStations(bad, [limit({ characteristic: "piston_to_wall" })], stations)).toEqual([]);
  });
});

describe("done (rule of this product, as the release checklist requires)", () => {
  it.each([
    ["no reading", undefined, false],
    ["a figure", { skipped: false }, true],
    ["a skip", { skipped: true }, false],
    ["a figure the server refused", { skipped: false, state: "rejected" }, false],
    ["a figure still waiting to sync", { skipped: false, state: "pending" }, true],
  ])("%s → %s", (_what, r, done) => {
    expect(stationDone(r)).toBe(done);
  });
});

describe("progress of a job", () => {
  const spec = [limit({ characteristic: "bore_diameter" }), limit({ characteristic: "piston_to_wall" })];

  it("counts required stations done, in all and per section", () => {
    const first = reading("bore/1/top/A");
    const readings = [
      first,
      reading("bore/1/top/A", { supersedes: first.id }), // a correction: still one station
      reading("bore/1/top/B"),
      reading("bore/2/top/A", { skipped: true }), // skipped: not done
      reading("skirt/1"),
      reading("deck/block/front"), // measured, not required
      reading("bore/9/top/A"), // not on this engine's route: never counts
    ];
    const p = jobProgress(i4, spec, readings);
    expect(p.required).toBe(28); // 24 bores + 4 skirts
    expect(p.done).toBe(3);
    const by = Object.fromEntries(p.sections.map((s) => [s.id, s]));
    expect(by.bore).toMatchObject({ stations: 24, required: 24, done: 2, measured: 2 });
    expect(by.skirt).toMatchObject({ stations: 4, required: 4, done: 1, measured: 1 });
    expect(by.deck).toMatchObject({ stations: 2, required: 0, done: 0, measured: 1 });
    expect(p.sections.reduce((t, s) => t + s.required, 0)).toBe(p.required);
  });

  it("a skip that supersedes a figure undoes it; a figure after the skip redoes it", () => {
    const value = reading("skirt/2");
    const skip = reading("skirt/2", { skipped: true, supersedes: value.id });
    expect(jobProgress(i4, spec, [value, skip]).done).toBe(0);
    const again = reading("skirt/2", { supersedes: skip.id });
    expect(jobProgress(i4, spec, [value, skip, again]).done).toBe(1);
  });

  it("the tablet's refused readings neither count nor retire the figure they meant to correct", () => {
    const value = reading("skirt/3");
    const refused = reading("skirt/3", { supersedes: value.id, state: "rejected" });
    expect(jobProgress(i4, spec, [value, refused], { replaces: (r) => r.state !== "rejected" }).done).toBe(0);
    expect(jobProgress(i4, spec, [value]).done).toBe(1);
  });

  it("requiredProgress works from a current map the caller already has", () => {
    const req = requiredStationIds(i4, spec, route);
    const p = requiredProgress(route, req, new Map([["skirt/4", { skipped: false }]]));
    expect([p.done, p.required]).toEqual([1, 28]);
  });

  it("an engine with no route is an error the caller must show", () => {
    expect(() => jobProgress({ ...i4, cylinders: 0 }, spec, [])).toThrow();
  });
});
