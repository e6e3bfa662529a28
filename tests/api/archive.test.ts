// The shop's data archive: the admin downloads one zip of CSV and JSON Lines (docs/archive-format.md);
// read back with fflate, it holds every row of the admin's shop and none of another shop's, each CSV
// is RFC 4180 (fields with a comma, a double quote or a line break quoted, quotes doubled) with a
// UTF-8 BOM, and the download is in the audit trail.
import { unzipSync, strFromU8 } from "fflate";
import { buffer } from "node:stream/consumers";
import { QueryTypes } from "sequelize";
import { beforeAll, describe, expect, it } from "vitest";
import { GET } from "@/app/api/admin/archive/route";
import { POST as sign } from "@/app/api/release/[jobId]/route";
import { POST as saveStudy } from "@/app/api/gauges/[gaugeId]/studies/route";
import { getSequelize } from "@/lib/server/core/db";
import { ARCHIVE_FILES, shopArchive } from "@/lib/server/archive/stream";
import { AuditEvent } from "@/models";
import { createShop, TEST_PASSWORD, type TestShop, type TestUser } from "../support/factories";
import { parseCsv } from "../support/csv-parse";
import { asUser, call } from "../support/requests";
import { addFlag, completeJob } from "./release-fixtures";
import { push, reading } from "./sync-fixtures";

const TRICKY = 'Said "0,5 over", then:\nre-measure';
let a: TestShop;
let b: TestShop;

async function released(s: TestShop) {
  await completeJob(s);
  const res = await call(
    sign,
    await asUser(s.users.inspector, "POST", `/api/release/${s.job.id}`, {
      fullName: s.users.inspector.name,
      password: TEST_PASSWORD,
    }),
    { jobId: String(s.job.id) },
  );
  expect(res.status).toBe(201);
}

async function download(who: TestUser | null) {
  const res = await GET(await asUser(who, "GET", "/api/admin/archive"), { params: Promise.resolve({}) });
  return { res, files: res.status === 200 ? unzipSync(new Uint8Array(await res.arrayBuffer())) : {} };
}

const ids = async (sql: string, shopId: number) =>
  (await getSequelize().query<{ id: string | number }>(sql, { type: QueryTypes.SELECT, replacements: [shopId] }))
    .map((r) => String(r.id))
    .sort();

/** A CSV file's rows as objects by header, after checking its BOM and RFC 4180 shape. */
function table(files: Record<string, Uint8Array>, name: string): Record<string, string>[] {
  // The bytes, not strFromU8: a TextDecoder drops the BOM while decoding.
  const text = Buffer.from(files[name]).toString("utf8");
  expect([...files[name].slice(0, 3)], `${name} starts with a BOM`).toEqual([0xef, 0xbb, 0xbf]);
  const [header, ...rows] = parseCsv(text.slice(1));
  for (const r of rows) expect(r).toHaveLength(header.length);
  return rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
}

// 25 invented readings of a 4.0300 in ring in steps of the test bore gauge's 0.0001 in.
const STUDY_READINGS = [0, 1, -1, 0, 1, 0, 0, -1, 1, 2, 0, -1, 0, 1, 0, -2, 0, 1, 0, -1, 1, 0, 0, 1, 0].map((k) =>
  Number((4.03 + k * 0.0001).toFixed(4)),
);

