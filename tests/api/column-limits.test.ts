// Every field a desk or admin form sends, pushed past the column that keeps it (migrations/), is
// refused by the schema with 422 naming that field, before the database sees it: a text longer
// than its VARCHAR or TEXT, a count past its TINYINT UNSIGNED, a figure past its DECIMAL's range or
// with more decimal places than it keeps. The sizes are the columns' own; the figures are invented.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as NEW_JOB } from "@/app/api/jobs/route";
import { POST as NEW_CUSTOMER } from "@/app/api/customers/route";
import { POST as NEW_GAUGE } from "@/app/api/instruments/route";
import { POST as NEW_SHEET } from "@/app/api/specs/route";
import { POST as DISPOSE } from "@/app/api/flags/[flagId]/disposition/route";
import { POST as SYNC } from "@/app/api/sync/route";
import { POST as NEW_SHELLS } from "@/app/api/jobs/[jobId]/bearings/shells/route";
import { PUT as HOUSINGS } from "@/app/api/jobs/[jobId]/bearings/housings/route";
import { Flag } from "@/models";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

let a: TestShop;
let flagId: number;
beforeAll(async () => {
  a = await createShop();
  // An out-of-spec bore (4.04 in against the test limits' 4.0305 in maximum) opens a flag to decide.
  const reading = {
    id: randomUUID(),
    jobId: a.job.id,
    stationId: "bore/1/mid/B",
    value: 4.04,
    unit: "in",
    instrumentId: a.instrument.id,
    takenAt: new Date().toISOString(),
  };
  const body = { deviceId: "test-tablet", readings: [reading] };
  expect((await call(SYNC as never, await asUser(a.users.machinist, "POST", "/api/sync", body))).status).toBe(200);
  flagId = (await Flag.findOne({ where: { readingId: reading.id } }))!.id;
});

const long = (n: number) => "x".repeat(n);
// TEXT keeps 65,535 bytes; a form's note is held well under that by the schema.
const PAST_TEXT = long(70_000);

const job = () => ({
  code: `C-${randomUUID().slice(0, 6)}`,
  title: "Marine V8 freshen-up",
  customer: { mode: "new", name: "Harbour Marine", email: "", phone: "" },
  engine: {
    description: "Small-block V8",
    cylinders: 8,
    layout: "v",
    mains: 5,
    valvesPerCylinder: 2,
    ringsPerPiston: 3,
    boltsPerRod: 2,
    nominalBore: 4.03,
    nominalStroke: 3.48,
    blockMaterial: "greyCastIron",
  },
  unitSystem: "in",
  templateId: a.template.id,
  status: "intake",
  notes: "",
});
const customer = () => ({ name: "Harbour Marine", email: "", phone: "" });
const gauge = () => ({
  kind: "bore_gauge_dial",
  label: "Dial bore gauge 2-6 in",
  serial: `DB-${randomUUID().slice(0, 8)}`,
  unit: "in",
  resolution: 0.0001,
  expandedU: 0.00015,
  rangeMin: 2,
  rangeMax: 6,
  calibratedOn: "2026-06-01",
  calibrationDue: "2027-06-01",
  dialPlusMeansSmaller: true,
});
const sheet = () => ({
  name: "Marine V8",
  engineKind: "V8 gasoline",
  buildKind: "marine",
  unitSystem: "in",
  notes: "",
  limits: [
    {
      characteristic: "bore_diameter",
      stationPattern: "*",
      limitType: "nominal_tol",
      unit: "in",
      nominal: 4.03,
      tolPlus: 0.0004,
      tolMinus: 0.0001,
      required: true,
      label: "",
    },
  ],
});

