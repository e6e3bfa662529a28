// A gauge's setting master: the admin sets, changes and removes it (audited, checked against the
// gauge's range and step, field named in every refusal), other roles and shops are refused, and the
// tablet's study picker offers what was set. Figures are invented (a ring on the test bore gauge).
import { beforeAll, describe, expect, it } from "vitest";
import { DELETE, PUT } from "@/app/api/instruments/[instrumentId]/master/route";
import { GET as GET_ONE, PATCH } from "@/app/api/instruments/[instrumentId]/route";
import { GET as BENCH_GAUGES } from "@/app/api/bench/gauges/route";
import { AuditEvent } from "@/models";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

let a: TestShop;
let b: TestShop;
const RING = { label: "Ring 4.0300", size: 4.03, expandedU: 0.00005 };

beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

const put = async (by: TestUser | null, id: number, body: unknown) =>
  call(PUT as never, await asUser(by, "PUT", `/api/instruments/${id}/master`, body), { instrumentId: String(id) });
const remove = async (by: TestUser | null, id: number) =>
  call(DELETE as never, await asUser(by, "DELETE", `/api/instruments/${id}/master`), { instrumentId: String(id) });
const readOne = async (by: TestUser, id: number) =>
  call(GET_ONE as never, await asUser(by, "GET", `/api/instruments/${id}`), { instrumentId: String(id) });
const events = (id: number) =>
  AuditEvent.findAll({ where: { entityType: "instrument", entityId: String(id) }, order: [["id", "ASC"]] });

describe("PUT and DELETE /api/instruments/:id/master", () => {
  it("sets, changes and removes the master, each audited with before and after, and the tablet offers it", async () => {
    const id = a.instrument.id;
    const set = await put(a.users.admin, id, RING);
    expect(set.status).toBe(200);
    expect(set.body.instrument.master).toEqual(RING);
    expect((await readOne(a.users.lead, id)).body.instrument.master).toEqual(RING);
    const bench = await call(BENCH_GAUGES as never, await asUser(a.users.machinist, "GET", "/api/bench/gauges"));
    const bore = bench.body.instruments.find((g: { id: number }) => g.id === id);
    expect(bore.master).toEqual({ label: "Ring 4.0300", size: 4.03, u: 0.00005 });

    const changed = await put(a.users.admin, id, { ...RING, label: "Ring 4.0000", size: 4 });
    expect(changed.body.instrument.master).toEqual({ ...RING, label: "Ring 4.0000", size: 4 });
    const gone = await remove(a.users.admin, id);
    expect(gone.status).toBe(200);
    expect(gone.body.instrument.master).toBeNull();

    expect((await remove(a.users.admin, id)).body.instrument.master).toBeNull(); // again: nothing to remove
    const trail = (await events(id)).filter((e) => e.action.startsWith("instrument.master"));
    expect(trail.map((e) => e.action)).toEqual([
      "instrument.master_set",
      "instrument.master_set",
      "instrument.master_removed",
    ]);
    expect(trail[0].before).toEqual({ master: null });
    expect(trail[1].before).toEqual({ master: RING });
    expect(trail[2].after).toEqual({ master: null });
    expect(trail.every((e) => e.userId === a.users.admin.id)).toBe(true);
  });

  it("refuses a size outside the range and a U of ten steps or more, naming the field; nothing changes", async () => {
    const id = a.instrument.id; // 2–6 in, step 0.0001 in
    await put(a.users.admin, id, RING);
    const far = await put(a.users.admin, id, { ...RING, size: 7.5 });
    expect(far.status).toBe(422);
    expect(far.body.error.fields.size[0]).toMatch(/outside this gauge's range, 2–6 in/);
    const vague = await put(a.users.admin, id, { ...RING, expandedU: 0.001 });
    expect(vague.status).toBe(422);
    expect(vague.body.error.fields.expandedU[0]).toMatch(/10 or more of this gauge's steps/);
    const missing = await put(a.users.admin, id, { label: " ", size: 0, expandedU: "x" });
    expect(missing.status).toBe(422);
    expect(Object.keys(missing.body.error.fields).sort()).toEqual(["expandedU", "label", "size"]);
    const extra = await put(a.users.admin, id, { ...RING, unit: "mm" });
    expect(extra.status).toBe(422);
    expect((await readOne(a.users.admin, id)).body.instrument.master).toEqual(RING);
  });

  it("keeps the unit while a master is on file in it, saying what to do; without one the unit changes", async () => {
    const id = a.gauges.mic;
    const patch = async (body: unknown) =>
      call(PATCH as never, await asUser(a.users.admin, "PATCH", `/api/instruments/${id}`, body), {
        instrumentId: String(id),
      });
    const before = (await readOne(a.users.admin, id)).body.instrument;
    const inMm = { unit: "mm", resolution: 0.001, expandedU: 0.002, rangeMin: 50, rangeMax: 75 };
    expect(before.unit).toBe("in");
    expect((await put(a.users.admin, id, { label: "Block 2.5 in", size: 2.5, expandedU: 0.00003 })).status).toBe(200);
    const refused = await patch(inMm);
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields.unit[0]).toMatch(/^Remove the setting master first/);
    expect((await readOne(a.users.admin, id)).body.instrument.unit).toBe("in");
    expect((await remove(a.users.admin, id)).status).toBe(200);
    expect((await patch(inMm)).status).toBe(200);
  });

  it("keeps a master on file inside the gauge's range: a narrower range that leaves it out is refused", async () => {
    const id = a.instrument.id; // 2–6 in
    const patch = async (body: unknown) =>
      call(PATCH as never, await asUser(a.users.admin, "PATCH", `/api/instruments/${id}`, body), {
        instrumentId: String(id),
      });
    expect((await put(a.users.admin, id, RING)).status).toBe(200);
    const refused = await patch({ rangeMin: 2, rangeMax: 4 });
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields.rangeMax[0]).toMatch(/^The setting master on file \(Ring 4\.0300, 4\.03 in\)/);
    expect(refused.body.error.fields.rangeMin).toBeUndefined(); // the end that leaves it out, only
    const above = await patch({ rangeMin: 4.5, rangeMax: 6 });
    expect(Object.keys(above.body.error.fields)).toEqual(["rangeMin"]);
    expect((await readOne(a.users.admin, id)).body.instrument.rangeMax).toBe(6);
    expect((await patch({ rangeMin: 4, rangeMax: 5 })).status).toBe(200); // still holds 4.03 in
    expect((await patch({ rangeMin: 2, rangeMax: 6 })).status).toBe(200);
  });

  it("is the admin's: 401 signed out, 403 for the other roles, 404 for another shop's gauge", async () => {
    const id = a.instrument.id;
    expect((await put(null, id, RING)).status).toBe(401);
    for (const role of ["machinist", "lead", "inspector"] as const) {
      expect((await put(a.users[role], id, RING)).status).toBe(403);
      expect((await remove(a.users[role], id)).status).toBe(403);
    }
    expect((await put(a.users.admin, b.instrument.id, RING)).status).toBe(404);
    expect((await remove(a.users.admin, b.instrument.id)).status).toBe(404);
    expect((await put(b.users.admin, b.instrument.id, RING)).status).toBe(200);
  });
});
