// Gauges: register, read, edit, deactivate; every role, other shops' ids, bad bodies with the
// field named, unique serial per shop, calibration status words and the certificate link.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { GET, POST } from "@/app/api/instruments/route";
import { GET as GET_ONE, PATCH } from "@/app/api/instruments/[instrumentId]/route";
import { POST as UPLOAD } from "@/app/api/attachments/route";
import { calibrationStatus } from "@/lib/schemas/instrument";
import { AuditEvent, Instrument } from "@/models";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call, cookieFor, pageRequest } from "../support/requests";

const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
const READERS = new Set(["admin", "lead", "inspector"]);
let a: TestShop;
let b: TestShop;

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
const gauge = (over: Record<string, unknown> = {}) => ({
  kind: "bore_gauge_dial",
  label: "Dial bore gauge 2-6 in",
  serial: `DB-${randomUUID().slice(0, 8)}`,
  unit: "in",
  resolution: 0.0001,
  expandedU: 0.00015,
  rangeMin: 2,
  rangeMax: 6,
  calibratedOn: day(-300),
  calibrationDue: day(65),
  dialPlusMeansSmaller: true,
  ...over,
});

beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

const register = async (by: TestUser, body: unknown) =>
  call(POST as never, await asUser(by, "POST", "/api/instruments", body));
const patch = async (by: TestUser, id: number | string, body: unknown) =>
  call(PATCH as never, await asUser(by, "PATCH", `/api/instruments/${id}`, body), { instrumentId: String(id) });

describe("calibrationStatus", () => {
  // Dates are ISO 8601 calendar dates; day counts checked by hand against the calendar.
  it.each([
    ["2026-12-01", "2026-12-02", "past_due", -1],
    ["2026-12-01", "2026-12-01", "due_soon", 0],
    ["2026-12-31", "2026-12-01", "due_soon", 30],
    ["2027-01-01", "2026-12-01", "in_calibration", 31],
    ["2028-03-01", "2028-02-28", "due_soon", 2], // 2028 is a leap year: 29 February exists
  ])("due %s on %s → %s (%i days)", (due, today, status, daysLeft) => {
    expect(calibrationStatus(due, today)).toEqual({ status, daysLeft });
  });
});

describe("POST /api/instruments", () => {
  it.each(ROLES)("as %s", async (role) => {
    const res = await register(a.users[role], gauge());
    expect(res.status).toBe(role === "admin" ? 201 : 403);
  });

  it("stores U at k = 2 and reports the calibration status; audits the registration", async () => {
    const res = await register(a.users.admin, gauge({ calibrationDue: day(10) }));
    expect(res.body.instrument).toMatchObject({
      coverageK: 2,
      expandedU: 0.00015,
      status: "due_soon",
      daysLeft: 10,
      active: true,
      certificate: null,
    });
    const e = await AuditEvent.findOne({
      where: { entityType: "instrument", entityId: String(res.body.instrument.id), action: "instrument.registered" },
    });
    expect(e?.after).toMatchObject({ serial: res.body.instrument.serial, expandedU: 0.00015 });
  });

  it("a gauge past its due date is registered and says so", async () => {
    const res = await register(a.users.admin, gauge({ calibratedOn: day(-400), calibrationDue: day(-5) }));
    expect(res.status).toBe(201);
    expect(res.body.instrument).toMatchObject({ status: "past_due", daysLeft: -5 });
  });

  it("a serial is unique per shop (409 naming the field), not across shops", async () => {
    const g = gauge();
    expect((await register(a.users.admin, g)).status).toBe(201);
    const again = await register(a.users.admin, { ...g, label: "Another" });
    expect(again.status).toBe(409);
    expect(again.body.error.fields.serial).toBeDefined();
    expect((await register(b.users.admin, g)).status).toBe(201);
  });

  it.each([
    ["no serial", { serial: undefined }, "serial"],
    ["blank label", { label: " " }, "label"],
    ["unknown kind", { kind: "laser" }, "kind"],
    ["a torque unit on a bore gauge", { unit: "nm" }, "unit"],
    ["a length unit on a torque wrench", { kind: "torque_wrench", unit: "mm", resolution: 1, expandedU: 2 }, "unit"],
    ["negative U", { expandedU: -0.0001 }, "expandedU"],
    ["zero resolution", { resolution: 0 }, "resolution"],
    ["U as text", { expandedU: "0.0001" }, "expandedU"],
    ["a date that does not exist", { calibratedOn: "2026-02-30" }, "calibratedOn"],
    ["a date in another format", { calibrationDue: "12/01/2027" }, "calibrationDue"],
    ["due before calibrated", { calibratedOn: day(0), calibrationDue: day(-1) }, "calibrationDue"],
    ["no measuring range", { rangeMin: undefined, rangeMax: undefined }, "rangeMin"],
    ["a range top as text", { rangeMax: "6" }, "rangeMax"],
    ["a range that starts below zero", { rangeMin: -1 }, "rangeMin"],
    ["a range whose top is below its start", { rangeMin: 6, rangeMax: 2 }, "rangeMax"],
    // The core's plausible ranges (common practice): no engine station is above 1200 mm (47.2 in).
    ["a range past any engine size", { rangeMax: 600 }, "rangeMax"],
  ])("422 for %s", async (_label, over, field) => {
    const res = await register(a.users.admin, gauge(over));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]?.[0]).toBeTruthy();
  });

  it("refuses a 20–1500 lbf·ft wrench in words and keeps the figures; stores a 20–150 lbf·ft one", async () => {
    const wrench = { kind: "torque_wrench", unit: "lbf_ft", resolution: 1, expandedU: 2, rangeMin: 20 };
    // 1500 lbf·ft is 2034 N·m (1 lbf·ft = 1.355818 N·m, NIST SP 811, B.8): within the core's 3000 N·m.
    // 2500 lbf·ft is 3390 N·m: more than any engine fastener (the core's plausible ranges, common practice).
    const bad = await register(a.users.admin, gauge({ ...wrench, rangeMax: 2500 }));
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.rangeMax[0]).toMatch(/^2500 lbf·ft is more than any engine station measures/);
    const ok = await register(a.users.admin, gauge({ ...wrench, rangeMax: 150 }));
    expect(ok.status).toBe(201);
    expect(ok.body.instrument).toMatchObject({ rangeMin: 20, rangeMax: 150, unit: "lbf_ft" });
    const e = await AuditEvent.findOne({
      where: { entityType: "instrument", entityId: String(ok.body.instrument.id), action: "instrument.registered" },
    });
    expect(e?.after).toMatchObject({ rangeMin: 20, rangeMax: 150 });
  });

  it("400 when the body is not JSON", async () => {
    expect((await register(a.users.admin, "{")).status).toBe(400);
  });
});

