// GET /api/bench/gauges: the shop's gauges in use, for a gauge study on the tablet.
import { beforeAll, describe, expect, it } from "vitest";
import { GET } from "@/app/api/bench/gauges/route";
import { Instrument } from "@/models";
import { createShop, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

let s: TestShop;
let other: TestShop;
const list = async (user: TestShop["users"]["machinist"] | null) =>
  call(GET, await asUser(user, "GET", "/api/bench/gauges"));

beforeAll(async () => {
  s = await createShop();
  other = await createShop();
  await Instrument.update({ active: false }, { where: { id: s.gauges.feeler } });
  // An invented setting ring on the shop's bore gauge.
  await Instrument.update(
    { masterLabel: "Ring 4.0300", masterSize: 4.03, masterU: 0.00005 },
    { where: { id: s.instrument.id } },
  );
});

describe("GET /api/bench/gauges", () => {
  it("lists this shop's active gauges as a job pack carries them with their setting masters, none of another shop's", async () => {
    const res = await list(s.users.machinist);
    expect(res.status).toBe(200);
    const ids = res.body.instruments.map((g: { id: number }) => g.id);
    expect(ids).toContain(s.instrument.id);
    expect(ids).not.toContain(s.gauges.feeler);
    expect(ids).not.toContain(other.instrument.id);
    expect(ids).toHaveLength(Object.keys(s.gauges).length);
    const bore = res.body.instruments.find((g: { id: number }) => g.id === s.instrument.id);
    expect(bore).toMatchObject({ label: "Test bore gauge", unit: "in", resolution: 0.0001, rangeMin: 2, rangeMax: 6 });
    expect(bore).not.toHaveProperty("shopId");
    expect(bore.master).toEqual({ label: "Ring 4.0300", size: 4.03, u: 0.00005 });
    expect(res.body.instruments.find((g: { id: number }) => g.id === s.gauges.mic).master).toBeNull();
  });

  it("answers a lead too; 401 signed out, 403 for inspector and admin", async () => {
    expect((await list(s.users.lead)).status).toBe(200);
    expect((await list(null)).status).toBe(401);
    expect((await list(s.users.inspector)).status).toBe(403);
    expect((await list(s.users.admin)).status).toBe(403);
  });
});
