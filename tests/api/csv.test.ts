// GET /api/jobs/[jobId]/readings.csv: roles, other shops (404), and a file a spreadsheet reads
// as written: UTF-8 BOM, RFC 4180 quoting, CRLF, units in the header, plain decimal points,
// ISO 8601 times, current and earlier readings, derived values.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { GET } from "@/app/api/jobs/[jobId]/readings.csv/route";
import { csvField, plainNumber } from "@/lib/server/readings/csv-export";
import { Flag, Instrument, Reading, User } from "@/models";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { parseCsv } from "../support/csv-parse";
import { asUser, call } from "../support/requests";

const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
let a: TestShop;
let b: TestShop;
let serial: string;

async function add(
  s: TestShop,
  stationId: string,
  value: number | null,
  unit: string,
  minute: number,
  extra: Record<string, unknown> = {},
) {
  return Reading.create({
    id: randomUUID(),
    shopId: s.shop.id,
    jobId: s.job.id,
    stationId,
    characteristic: (extra.characteristic as string) ?? "bore_diameter",
    value: value,
    valueCanonical: value,
    unit: unit,
    takenBy: s.users.machinist.id,
    takenAt: new Date(Date.UTC(2026, 11, 1, 9, minute)),
    deviceId: "test",
    skipped: value === null,
    ...extra,
  });
}

const csvOf = async (by: TestUser, id: number | string, query = "") =>
  call(GET as never, await asUser(by, "GET", `/api/jobs/${id}/readings.csv${query}`), { jobId: String(id) });

beforeAll(async () => {
  a = await createShop();
  b = await createShop();
  await User.update({ name: 'Vance, Rosa "Ro"' }, { where: { id: a.users.machinist.id } });
  serial = (await Instrument.findByPk(a.instrument.id))!.serial;
  const first = await add(a, "bore/1/top/A", 4.0312, "in", 1, {
    verdict: "out_of_spec",
    limitMin: 4.0295,
    limitMax: 4.0305,
    deviation: 0.0012,
    instrumentId: a.instrument.id,
  });
  await add(a, "bore/1/top/A", 4.0301, "in", 2, {
    supersedes: first.id,
    verdict: "in_spec",
    limitMin: 4.0295,
    limitMax: 4.0305,
    deviation: 0.0001,
    instrumentId: a.instrument.id,
  });
  await add(a, "bore/1/top/B", 102.362, "mm", 3, {
    verdict: "in_spec",
    limitMin: 102.3493,
    limitMax: 102.3747,
    deviation: 0,
  }); // 102.362 mm = 4.03 in exactly
  await add(a, "main-brg/1/front/A", 2.4515, "in", 4, { characteristic: "main_bearing_bore" });
  await add(a, "main/1/front/A", 2.449, "in", 5, { characteristic: "main_journal_diameter" });
  await add(a, "torque/main-caps", 67, "lbf_ft", 6, {
    characteristic: "fastener_torque",
    lubricant: "engine-oil",
    verdict: "in_spec",
    limitMin: 65,
    limitMax: 70,
  });
  // A gap limit given per inch of bore and resolved on a 4.0817 in bore carries float noise:
  // 0.004 × 4.0817 and 0.0055 × 4.0817 (invented figures for the test).
  const gap = await add(a, "ring-gap/1/top", 0.0152, "in", 7, {
    characteristic: "ring_end_gap",
    verdict: "out_of_spec",
    limitMin: 0.004 * 4.0817,
    limitMax: 0.0055 * 4.0817,
  });
  await add(a, "ring-gap/1/second", null, "in", 8, {
    characteristic: "ring_end_gap",
    skipReason: "Second rings not in yet, on order",
  });
  const flag = {
    shopId: a.shop.id,
    jobId: a.job.id,
    unit: "in",
    verdict: "out_of_spec",
    reason: "out_of_spec",
  } as const;
  await Flag.create({
    ...flag,
    readingId: first.id,
    stationId: "bore/1/top/A",
    characteristic: "bore_diameter",
    value: 4.0312,
    state: "closed",
    disposition: "machine_again",
    operation: "Hone to size",
  });
  await Flag.create({
    ...flag,
    readingId: gap.id,
    stationId: gap.stationId,
    characteristic: "ring_end_gap",
    value: 0.0152,
  });
});