/** A repeatability study of the shop's bore gauge, saved through its route. */
async function studied(s: TestShop) {
  const body = {
    kind: "type1",
    performedOn: "2026-11-20",
    readings: STUDY_READINGS,
    reference: { value: 4.03, expandedU: 0.00005, coverageK: 2 },
    characteristics: [{ characteristic: "bore_diameter", tolerance: 0.002 }],
  };
  const id = String(s.instrument.id);
  const res = await call(saveStudy as never, await asUser(s.users.lead, "POST", `/api/gauges/${id}/studies`, body), {
    gaugeId: id,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
}

const column = (rows: Record<string, string>[], header: string) => rows.map((r) => r[header]).sort();

beforeAll(async () => {
  a = await createShop();
  b = await createShop();
  // Before the release, which locks the job against readings.
  const sent = await push(a.users.machinist, [reading(a.job.id, "bore/2/top/A", 4.0301, { note: TRICKY })]);
  expect(sent.status).toBe(200);
  await released(a);
  await released(b);
  await studied(a);
  await studied(b);
  await addFlag(a, "bore/1/top/A", { disposition: "accept", dispositionReason: TRICKY, state: "disposed" });
  await addFlag(b, "bore/1/top/A", { disposition: "accept", dispositionReason: "other shop", state: "disposed" });
}, 120_000);

describe("GET /api/admin/archive", () => {
  it.each([
    ["lead", 403],
    ["inspector", 403],
    ["machinist", 403],
  ] as const)("refuses the %s (%i)", async (role, status) => {
    expect((await download(a.users[role])).res.status).toBe(status);
  });

  it("refuses a signed-out visitor (401)", async () => {
    expect((await download(null)).res.status).toBe(401);
  });

  it("gives the admin every row of the shop and none of another shop's", async () => {
    const { res, files } = await download(a.users.admin);
    expect(res.headers.get("content-type")).toBe("application/zip");
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="tenthwise-.+\.zip"$/);
    expect(Object.keys(files).sort()).toEqual([...ARCHIVE_FILES].sort());
    const expectRows = async (file: string, header: string, sql: string) => {
      const got = column(table(files, file), header);
      expect(got, file).toEqual(await ids(sql, a.shop.id));
      const others = await ids(sql, b.shop.id);
      expect(
        got.filter((id) => others.includes(id)),
        `${file}: none of the other shop's`,
      ).toEqual([]);
      return got;
    };
    const readings = await expectRows("readings.csv", "reading id", "SELECT id FROM readings WHERE shop_id = ?");
    expect(readings.length).toBeGreaterThan(20);
    await expectRows("jobs.csv", "job id", "SELECT id FROM jobs WHERE shop_id = ?");
    await expectRows("people.csv", "person id", "SELECT id FROM users WHERE shop_id = ?");
    await expectRows("flags.csv", "flag id", "SELECT id FROM flags WHERE shop_id = ?");
    await expectRows(
      "decisions.csv",
      "decision id",
      "SELECT d.id FROM flag_dispositions d JOIN flags f ON f.id = d.flag_id WHERE f.shop_id = ?",
    );
    await expectRows("releases.csv", "release id", "SELECT id FROM releases WHERE shop_id = ?");
    await expectRows("gauges.csv", "gauge id", "SELECT id FROM instruments WHERE shop_id = ?");
    const studies = await expectRows("gauge-studies.csv", "study id", "SELECT id FROM gauge_studies WHERE shop_id = ?");
    expect(studies).toHaveLength(1);
    const audit = strFromU8(files["audit-events.jsonl"])
      .split("\n")
      .filter(Boolean)
      .map((l) => JSON.parse(l) as { id: number; action: string; before: unknown; after: unknown });
    expect(audit.map((e) => String(e.id)).sort()).toEqual(
      await ids("SELECT id FROM audit_events WHERE shop_id = ?", a.shop.id),
    );
    expect(audit.find((e) => e.action === "release.sign")?.after).toEqual(expect.any(Object));
    const manifest = JSON.parse(strFromU8(files["manifest.json"]));
    expect(manifest).toMatchObject({ format: "tenthwise.shop-archive", version: 1, shop: { id: a.shop.id } });
    expect(manifest.files).toContainEqual({ name: "readings.csv", rows: readings.length });
  });

  it("quotes commas, double quotes and line breaks (RFC 4180, section 2, rules 6 and 7)", async () => {
    const { files } = await download(a.users.admin);
    const raw = strFromU8(files["readings.csv"]);
    expect(raw).toContain('"Said ""0,5 over"", then:\nre-measure"');
    expect(table(files, "readings.csv").map((r) => r.note)).toContain(TRICKY);
    expect(table(files, "decisions.csv").map((r) => r.reason)).toContain(TRICKY);
    const signed = table(files, "releases.csv")[0];
    expect(signed["fingerprint (SHA-256)"]).toMatch(/^[0-9a-f]{64}$/);
    expect(signed["signed at (UTC)"]).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
  });

  it("keeps a gauge study as taken: its gauge, reference, raw readings, marks and result", async () => {
    const { files } = await download(a.users.admin);
    const [study] = table(files, "gauge-studies.csv");
    expect(study).toMatchObject({
      "gauge id": String(a.instrument.id),
      kind: "type1",
      "performed by": a.users.lead.name,
      "performed on": "2026-11-20",
      unit: "in",
      resolution: "0.0001",
      "reference value": "4.03",
      "reference U": "0.00005",
      "reference k": "2",
      tolerance: "",
    });
    expect(JSON.parse(study["measurements (JSON)"])).toEqual(STUDY_READINGS);
    expect(JSON.parse(study["pass marks (JSON)"])).toMatchObject({ minCg: 1.33 });
    expect(JSON.parse(study["result (JSON)"])).toEqual(expect.any(Object));
    const gauge = table(files, "gauges.csv").find((g) => g["gauge id"] === String(a.instrument.id))!;
    expect(gauge).toMatchObject({ serial: expect.any(String), unit: "in", resolution: "0.0001", active: "yes" });
  });

  it("puts the download in the audit trail, naming the admin", async () => {
    const before = await AuditEvent.count({ where: { shopId: a.shop.id, action: "shop.archive" } });
    await download(a.users.admin);
    const events = await AuditEvent.findAll({ where: { shopId: a.shop.id, action: "shop.archive" } });
    expect(events).toHaveLength(before + 1);
    expect(events.at(-1)!.userId).toBe(a.users.admin.id);
  });

  it("pages through rows with equal times in key order and loses none (a page of 7)", async () => {
    const shop = { id: a.shop.id, name: "x", slug: "x", unitSystem: "in" };
    const zip = await buffer(shopArchive(shop, { id: a.users.admin.id, name: "x" }, { pageRows: 7 }));
    const files = unzipSync(new Uint8Array(zip));
    const got = column(table(files, "readings.csv"), "reading id");
    expect(got).toEqual(await ids("SELECT id FROM readings WHERE shop_id = ?", a.shop.id));
    expect(new Set(got).size).toBe(got.length);
  });
});