describe("GET /api/instruments and /api/instruments/[id]", () => {
  it.each(ROLES)("list as %s", async (role) => {
    const res = await call(GET as never, await asUser(a.users[role], "GET", "/api/instruments"));
    expect(res.status).toBe(READERS.has(role) ? 200 : 403);
    if (res.status !== 200) return;
    const serials = res.body.instruments.map((g: { serial: string }) => g.serial);
    expect(serials.length).toBeGreaterThan(0);
    const other = await call(GET as never, await asUser(b.users.admin, "GET", "/api/instruments"));
    for (const s of other.body.instruments)
      expect(res.body.instruments.map((g: { id: number }) => g.id)).not.toContain(s.id);
  });

  it.each(ROLES)("one as %s; another shop's gauge is 404", async (role) => {
    const own = await call(
      GET_ONE as never,
      await asUser(a.users[role], "GET", `/api/instruments/${a.instrument.id}`),
      { instrumentId: String(a.instrument.id) },
    );
    expect(own.status).toBe(READERS.has(role) ? 200 : 403);
    const theirs = await call(
      GET_ONE as never,
      await asUser(a.users[role], "GET", `/api/instruments/${b.instrument.id}`),
      { instrumentId: String(b.instrument.id) },
    );
    expect(theirs.status).toBe(READERS.has(role) ? 404 : 403);
  });

  it("422 for an unknown include", async () => {
    expect((await call(GET as never, await asUser(a.users.admin, "GET", "/api/instruments?include=some"))).status).toBe(
      422,
    );
  });
});

