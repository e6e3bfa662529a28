// Spec sheet templates: every role, other shops' ids (404), per-type field rules and station
// patterns (422 naming the field), versions and audit, export → import round trip, import errors.
import { beforeAll, describe, expect, it } from "vitest";
import { GET as LIST, POST } from "@/app/api/specs/route";
import { GET as ONE, PATCH, PUT } from "@/app/api/specs/[templateId]/route";
import { GET as EXPORT } from "@/app/api/specs/[templateId]/export/route";
import { POST as IMPORT } from "@/app/api/specs/import/route";
import { ROLES } from "@/lib/schemas/enums";
import { AuditEvent, JobLimit, SpecLimit } from "@/models";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

const EDITORS = new Set(["lead", "admin"]);
let a: TestShop;
let b: TestShop;
beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

// Test fixtures (invented figures), not reference values.
const bore = {
  characteristic: "bore_diameter",
  stationPattern: "*",
  limitType: "nominal_tol",
  unit: "in",
  nominal: 4.03,
  tolPlus: 0.0004,
  tolMinus: 0.0001,
  required: true,
  gaugeKind: "dial-bore-gauge",
};
const sheet = (limits: unknown[] = [bore], over: Record<string, unknown> = {}) => ({
  name: "Marine V8",
  engineKind: "V8 gasoline",
  buildKind: "marine",
  unitSystem: "in",
  notes: "",
  limits,
  ...over,
});
const post = async (by: TestUser, body: unknown) => call(POST as never, await asUser(by, "POST", "/api/specs", body));
const put = async (by: TestUser, id: number | string, body: unknown) =>
  call(PUT as never, await asUser(by, "PUT", `/api/specs/${id}`, body), { templateId: String(id) });

describe("GET and POST /api/specs", () => {
  it.each(ROLES)("GET as %s", async (role) => {
    const res = await call(LIST as never, await asUser(a.users[role], "GET", "/api/specs"));
    expect(res.status).toBe(EDITORS.has(role) ? 200 : 403);
    if (res.status === 200) expect(res.body.templates.map((t: { id: number }) => t.id)).not.toContain(b.template.id);
  });

  it.each(ROLES)("POST as %s", async (role) => {
    expect((await post(a.users[role], sheet())).status).toBe(EDITORS.has(role) ? 201 : 403);
  });

  it.each([
    ["min_max without a maximum", [{ ...bore, limitType: "min_max", min: 4.03, max: null }], "limits.0.max"],
    ["a maximum below the minimum", [{ ...bore, limitType: "min_max", min: 4.031, max: 4.03 }], "limits.0.max"],
    ["a negative tolerance", [{ ...bore, tolMinus: -0.0001 }], "limits.0.tolMinus"],
    [
      "a per-inch rule with no figure",
      [{ ...bore, characteristic: "main_oil_clearance", limitType: "per_inch" }],
      "limits.0.perInchMax",
    ],
    ["an unknown ISO 286 class", [{ ...bore, limitType: "iso286", isoClass: "Q7" }], "limits.0.isoClass"],
    ["an ISO 286 grade the core lacks", [{ ...bore, limitType: "iso286", isoClass: "H11" }], "limits.0.isoClass"],
    [
      "torque in inches",
      [
        {
          characteristic: "fastener_torque",
          stationPattern: "*",
          limitType: "min_max",
          unit: "in",
          min: 65,
          max: 70,
          required: true,
        },
      ],
      "limits.0.unit",
    ],
    ["a length in N·m", [{ ...bore, unit: "nm" }], "limits.0.unit"],
    [
      "a per-inch torque",
      [
        {
          characteristic: "fastener_torque",
          stationPattern: "*",
          limitType: "per_inch",
          unit: "lbf_ft",
          perInchMax: 1,
          required: true,
        },
      ],
      "limits.0.limitType",
    ],
    ["a bore depth that does not exist", [{ ...bore, stationPattern: "bore/*/middle/*" }], "limits.0.stationPattern"],
    ["a pattern of another section", [{ ...bore, stationPattern: "main/3/*" }], "limits.0.stationPattern"],
    ["a doubled slash", [{ ...bore, stationPattern: "bore//top" }], "limits.0.stationPattern"],
    ["a cylinder beyond 16", [{ ...bore, stationPattern: "bore/17/*" }], "limits.0.stationPattern"],
    ["the same characteristic and pattern twice", [bore, { ...bore, tolPlus: 0.0006 }], "limits.1.stationPattern"],
    ["an unknown characteristic", [{ ...bore, characteristic: "cam_lobe" }], "limits.0.characteristic"],
    ["an unknown gauge kind", [{ ...bore, gaugeKind: "laser" }], "limits.0.gaugeKind"],
    ["a figure typed as text", [{ ...bore, nominal: "4.03" }], "limits.0.nominal"],
    ["no limits", [], "limits"],
  ])("422 for %s, naming %s", async (_w, limits, field) => {
    const res = await post(a.users.lead, sheet(limits));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]?.[0]).toEqual(expect.any(String));
  });

  it("says what the stations look like when a pattern matches none", async () => {
    const res = await post(a.users.lead, sheet([{ ...bore, stationPattern: "bore/*/middle/*" }]));
    expect(res.body.error.fields["limits.0.stationPattern"][0]).toContain("bore/<cylinder>/<top|mid|bottom>/<A|B>");
  });

  it.each([
    ["ring-gap/*/top", "ring_end_gap"],
    ["lash/*/int1", "valve_lash"],
    ["lash/*/exh", "valve_lash"],
    ["deck/left/*", "deck_height"],
    ["bore/3", "bore_taper"],
    ["main-brg/2/*", "main_oil_clearance"],
    ["bolt/*/*", "rod_bolt_stretch"],
    ["torque/cam-gear", "fastener_torque"],
    ["*", "crank_end_play"],
  ])("accepts the pattern %s for %s", async (stationPattern, characteristic) => {
    const torque = characteristic === "fastener_torque";
    const res = await post(
      a.users.lead,
      sheet([
        {
          characteristic,
          stationPattern,
          limitType: "max_only",
          unit: torque ? "lbf_ft" : "in",
          // Plausible maxima (plausible-range.ts): a deck height is a height, the rest are small gaps.
          max: torque ? 20 : characteristic === "deck_height" ? 9.03 : 0.002,
          required: false,
        },
      ]),
    );
    expect(res.status).toBe(201);
  });

  it("keeps only the figures of the limit's own type", async () => {
    const res = await post(a.users.lead, sheet([{ ...bore, min: 4.0, max: 4.1, perInchMax: 0.001 }]));
    const [row] = await SpecLimit.findAll({ where: { templateId: res.body.template.id } });
    expect([row.nominal, row.tolPlus, row.tolMinus, row.min, row.max, row.perInchMax]).toEqual([
      4.03,
      0.0004,
      0.0001,
      null,
      null,
      null,
    ]);
  });
});