describe("GET /api/jobs/[jobId]/readings.csv", () => {
  it.each(ROLES)("as %s", async (role) => {
    expect((await csvOf(a.users[role], a.job.id)).status).toBe(role === "machinist" ? 403 : 200);
  });

  it("404 for another shop's job or a junk id", async () => {
    expect((await csvOf(a.users.lead, b.job.id)).status).toBe(404);
    expect((await csvOf(a.users.lead, "x1")).status).toBe(404);
  });

  it("is UTF-8 with a BOM, CRLF records, units in the header, and parses back", async () => {
    // The raw bytes: Response.text() would drop the BOM while decoding.
    const res = await GET(await asUser(a.users.inspector, "GET", `/api/jobs/${a.job.id}/readings.csv`), {
      params: Promise.resolve({ jobId: String(a.job.id) }),
    });
    expect(res.headers.get("content-type")).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers.get("content-disposition")).toContain(`${a.job.code}-readings.csv`);
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = new TextDecoder("utf-8", { fatal: true, ignoreBOM: true }).decode(bytes);
    expect(text.charCodeAt(0)).toBe(0xfeff);
    const rows = parseCsv(text.slice(1));
    const [header, ...data] = rows;
    expect(header).toEqual([
      "row",
      "station",
      "station (words)",
      "characteristic",
      "value (in | lbf·ft)",
      "unit",
      "min (in | lbf·ft)",
      "max (in | lbf·ft)",
      "verdict",
      "deviation (in | lbf·ft)",
      "gauge serial",
      "taken by",
      "taken at (UTC, ISO 8601)",
      "superseded?",
      "lubricant",
      "skip reason",
      "decision",
    ]);
    expect(data.every((r) => r.length === header.length)).toBe(true);
    const byStation = new Map(data.filter((r) => r[0] === "reading").map((r) => [r[1], r]));
    // Current readings only: the corrected 4.0312 is not in the file, its correction is.
    expect(byStation.get("bore/1/top/A")).toEqual([
      "reading",
      "bore/1/top/A",
      "Cylinder 1 · top of bore · axis A (thrust)",
      "Cylinder bore diameter",
      "4.0301",
      "in",
      "4.0295",
      "4.0305",
      "In spec",
      "0.0001",
      serial,
      'Vance, Rosa "Ro"',
      "2026-12-01T09:02:00.000Z",
      "no",
      "",
      "",
      "",
    ]);
    expect(byStation.get("bore/1/top/B")?.[4]).toBe("4.03"); // entered in mm, given in the job's inches
    expect(byStation.get("torque/main-caps")?.slice(4, 9)).toEqual(["67", "lbf·ft", "65", "70", "In spec"]);
    expect(byStation.get("torque/main-caps")?.[14]).toBe("Engine oil");
    expect(byStation.get("ring-gap/1/second")?.slice(8, 9)).toEqual(["Skipped"]);
    expect(byStation.get("ring-gap/1/second")?.[15]).toBe("Second rings not in yet, on order");
    // Limits to the inch's display resolution, a tenth (plain decimal rounding):
    // 0.004 × 4.0817 = 0.0163268 → 0.0163; 0.0055 × 4.0817 = 0.02244935 → 0.0224 (hand arithmetic).
    expect(byStation.get("ring-gap/1/top")?.slice(6, 8)).toEqual(["0.0163", "0.0224"]);
    expect(byStation.get("ring-gap/1/top")?.[16]).toBe("Flagged, no decision yet");
    // A label with a comma, and a name with a comma and quotes, are quoted (RFC 4180 §2.6, §2.7).
    expect(text).toContain('"Main bearing bore, shells in and caps torqued"');
    expect(text).toContain('"Vance, Rosa ""Ro"""');
    // Oil clearance = bearing bore − journal (its definition): 2.4515 − 2.4490 = 0.0025 in, on the
    // 0.0015–0.0025 limit's edge; the deviation is from mid-tolerance 0.0020 (hand arithmetic).
    const clearance = data.find((r) => r[0] === "derived" && r[1] === "main-brg/1/front/A");
    expect(clearance?.slice(3, 10)).toEqual([
      "Main bearing oil clearance",
      "0.0025",
      "in",
      "0.0015",
      "0.0025",
      "In spec",
      "0.0005",
    ]);
  });

  it("with history lists the corrected reading first, marked superseded", async () => {
    const rows = parseCsv((await csvOf(a.users.lead, a.job.id, "?history=1")).body as string); // text() has dropped the BOM
    const atStation = rows.filter((r) => r[1] === "bore/1/top/A");
    expect(atStation.map((r) => [r[4], r[8], r[13], r[16]])).toEqual([
      ["4.0312", "Out of spec", "yes", "Machine again (Hone to size)"],
      ["4.0301", "In spec", "no", ""],
    ]);
  });
});

describe("CSV fields", () => {
  it.each([
    [0.0000001, "0.0000001"],
    [1e-7 * 3, "0.0000003"],
    [4.0301, "4.0301"],
    [-0.0012, "-0.0012"],
    [1234567.5, "1234567.5"],
    [0, "0"],
    [null, ""],
  ])("plainNumber(%s) = %s (no exponent, no locale)", (x, want) => {
    expect(plainNumber(x)).toBe(want);
  });

  it.each([
    ["plain", "plain"],
    ["a,b", '"a,b"'],
    ['say "hi"', '"say ""hi"""'],
    ["two\nlines", '"two\nlines"'],
    ["=SUM(A1)", "'=SUM(A1)"],
    ["@cmd", "'@cmd"],
    [-0.5, "-0.5"],
  ])("csvField(%j) = %j", (cell, want) => {
    expect(csvField(cell)).toBe(want);
  });
});
