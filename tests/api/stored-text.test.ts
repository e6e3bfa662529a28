// Text the database cannot keep is refused by the schema with 422 naming the field, on every
// desk and admin route that stores text, before the database (or an audit event's JSON) sees it;
// text that can be kept is stored in its canonical form (NFC, LF line ends). The texts are invented.
import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import { beforeAll, describe, expect, it } from "vitest";
import { getSequelize } from "@/lib/server/core/db";
import { POST as NEW_JOB } from "@/app/api/jobs/route";
import { POST as NEW_CUSTOMER } from "@/app/api/customers/route";
import { POST as NEW_GAUGE } from "@/app/api/instruments/route";
import { POST as NEW_SHEET } from "@/app/api/specs/route";
import { POST as INVITE } from "@/app/api/users/route";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

let a: TestShop;
beforeAll(async () => {
  a = await createShop();
});

const customer = () => ({ name: "Harbour Marine", email: "", phone: "" });
const job = () => ({
  code: `C-${randomUUID().slice(0, 6)}`,
  title: "Marine V8 freshen-up",
  customer: { mode: "new", ...customer() },
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
const gauge = () => ({
  kind: "outside_mic",
  label: "Outside micrometer 3-4 in",
  serial: `OM-${randomUUID().slice(0, 8)}`,
  unit: "in",
  resolution: 0.0001,
  expandedU: 0.0001,
  rangeMin: 3,
  rangeMax: 4,
  calibratedOn: "2026-06-01",
  calibrationDue: "2027-06-01",
});
const sheet = () => ({
  name: `Marine V8 ${randomUUID().slice(0, 6)}`,
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
const person = () => ({
  name: "Dana Lathe",
  email: `dana-${randomUUID().slice(0, 6)}@shop.example`,
  role: "machinist",
});

type Route = { handler: unknown; url: string; body: () => Record<string, unknown>; by: (s: TestShop) => TestUser };
const lead = (s: TestShop) => s.users.lead;
const ROUTES: Record<string, Route> = {
  "POST /api/jobs": { handler: NEW_JOB, url: "/api/jobs", body: job, by: lead },
  "POST /api/customers": { handler: NEW_CUSTOMER, url: "/api/customers", body: customer, by: lead },
  "POST /api/instruments": { handler: NEW_GAUGE, url: "/api/instruments", body: gauge, by: (s) => s.users.admin },
  "POST /api/specs": { handler: NEW_SHEET, url: "/api/specs", body: sheet, by: lead },
  "POST /api/users": { handler: INVITE, url: "/api/users", body: person, by: (s) => s.users.admin },
};

function withValue(body: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split(".");
  let at = body as Record<string, unknown>;
  for (const k of keys.slice(0, -1)) at = at[k] as Record<string, unknown>;
  at[keys.at(-1)!] = value;
  return body;
}

const FIELDS: [string, string][] = [
  ["POST /api/jobs", "code"],
  ["POST /api/jobs", "title"],
  ["POST /api/jobs", "notes"],
  ["POST /api/jobs", "customer.name"],
  ["POST /api/jobs", "customer.phone"],
  ["POST /api/jobs", "engine.description"],
  ["POST /api/jobs", "engine.blockSerial"],
  ["POST /api/jobs", "engine.headSerials"],
  ["POST /api/customers", "name"],
  ["POST /api/customers", "phone"],
  ["POST /api/instruments", "label"],
  ["POST /api/instruments", "serial"],
  ["POST /api/specs", "name"],
  ["POST /api/specs", "engineKind"],
  ["POST /api/specs", "buildKind"],
  ["POST /api/specs", "notes"],
  ["POST /api/specs", "limits.0.label"],
  ["POST /api/specs", "limits.0.stationPattern"],
  ["POST /api/users", "name"],
];
// A lone surrogate (half a character) and control characters: what the fuzzed requests carried.
const UNSTORABLE: [string, RegExp][] = [
  ["KF\ud800", /half of a character \(U\+D800\) at character 3/],
  ["KF\u0000", /control character \(U\+0000\) at character 3/],
  ["KF\u001b", /control character \(U\+001B\) at character 3/],
];

describe("text the database cannot keep is refused, naming the field", () => {
  it.each(FIELDS)("%s %s", async (route, path) => {
    const r = ROUTES[route];
    for (const [text, words] of UNSTORABLE) {
      const res = await call(r.handler as never, await asUser(r.by(a), "POST", r.url, withValue(r.body(), path, text)));
      expect({ path, text, status: res.status }).toEqual({ path, text, status: 422 });
      expect(res.body.error.fields[path].join(" ")).toMatch(words);
    }
  });

  it.each(Object.keys(ROUTES))("%s takes the unchanged body (the table's base is valid)", async (route) => {
    const r = ROUTES[route];
    const res = await call(r.handler as never, await asUser(r.by(a), "POST", r.url, r.body()));
    expect({ route, status: res.status }).toEqual({ route, status: 201 });
  });
});

describe("text that can be kept is stored in its canonical form", () => {
  it("composes letters (Unicode Standard Annex #15, NFC) and makes line ends LF", async () => {
    const body = { ...customer(), name: `Cafe\u0301 Marine ${randomUUID().slice(0, 4)}` };
    const res = await call(NEW_CUSTOMER as never, await asUser(a.users.lead, "POST", "/api/customers", body));
    expect(res.status).toBe(201);
    const composed = body.name.normalize("NFC");
    const rows = await getSequelize().query<{ name: string }>("SELECT name FROM customers WHERE shop_id = ?", {
      replacements: [a.shop.id],
      type: QueryTypes.SELECT,
    });
    expect(rows.map((r) => r.name)).toContain(composed);
    expect(composed).toContain("\u00e9");
    const sheetBody = { ...sheet(), notes: "Marine duty:\r\nhone to 280 grit" };
    const made = await call(NEW_SHEET as never, await asUser(a.users.lead, "POST", "/api/specs", sheetBody));
    expect(made.status).toBe(201);
    const [stored] = await getSequelize().query<{ notes: string }>("SELECT notes FROM spec_templates WHERE name = ?", {
      replacements: [sheetBody.name],
      type: QueryTypes.SELECT,
    });
    expect(stored.notes).toBe("Marine duty:\nhone to 280 grit");
  });
});