describe("/api/specs/[templateId]", () => {
  it.each(ROLES)("GET as %s", async (role) => {
    const res = await call(ONE as never, await asUser(a.users[role], "GET", `/api/specs/${a.template.id}`), {
      templateId: String(a.template.id),
    });
    expect(res.status).toBe(EDITORS.has(role) ? 200 : 403);
  });

  it.each([
    [
      "GET",
      async () =>
        call(ONE as never, await asUser(a.users.lead, "GET", `/api/specs/${b.template.id}`), {
          templateId: String(b.template.id),
        }),
    ],
    ["PUT", async () => put(a.users.lead, b.template.id, sheet())],
    [
      "PATCH",
      async () =>
        call(PATCH as never, await asUser(a.users.lead, "PATCH", `/api/specs/${b.template.id}`, { archived: true }), {
          templateId: String(b.template.id),
        }),
    ],
    [
      "export",
      async () =>
        call(EXPORT as never, await asUser(a.users.lead, "GET", `/api/specs/${b.template.id}/export`), {
          templateId: String(b.template.id),
        }),
    ],
  ])("%s of another shop's sheet is 404", async (_w, go) => {
    expect((await go()).status).toBe(404);
  });

  it("PUT bumps the version, audits before and after, and leaves the jobs' own limits alone", async () => {
    const jobBefore = (await JobLimit.findAll({ where: { jobId: a.job.id }, order: [["sortOrder", "ASC"]] })).map((l) =>
      l.get({ plain: true }),
    );
    const res = await put(
      a.users.admin,
      a.template.id,
      sheet([{ ...bore, tolPlus: 0.0008 }], { name: "Street V8, looser" }),
    );
    expect(res.status).toBe(200);
    expect(res.body.template).toMatchObject({
      version: 2,
      name: "Street V8, looser",
      limits: [expect.objectContaining({ tolPlus: 0.0008 })],
    });
    const e = await AuditEvent.findOne({ where: { action: "spec_template.update", entityId: String(a.template.id) } });
    expect((e?.before as { limits: unknown[] }).limits).toHaveLength(5);
    expect((e?.after as { limits: { tolPlus: number }[] }).limits[0].tolPlus).toBe(0.0008);
    const jobAfter = (await JobLimit.findAll({ where: { jobId: a.job.id }, order: [["sortOrder", "ASC"]] })).map((l) =>
      l.get({ plain: true }),
    );
    expect(jobAfter).toEqual(jobBefore);
  });

  it.each(ROLES)("PUT as %s", async (role) => {
    expect((await put(a.users[role], a.template.id, sheet())).status).toBe(EDITORS.has(role) ? 200 : 403);
  });

  it("archives and restores", async () => {
    const go = async (archived: unknown) =>
      call(PATCH as never, await asUser(a.users.lead, "PATCH", `/api/specs/${a.template.id}`, { archived }), {
        templateId: String(a.template.id),
      });
    expect((await go(true)).body.template.archived).toBe(true);
    expect((await go(false)).body.template.archived).toBe(false);
    expect((await go("yes")).status).toBe(422);
  });
});

