// Five tablets pushing the same job at once: no deadlock surfaces, nothing is duplicated, and the
// readings every client shares are stored once with one flag.
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { getSequelize } from "@/lib/server/core/db";
import { Customer, Job, JobLimit } from "@/models";
import { INCH_LIMITS, createShop } from "../support/factories";
import { count, flagsOf, push, reading, syncedInAudit } from "../api/sync-fixtures";

const CLIENTS = 5;

/** Stations of the V8 test engine that take an inch length, bores first. */
const stations = [
  ...[1, 2, 3, 4, 5, 6, 7, 8].flatMap((c) =>
    ["top", "mid", "bottom"].flatMap((d) => ["A", "B"].map((a) => `bore/${c}/${d}/${a}`)),
  ),
  ...[1, 2, 3, 4, 5].flatMap((m) =>
    ["front", "rear"].flatMap((p) => ["A", "B"].flatMap((a) => [`main/${m}/${p}/${a}`, `main-brg/${m}/${p}/${a}`])),
  ),
];

async function secondJob(shopId: number, engineId: number) {
  getSequelize();
  const customer = await Customer.create({ shopId, name: "Second customer" });
  const job = await Job.create({
    shopId,
    customerId: customer.id,
    engineId,
    code: `P-${randomUUID().slice(0, 6)}`,
    title: "Second job",
    unitSystem: "in",
    status: "measuring",
  });
  for (const [i, l] of INCH_LIMITS.entries()) await JobLimit.create({ ...l, jobId: job.id, sortOrder: i });
  return job.id;
}

describe("parallel ingest", () => {
  it("5 clients pushing the same job in parallel: every batch accepted, each reading once, one flag per value", async () => {
    const s = await createShop();
    const shared = stations
      .slice(0, 10)
      .map((st, i) => reading(s.job.id, st, st.startsWith("bore") ? (i === 0 ? 4.0312 : 4.0301) : 2.449));
    const own = Array.from({ length: CLIENTS }, (_, c) =>
      stations
        .slice(10 + c * 12, 22 + c * 12)
        .map((st) =>
          reading(s.job.id, st, st.startsWith("bore") ? 4.0302 : st.startsWith("main-brg") ? 2.4512 : 2.4491),
        ),
    );
    const replies = await Promise.all(
      own.map(async (mine, c) => {
        const out = [];
        // Each client sends the shared readings with its own, then re-sends everything (a lost ack).
        out.push(await push(s.users.machinist, [...shared, ...mine.slice(0, 6)], `tablet-${c}`));
        out.push(await push(s.users.machinist, [...mine.slice(6), ...shared.slice(0, 3)], `tablet-${c}`));
        out.push(await push(s.users.machinist, [...mine, ...shared], `tablet-${c}`));
        return out;
      }),
    );
    for (const res of replies.flat()) {
      expect(res.status).toBe(200);
      expect(res.body.results.every((r: { status: string }) => r.status === "accepted")).toBe(true);
    }
    const unique = shared.length + own.flat().length;
    expect(await count("SELECT COUNT(*) AS n FROM readings WHERE job_id = ?", [s.job.id])).toBe(unique);
    // Each stored reading is in exactly one batch's "readings.sync" audit event (replays add none).
    const audited = (await syncedInAudit(s.shop.id)).map((e) => e.id);
    expect(audited).toHaveLength(unique);
    expect(new Set(audited)).toEqual(new Set([...shared, ...own.flat()].map((r) => r.id)));
    expect(
      await count("SELECT COUNT(*) AS n FROM sync_changes WHERE job_id = ? AND entity = 'reading'", [s.job.id]),
    ).toBe(unique);
    const open = (await flagsOf(s.job.id)).filter((f) => f.state !== "closed");
    const keys = open.map((f) => f.readingId ?? f.derivedKey);
    expect(new Set(keys).size).toBe(keys.length); // no value flagged twice
    expect(open.filter((f) => f.readingId === shared[0].id)).toHaveLength(1);
  });

  it("batches that touch two jobs in opposite orders do not deadlock", async () => {
    const s = await createShop();
    const other = await secondJob(s.shop.id, s.engine.id);
    const replies = await Promise.all(
      Array.from({ length: CLIENTS }, (_, c) => {
        const jobs = c % 2 ? [s.job.id, other] : [other, s.job.id];
        const batch = jobs.flatMap((j) =>
          stations.slice(c * 8, c * 8 + 8).map((st) => reading(j, st, st.startsWith("bore") ? 4.0302 : 2.449)),
        );
        return push(s.users.machinist, batch, `tablet-${c}`);
      }),
    );
    expect(replies.map((r) => r.status)).toEqual(Array(CLIENTS).fill(200));
    expect(await count("SELECT COUNT(*) AS n FROM readings WHERE job_id IN (?, ?)", [s.job.id, other])).toBe(
      CLIENTS * 16,
    );
  });
});
