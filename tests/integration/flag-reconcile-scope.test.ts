// After ingest, reconcileJob reads and revisits only what the fresh readings can change
// (lib/server/reconcile/scope.ts). Checked two ways: the scope itself, from the core's own
// recipes; and equivalence: after any mix of batches, a full reconciliation (every reading, every
// flag, as a limits edit runs it) finds nothing left to change. Figures are invented fixtures;
// limits are tests/support/factories.ts INCH_LIMITS (bore 4.03 ± 0.0005 in, taper and
// out-of-round ≤ 0.001 in, main oil clearance 0.0015–0.0025 in, torque 65–70 lbf·ft).
import { beforeEach, describe, expect, it } from "vitest";
import { benchRoute } from "@/lib/domain";
import { getSequelize } from "@/lib/server/core/db";
import { reconcileJob } from "@/lib/server/reconcile/reconcile";
import { ingestStations } from "@/lib/server/reconcile/scope";
import { loadJobContext } from "@/lib/server/jobs/repo";
import { createShop, type TestShop } from "../support/factories";
import { flagsOf, later, push, reading } from "../api/sync-fixtures";

let s: TestShop;
beforeEach(async () => {
  s = await createShop();
});

const fullPass = () =>
  getSequelize().transaction((t) =>
    reconcileJob(t, { shopId: s.shop.id, jobId: s.job.id, userId: null, cause: "check" }),
  );

describe("the scope of an ingest reconciliation", () => {
  it("covers the fresh stations, the inputs of what they feed, and the cylinder's bores and ring gaps", async () => {
    const ctx = await loadJobContext(s.shop.id, s.job.id);
    const route = benchRoute(ctx.shape).sections.flatMap((x) => x.stations.map((st) => st.id));
    const of = (...fresh: string[]) => new Set(ingestStations(ctx, new Set(fresh)));

    const top = of("bore/1/top/A");
    expect(
      route.filter((id) => id.startsWith("bore/1/") || id.startsWith("ring-gap/1/")).every((id) => top.has(id)),
    ).toBe(true);
    expect([...top].some((id) => id.startsWith("bore/2/") || id.startsWith("skirt/") || id.startsWith("main"))).toBe(
      false,
    );
    expect(of("bore/1/mid/A").has("skirt/1")).toBe(true); // piston-to-wall: bore mid A against the skirt

    const main = of("main/2/front/A");
    expect(route.filter((id) => id.startsWith("main/2/")).every((id) => main.has(id))).toBe(true); // taper, out-of-round
    expect(main.has("main-brg/2/front/A")).toBe(true); // oil clearance at that point
    expect(
      [...main].some((id) => id.startsWith("main/1/") || id.startsWith("bore/") || id.startsWith("main-brg/2/rear")),
    ).toBe(false);

    expect(of("torque/main-caps")).toEqual(new Set(["torque/main-caps"]));
  });

  it("after a mix of batches a full reconciliation has nothing left to change", async () => {
    const j = s.job.id;
    const m = s.users.machinist;
    const bad = reading(j, "bore/1/top/A", 4.0312); // over 4.0305, and a taper over 0.001 with the others
    await push(m, [
      bad,
      reading(j, "bore/1/mid/A", 4.0301),
      reading(j, "bore/1/bottom/A", 4.0299),
      reading(j, "torque/main-caps", 72),
    ]);
    expect(await fullPass()).toMatchObject({ opened: [], closed: [], updatedFlags: [], reevaluated: [] });
    await push(m, [
      reading(j, "bore/1/top/B", 4.0301),
      reading(j, "bore/1/mid/B", 4.0302),
      reading(j, "bore/1/bottom/B", 4.0301),
      reading(j, "main/1/front/A", 2.449),
      reading(j, "main-brg/1/front/A", 2.4512),
      reading(j, "bore/2/top/A", 4.0301),
    ]);
    expect(await fullPass()).toMatchObject({ opened: [], closed: [], updatedFlags: [], reevaluated: [] });
    // A correction at the bad station and a newer figure elsewhere close and open flags.
    await push(m, [
      reading(j, "bore/1/top/A", 4.0302, { supersedes: bad.id, takenAt: later(5) }),
      reading(j, "torque/main-caps", 68, { takenAt: later(6) }),
      reading(j, "main-brg/1/front/A", 2.453, { takenAt: later(7) }),
    ]);
    const flags = await flagsOf(j);
    expect(flags.some((f) => f.state === "closed")).toBe(true);
    expect(flags.some((f) => f.state === "open" && f.stationId.startsWith("main-brg/1/front/A"))).toBe(true); // clearance 0.004 > 0.0025
    expect(await fullPass()).toMatchObject({ opened: [], closed: [], updatedFlags: [], reevaluated: [] });
  });
});
