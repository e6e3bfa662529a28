// The shop archive in constant memory: a shop whose job has 10,000 readings archives every one
// (first and last in key order, quoting per RFC 4180) while the live heap grows no more than for a
// shop with 1,000 (an archive built in memory would grow by megabytes more).
import { strFromU8, unzipSync } from "fflate";
import { beforeAll, describe, expect, it } from "vitest";
import { GET } from "@/app/api/admin/archive/route";
import { fillReadings, SKIP_REASON } from "../support/bulk-readings";
import { parseCsv } from "../support/csv-parse";
import { createShop, type TestShop } from "../support/factories";
import { readMeasured } from "../support/heap";
import { asUser } from "../support/requests";

const BIG = 10_000;
const SMALL = 1_000;
const MB = 1024 * 1024;
const LONG = 300_000; // a loaded machine reads 10,000 rows slowly; the checks are not timed
let big: TestShop;
let small: TestShop;

async function archiveOf(s: TestShop) {
  const res = (await GET(await asUser(s.users.admin, "GET", "/api/admin/archive"), {} as never)) as Response;
  expect(res.status).toBe(200);
  const { bytes, growth } = await readMeasured(res.body!, 16); // the zip comes in many small pieces
  return { files: unzipSync(new Uint8Array(Buffer.concat(bytes))), growth };
}

beforeAll(async () => {
  [big, small] = await Promise.all([createShop(), createShop()]);
  await Promise.all([fillReadings(big, BIG), fillReadings(small, SMALL)]);
}, 180_000);

describe("GET /api/admin/archive of a shop with a 10,000-reading job", () => {
  it(
    "holds every reading once, in key order, quoted where needed",
    async () => {
      const { files } = await archiveOf(big);
      const text = strFromU8(files["readings.csv"]);
      const [header, ...rows] = parseCsv(text); // strFromU8 has dropped the BOM
      expect(rows).toHaveLength(BIG);
      const at = (name: string) => header.indexOf(name);
      expect(rows[0][at("taken at (UTC, tablet clock)")]).toBe("2026-11-01T08:00:00.000Z");
      expect(rows[0][at("station")]).toBe("bore/1/top/A");
      const last = rows[BIG - 1];
      expect(last[at("station")]).toBe("bore/8/top/A");
      expect(last[at("skip reason")]).toBe(SKIP_REASON);
      expect(text).toContain(`"Sleeved, ""dry"" liner"`);
      expect(new Set(rows.map((r) => r[at("reading id")])).size).toBe(BIG);
    },
    LONG,
  );

  it(
    "holds no more live heap for 10,000 readings than for 1,000 (give or take 2 MB)",
    async () => {
      await archiveOf(small); // warm
      const one = await archiveOf(small);
      const ten = await archiveOf(big);
      console.log(
        `live heap growth: ${SMALL} readings ${(one.growth / MB).toFixed(2)} MB, ${BIG} ${(ten.growth / MB).toFixed(2)} MB`,
      );
      expect(ten.growth - one.growth).toBeLessThan(2 * MB);
    },
    LONG,
  );
});