type Route = {
  handler: unknown;
  method?: "POST" | "PUT";
  url: string;
  body: () => Record<string, unknown>;
  params?: () => Record<string, string>;
};
const decision = (body: Record<string, unknown>): Route => ({
  handler: DISPOSE,
  url: "/api/flags/0/disposition",
  body: () => ({ ...body }),
  params: () => ({ flagId: String(flagId) }),
});
// A set of standard main shells with the maker's nominal wall, in the test job's inches.
const shells = () => ({
  series: "House brand mains",
  role: "main",
  step: "standard",
  grade: null,
  wallSource: "nominal",
  wall: 0.0905,
  halvesUpper: 5,
  halvesLower: 5,
});
const housings = () => ({
  points: [{ point: "main/1", housingBore: 2.6405, housingGaugeId: null, housingCode: "A", journalCode: "1" }],
});
const onJob = () => ({ jobId: String(a.job.id) });
const ROUTES: Record<string, Route> = {
  "POST /api/jobs": { handler: NEW_JOB, url: "/api/jobs", body: job },
  "POST /api/customers": { handler: NEW_CUSTOMER, url: "/api/customers", body: customer },
  "POST /api/instruments": { handler: NEW_GAUGE, url: "/api/instruments", body: gauge },
  "POST /api/specs": { handler: NEW_SHEET, url: "/api/specs", body: sheet },
  "POST /api/jobs/:id/bearings/shells": {
    handler: NEW_SHELLS,
    url: "/api/jobs/0/bearings/shells",
    body: shells,
    params: onJob,
  },
  "PUT /api/jobs/:id/bearings/housings": {
    handler: HOUSINGS,
    method: "PUT",
    url: "/api/jobs/0/bearings/housings",
    body: housings,
    params: onJob,
  },
  "POST /api/flags/:id/disposition (accept)": decision({ kind: "accept", reason: "Within the maker's service limit" }),
  "POST /api/flags/:id/disposition (machine again)": decision({ kind: "machine_again", operation: "hone" }),
  "POST /api/flags/:id/disposition (measure again)": decision({ kind: "measure_again", note: "" }),
};
const BY: Record<string, (s: TestShop) => TestUser> = {
  "POST /api/instruments": (s) => s.users.admin,
};

/** `body` with the value at a dotted path ("engine.cylinders", "limits.0.nominal") replaced. */
function withValue(body: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split(".");
  let at = body as Record<string, unknown>;
  for (const k of keys.slice(0, -1)) at = (at[k] ??= {}) as Record<string, unknown>;
  at[keys.at(-1)!] = value;
  return body;
}

