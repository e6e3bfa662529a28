// A job's readings CSV in constant memory: a 10,000-reading job exports every reading (history),
// in bench order, quoted per RFC 4180, while the live heap grows no more than for a 1,000-reading
// job (an export that held the job's rows would grow by megabytes more; the last check shows the
// measure sees that).
import { beforeAll, describe, expect, it } from "vitest";
import { GET as CSV } from "@/app/api/jobs/[jobId]/readings.csv/route";
import { withReads } from "@/lib/server/core/sql-read";
import type { RowShape } from "@/lib/server/core/sql-driver";
import { currentJobReadings, jobReadings } from "@/lib/server/readings/repo";
import { fillReadings as fill, SKIP_REASON } from "../support/bulk-readings";
import { createShop, type TestShop } from "../support/factories";
import { parseCsv } from "../support/csv-parse";
import { liveHeap, readMeasured } from "../support/heap";
import { asUser } from "../support/requests";

const BIG = 10_000;
const SMALL = 1_000;
const MB = 1024 * 1024;
const LONG = 300_000; // a loaded machine reads 10,000 rows slowly; the checks are not timed
let big: TestShop;
let small: TestShop;

async function exportOf(s: TestShop, history = true) {
  const id = String(s.job.id);
  const req = await asUser(s.users.lead, "GET", `/api/jobs/${id}/readings.csv${history ? "?history=1" : ""}`);
  const res = (await CSV(req, { params: Promise.resolve({ jobId: id }) } as never)) as Response;
  expect(res.status).toBe(200);
  const { bytes, growth } = await readMeasured(res.body!);
  return { text: new TextDecoder("utf-8", { ignoreBOM: true }).decode(Buffer.concat(bytes)), growth };
}

beforeAll(async () => {
  [big, small] = await Promise.all([createShop(), createShop()]);
  await Promise.all([fill(big, BIG), fill(small, SMALL)]);
}, 180_000);

describe("GET /api/jobs/:id/readings.csv?history=1 on a 10,000-reading job", () => {
  it(
    "writes every reading once, in bench order, quoted where needed",
    async () => {
      const { text } = await exportOf(big);
      expect(text.startsWith("\uFEFFrow,station,")).toBe(true);
      const rows = parseCsv(text.slice(1));
      const readings = rows.filter((r) => r[0] === "reading");
      expect(readings).toHaveLength(BIG);
      // Bench order: the bores by cylinder, each station's readings oldest first.
      expect(readings[0].slice(1, 2)).toEqual(["bore/1/top/A"]);
      expect(readings[0][12]).toBe("2026-11-01T08:00:00.000Z");
      const last = readings[BIG - 1];
      expect(last[1]).toBe("bore/8/top/A");
      expect(last[8]).toBe("Skipped");
      expect(last[15]).toBe(SKIP_REASON);
      expect(text).toContain(`"Sleeved, ""dry"" liner"`); // RFC 4180: quoted, its quotes doubled
      // Each station's latest is current; every other reading is history.
      expect(readings.filter((r) => r[13] === "no")).toHaveLength(8);
      expect(new Set(readings.map((r) => r[12])).size).toBe(BIG);
    },
    LONG,
  );

  it(
    "holds no more live heap for 10,000 readings than for 1,000 (give or take 2 MB)",
    async () => {
      await exportOf(small); // warm: modules, pools and caches are loaded before measuring
      const one = await exportOf(small);
      const ten = await exportOf(big);
      console.log(
        `live heap growth: ${SMALL} readings ${(one.growth / MB).toFixed(2)} MB, ${BIG} ${(ten.growth / MB).toFixed(2)} MB`,
      );
      expect(ten.growth - one.growth).toBeLessThan(2 * MB);
    },
    LONG,
  );

  it(
    "without history too: the current readings are picked as the job's rows stream past",
    async () => {
      // The export reads before its first byte, so the heap is not the measure here: what the reads
      // hand over whole is. Only the ids that corrections replace come whole; the rows stream.
      let whole = 0;
      let streamed = 0;
      const currents = await withReads((read, stream) =>
        currentJobReadings(
          big.job.id,
          async (sql, values, shape) => {
            const rows = await read(sql, values, shape);
            whole += rows.length;
            return rows as never;
          },
          <R>(sql: string, values?: unknown[], shape?: RowShape) => {
            const rows = stream<R>(sql, values, shape);
            const each = (onRow: (r: R) => void) => rows.each((r) => (streamed++, onRow(r)));
            return { close: rows.close, each };
          },
        ),
      );
      const corrections = (await jobReadings(undefined, big.job.id)).filter((r) => r.supersedes).length;
      expect(currents).toHaveLength(8);
      expect(streamed).toBe(BIG);
      expect(whole).toBe(corrections);
      expect(whole).toBeLessThan(BIG);
      const { text } = await exportOf(big, false);
      expect(parseCsv(text.slice(1)).filter((r) => r[0] === "reading")).toHaveLength(8);
    },
    LONG,
  );

  it(
    "the measure sees a job's readings held in memory",
    async () => {
      const before = liveHeap();
      const held = await jobReadings(undefined, big.job.id);
      const growth = liveHeap() - before;
      expect(held).toHaveLength(BIG);
      expect(growth).toBeGreaterThan(4 * MB);
    },
    LONG,
  );
});