describe("export and import", () => {
  it("round-trips: the exported file imports as a new sheet with the same limits", async () => {
    const created = await post(
      a.users.lead,
      sheet([
        bore,
        {
          characteristic: "main_oil_clearance",
          stationPattern: "*",
          limitType: "per_inch",
          unit: "in",
          perInchMin: 0.00075,
          perInchMax: 0.001,
          required: true,
        },
        {
          characteristic: "bore_diameter",
          stationPattern: "bore/1/*",
          limitType: "iso286",
          unit: "mm",
          isoClass: "H7",
          required: false,
          label: "Sleeved cylinder",
        },
      ]),
    );
    const id = created.body.template.id;
    const file = await call(EXPORT as never, await asUser(a.users.admin, "GET", `/api/specs/${id}/export`), {
      templateId: String(id),
    });
    expect(file.status).toBe(200);
    expect(file.headers.get("content-disposition")).toContain(".tenthwise-spec.json");
    expect(file.body).toMatchObject({
      format: "tenthwise.spec-template",
      version: 1,
      template: { name: "Marine V8", unitSystem: "in" },
    });
    const imported = await call(IMPORT as never, await asUser(a.users.lead, "POST", "/api/specs/import", file.body));
    expect(imported.status).toBe(201);
    expect(imported.body.template.id).not.toBe(id);
    expect(imported.body.template.limits).toEqual(created.body.template.limits);
    expect(
      await AuditEvent.count({
        where: { action: "spec_template.import", entityId: String(imported.body.template.id) },
      }),
    ).toBe(1);
  });

  it.each([
    ["another format", { format: "something-else", version: 1, template: sheet() }, "format"],
    ["another version", { format: "tenthwise.spec-template", version: 2, template: sheet() }, "version"],
    [
      "a limit without its maximum",
      {
        format: "tenthwise.spec-template",
        version: 1,
        template: sheet([bore, { ...bore, stationPattern: "bore/1/*", limitType: "max_only" }]),
      },
      "template.limits.1.max",
    ],
    ["no template", { format: "tenthwise.spec-template", version: 1 }, "template"],
  ])("422 for %s, naming %s", async (_w, body, field) => {
    const res = await call(IMPORT as never, await asUser(a.users.admin, "POST", "/api/specs/import", body));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]?.[0]).toEqual(expect.any(String));
  });

  it.each(ROLES)("import as %s", async (role) => {
    const res = await call(
      IMPORT as never,
      await asUser(a.users[role], "POST", "/api/specs/import", {
        format: "tenthwise.spec-template",
        version: 1,
        template: sheet(),
      }),
    );
    expect(res.status).toBe(EDITORS.has(role) ? 201 : 403);
  });

  it("413 for a file far larger than any sheet", async () => {
    const res = await call(
      IMPORT as never,
      await asUser(a.users.lead, "POST", "/api/specs/import", "x".repeat(1_000_001), { "content-length": "1000001" }),
    );
    expect(res.status).toBe(413);
  });

  it("400 for a file that is not JSON", async () => {
    expect(
      (await call(IMPORT as never, await asUser(a.users.lead, "POST", "/api/specs/import", '{"format":'))).status,
    ).toBe(400);
  });
});