// [route, field path, a value past its column, the column it must fit]
const PAST: [string, string, unknown, string][] = [
  ["POST /api/jobs", "code", `C${long(24)}`, "jobs.code VARCHAR(24)"],
  ["POST /api/jobs", "title", long(161), "jobs.title VARCHAR(160)"],
  ["POST /api/jobs", "notes", PAST_TEXT, "jobs.notes TEXT"],
  ["POST /api/jobs", "customer.name", long(161), "customers.name VARCHAR(160)"],
  ["POST /api/jobs", "customer.phone", long(41), "customers.phone VARCHAR(40)"],
  ["POST /api/jobs", "customer.email", `${long(250)}@x.example`, "customers.email VARCHAR(255)"],
  ["POST /api/jobs", "engine.description", long(256), "engines.description VARCHAR(255)"],
  ["POST /api/jobs", "engine.blockSerial", long(65), "engines.block_serial VARCHAR(64)"],
  ["POST /api/jobs", "engine.crankSerial", long(65), "engines.crank_serial VARCHAR(64)"],
  ["POST /api/jobs", "engine.headSerials", long(161), "engines.head_serials VARCHAR(160)"],
  ["POST /api/jobs", "engine.cylinders", 300, "engines.cylinders TINYINT UNSIGNED"],
  ["POST /api/jobs", "engine.mains", 300, "engines.mains TINYINT UNSIGNED"],
  ["POST /api/jobs", "engine.valvesPerCylinder", 300, "engines.valves_per_cylinder TINYINT UNSIGNED"],
  ["POST /api/jobs", "engine.ringsPerPiston", 300, "engines.rings_per_piston TINYINT UNSIGNED"],
  ["POST /api/jobs", "engine.boltsPerRod", 300, "engines.bolts_per_rod TINYINT UNSIGNED"],
  ["POST /api/jobs", "engine.nominalBore", 10_000_000, "engines.nominal_bore DECIMAL(10,4)"],
  ["POST /api/jobs", "engine.nominalBore", 4.03005, "engines.nominal_bore DECIMAL(10,4): 4 places"],
  ["POST /api/jobs", "engine.nominalStroke", 3.48001, "engines.nominal_stroke DECIMAL(10,4): 4 places"],
  ["POST /api/jobs", "engine.nominalMainJournal", 2.44995, "engines.nominal_main_journal DECIMAL(10,4): 4 places"],
  ["POST /api/jobs", "finishedSizes.bore", 4.030001, "jobs.finished_bore DECIMAL(10,5): 5 places"],
  ["POST /api/customers", "name", long(161), "customers.name VARCHAR(160)"],
  ["POST /api/customers", "phone", long(41), "customers.phone VARCHAR(40)"],
  ["POST /api/customers", "email", `${long(250)}@x.example`, "customers.email VARCHAR(255)"],
  ["POST /api/instruments", "label", long(121), "instruments.label VARCHAR(120)"],
  ["POST /api/instruments", "serial", long(65), "instruments.serial VARCHAR(64)"],
  ["POST /api/instruments", "resolution", 10_000_000, "instruments.resolution DECIMAL(12,6)"],
  ["POST /api/instruments", "resolution", 0.0000001, "instruments.resolution DECIMAL(12,6): 6 places"],
  ["POST /api/instruments", "expandedU", 10_000_000, "instruments.expanded_u DECIMAL(12,6)"],
  ["POST /api/instruments", "expandedU", 0.0001234, "instruments.expanded_u DECIMAL(12,6): 6 places"],
  ["POST /api/instruments", "rangeMax", 6.0000001, "instruments.range_max DECIMAL(12,6): 6 places"],
  ["POST /api/specs", "name", long(161), "spec_templates.name VARCHAR(160)"],
  ["POST /api/specs", "engineKind", long(65), "spec_templates.engine_kind VARCHAR(64)"],
  ["POST /api/specs", "buildKind", long(33), "spec_templates.build_kind VARCHAR(32)"],
  ["POST /api/specs", "notes", PAST_TEXT, "spec_templates.notes TEXT"],
  ["POST /api/specs", "limits.0.label", long(121), "spec_limits.label VARCHAR(120)"],
  ["POST /api/specs", "limits.0.nominal", 4.0300001, "spec_limits.nominal DECIMAL(14,6): 6 places"],
  ["POST /api/specs", "limits.0.tolPlus", 0.00040001, "spec_limits.tol_plus DECIMAL(14,6): 6 places"],
  ["POST /api/jobs/:id/bearings/shells", "series", long(81), "bearing_shells.series VARCHAR(80)"],
  ["POST /api/jobs/:id/bearings/shells", "grade", long(25), "bearing_shells.grade VARCHAR(24)"],
  ["POST /api/jobs/:id/bearings/shells", "wall", 0.0905001, "bearing_shells.wall DECIMAL(10,6): 6 places"],
  ["POST /api/jobs/:id/bearings/shells", "halvesUpper", 100_000, "bearing_shells.halves_upper INT (count)"],
  ["PUT /api/jobs/:id/bearings/housings", "points.0.housingBore", 2.6405001, "bearing_points.housing_bore: 6 places"],
  ["PUT /api/jobs/:id/bearings/housings", "points.0.housingCode", long(17), "bearing_points.housing_code VARCHAR(16)"],
  ["POST /api/flags/:id/disposition (accept)", "reason", PAST_TEXT, "flag_dispositions.reason TEXT"],
  [
    "POST /api/flags/:id/disposition (machine again)",
    "operation",
    long(121),
    "flag_dispositions.operation VARCHAR(120)",
  ],
  ["POST /api/flags/:id/disposition (machine again)", "note", PAST_TEXT, "flag_dispositions.reason TEXT"],
  ["POST /api/flags/:id/disposition (measure again)", "note", PAST_TEXT, "flag_dispositions.reason TEXT"],
];

describe("fields past their column are refused by the schema, naming the field", () => {
  it.each(PAST)("%s %s (%#)", async (route, path, value, column) => {
    const r = ROUTES[route];
    const by = (BY[route] ?? ((s: TestShop) => s.users.lead))(a);
    const req = await asUser(by, r.method ?? "POST", r.url, withValue(r.body(), path, value));
    const res = await call(r.handler as never, req, r.params?.());
    expect({ column, status: res.status }).toEqual({ column, status: 422 });
    expect(Object.keys(res.body.error.fields ?? {})).toContain(path);
    expect(res.body.error.fields[path].join(" ")).toMatch(/\w/);
  });

  const BASES = Object.entries(ROUTES).filter(
    ([route]) => !route.includes("(machine again)") && !route.includes("(measure again)"),
  );
  it.each(BASES)("%s takes the unchanged body (the table's base is valid)", async (route, r) => {
    const by = (BY[route] ?? ((s: TestShop) => s.users.lead))(a);
    const res = await call(r.handler as never, await asUser(by, r.method ?? "POST", r.url, r.body()), r.params?.());
    const ok = res.status === 200 || res.status === 201;
    expect({ route, ok, body: ok ? null : res.body }).toEqual({ route, ok: true, body: null });
  });
});
