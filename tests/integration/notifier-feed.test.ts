// The notifier finds the jobs to check for "ready for release" by following each shop's change
// feed by its sequence (changedOpenJobs): a change committed late, after another shop's later
// change was already read, is still found, and no change is found twice.
import { beforeAll, describe, expect, it } from "vitest";
import { getSequelize } from "@/lib/server/core/db";
import { changedOpenJobs, type FeedCursors } from "@/lib/server/notify/repo";
import { recordChange } from "@/lib/server/sync/repo";
import { createShop, type TestShop } from "../support/factories";

let a: TestShop;
let b: TestShop;
beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

// Far ahead, so a job row's own edits (updated_at) never count: only the feed is under test.
const AT = new Date("2100-01-01T00:00:00Z");

async function pass(feed: FeedCursors | null) {
  const r = await changedOpenJobs({ feed, at: AT });
  const ours = r.jobs.map((j) => j.id).filter((id) => id === a.job.id || id === b.job.id);
  return { jobs: ours.sort((x, y) => x - y), feed: r.feed };
}

const change = (s: TestShop) => ({ shopId: s.shop.id, jobId: s.job.id, entity: "job" as const, entityId: "plan" });

describe("changedOpenJobs", () => {
  it("follows each shop's sequence: late is found on the next pass, nothing is found twice", async () => {
    const start = await pass(null);
    expect((await pass(start.feed)).jobs).toEqual([]);

    // Shop a's change takes its number and stays uncommitted while shop b's commits after it
    // (b's global id is the higher one: a cursor over ids would pass over a's change).
    const slow = await getSequelize().transaction();
    await recordChange(slow, change(a));
    await recordChange(null, change(b));
    const first = await pass(start.feed);
    expect(first.jobs).toEqual([b.job.id]);
    expect(first.feed.get(a.shop.id)).toBe(start.feed.get(a.shop.id));
    expect(first.feed.get(b.shop.id)).toBe(start.feed.get(b.shop.id)! + 1);

    await slow.commit();
    const second = await pass(first.feed);
    expect(second.jobs).toEqual([a.job.id]);
    expect(second.feed.get(a.shop.id)).toBe(start.feed.get(a.shop.id)! + 1);
    expect((await pass(second.feed)).jobs).toEqual([]);
  });

  it("counts every change of a shop that had no cursor yet (a shop made since the last pass)", async () => {
    const before = await pass(null);
    await recordChange(null, change(a));
    const withoutA = new Map([...before.feed].filter(([shopId]) => shopId !== a.shop.id));
    expect((await pass(withoutA)).jobs).toEqual([a.job.id]);
    expect((await pass(before.feed)).jobs).toEqual([a.job.id]);
  });

  it("on the first pass (no cursors) counts the feed's changes made since `at`", async () => {
    await recordChange(null, change(b));
    const r = await changedOpenJobs({ feed: null, at: new Date(Date.now() - 60_000) });
    expect(r.jobs.map((j) => j.id)).toContain(b.job.id);
    expect((await pass(null)).jobs).toEqual([]);
  });
});