describe("PATCH /api/instruments/[id]", () => {
  it.each(ROLES.filter((r) => r !== "admin"))("refuses %s with 403", async (role) => {
    expect((await patch(a.users[role], a.instrument.id, { label: "Renamed" })).status).toBe(403);
  });

  it("404 for another shop's gauge and a junk id", async () => {
    expect((await patch(a.users.admin, b.instrument.id, { label: "Mine now" })).status).toBe(404);
    expect((await patch(a.users.admin, "x1", { label: "Mine now" })).status).toBe(404);
  });

  it("edits and audits before and after; the merged gauge is checked as a whole", async () => {
    const { body } = await register(a.users.admin, gauge());
    const id = body.instrument.id;
    const res = await patch(a.users.admin, id, { expandedU: 0.0002, calibrationDue: day(-1) });
    expect(res.status).toBe(200);
    expect(res.body.instrument).toMatchObject({ expandedU: 0.0002, status: "past_due" });
    const e = await AuditEvent.findOne({
      where: { entityType: "instrument", entityId: String(id), action: "instrument.updated" },
    });
    expect(e?.before).toMatchObject({ expandedU: 0.00015 });
    expect(e?.after).toMatchObject({ expandedU: 0.0002 });
    const bad = await patch(a.users.admin, id, { calibrationDue: day(-400) });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.calibrationDue).toBeDefined();
    expect((await patch(a.users.admin, id, { unit: "lbf_ft" })).body.error.fields.unit).toBeDefined();
    const range = await patch(a.users.admin, id, { rangeMin: 7 });
    expect(range.status).toBe(422);
    expect(range.body.error.fields.rangeMax[0]).toBe("The top of the range must be above its start (7 in)");
    expect((await patch(a.users.admin, id, { rangeMin: 3, rangeMax: 7 })).body.instrument).toMatchObject({
      rangeMin: 3,
      rangeMax: 7,
    });
    expect((await patch(a.users.admin, id, { rangeMax: null })).status).toBe(422);
  });

  it("a gauge registered before ranges were kept can still be switched off, and takes a range on edit", async () => {
    const { body } = await register(a.users.admin, gauge());
    const id = body.instrument.id;
    await Instrument.update({ rangeMin: null, rangeMax: null }, { where: { id } });
    const off = await patch(a.users.admin, id, { active: false });
    expect(off.status).toBe(200);
    expect(off.body.instrument).toMatchObject({ active: false, rangeMin: null, rangeMax: null });
    expect((await patch(a.users.admin, id, { rangeMin: 2 })).body.error.fields.rangeMax[0]).toBe(
      "Enter both ends of the measuring range",
    );
    expect((await patch(a.users.admin, id, { rangeMin: 2, rangeMax: 6 })).status).toBe(200);
  });

  it.each([
    ["nothing", {}],
    ["an unknown field", { coverageK: 3 }],
    ["active as text", { active: "yes" }],
  ])("422 for %s", async (_l, body) => {
    expect((await patch(a.users.admin, a.instrument.id, body)).status).toBe(422);
  });

  it("a serial taken by another gauge of the shop is 409", async () => {
    const one = await register(a.users.admin, gauge());
    const two = await register(a.users.admin, gauge());
    const res = await patch(a.users.admin, two.body.instrument.id, { serial: one.body.instrument.serial });
    expect(res.status).toBe(409);
  });

  it("deactivates and reactivates; the default list leaves deactivated gauges out", async () => {
    const { body } = await register(a.users.admin, gauge());
    const id = body.instrument.id;
    expect((await patch(a.users.admin, id, { active: false })).body.instrument.active).toBe(false);
    const listed = async (q: string) =>
      (await call(GET as never, await asUser(a.users.lead, "GET", `/api/instruments${q}`))).body.instruments.map(
        (g: { id: number }) => g.id,
      );
    expect(await listed("")).not.toContain(id);
    expect(await listed("?include=all")).toContain(id);
    expect((await patch(a.users.admin, id, { active: true })).body.instrument.active).toBe(true);
    const actions = (
      await AuditEvent.findAll({ where: { entityType: "instrument", entityId: String(id) }, order: [["id", "ASC"]] })
    ).map((e) => e.action);
    expect(actions).toEqual(["instrument.registered", "instrument.deactivated", "instrument.reactivated"]);
  });
});

describe("calibration certificate (POST /api/attachments, ownerType instrument)", () => {
  async function upload(by: TestUser, ownerId: number) {
    const form = new FormData();
    // A minimal PDF header so the upload's type sniffing sees a PDF.
    form.set(
      "file",
      new File([Buffer.from("%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n")], "cert.pdf", {
        type: "application/pdf",
      }),
    );
    form.set("ownerType", "instrument");
    form.set("ownerId", String(ownerId));
    form.set("clientId", randomUUID());
    const req = pageRequest("/api/attachments", {
      method: "POST",
      headers: { cookie: await cookieFor(by) },
      body: form,
    });
    return call(UPLOAD as never, req);
  }

  it("the admin's upload becomes the gauge's certificate link; a lead may not upload one", async () => {
    const { body } = await register(a.users.admin, gauge());
    const id = body.instrument.id;
    expect((await upload(a.users.lead, id)).status).toBe(403);
    const up = await upload(a.users.admin, id);
    expect(up.status).toBe(201);
    const res = await call(GET_ONE as never, await asUser(a.users.lead, "GET", `/api/instruments/${id}`), {
      instrumentId: String(id),
    });
    expect(res.body.instrument.certificate).toEqual({
      id: up.body.attachment.id,
      name: "cert.pdf",
      url: `/api/attachments/${up.body.attachment.id}`,
    });
  });
});
