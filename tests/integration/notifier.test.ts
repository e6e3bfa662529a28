// The background notifier's start-up rules (instrumentation.ts): Node.js runtime only, never
// during `next build`, one timer per process; and one pass that finds nothing sends nothing.
import { afterEach, describe, expect, it } from "vitest";
import { register } from "@/instrumentation";
import { notifierRunning, runNotifierOnce, startNotifier, stopNotifier } from "@/lib/server/notify/notifier";
import { Flag, MailOutbox } from "@/models";
import { createShop } from "../support/factories";

const saved = { runtime: process.env.NEXT_RUNTIME, phase: process.env.NEXT_PHASE };

afterEach(() => {
  stopNotifier();
  process.env.NEXT_RUNTIME = saved.runtime;
  process.env.NEXT_PHASE = saved.phase;
  if (saved.runtime === undefined) delete process.env.NEXT_RUNTIME;
  if (saved.phase === undefined) delete process.env.NEXT_PHASE;
});

describe("notifier start-up", () => {
  it("starts only in the Node.js runtime, not during a build, and only once per process", async () => {
    process.env.NEXT_RUNTIME = "edge";
    await register();
    expect(notifierRunning()).toBe(false);
    process.env.NEXT_RUNTIME = "nodejs";
    process.env.NEXT_PHASE = "phase-production-build";
    await register();
    expect(notifierRunning()).toBe(false);
    delete process.env.NEXT_PHASE;
    await register();
    expect(notifierRunning()).toBe(true);
    expect(startNotifier()).toBe(false); // a second register (or a hot reload) adds no second timer
    stopNotifier();
    expect(notifierRunning()).toBe(false);
  });

  it("queues a shop's flag digest once, however many passes see it, and reports no errors", async () => {
    const s = await createShop();
    await Flag.create({
      shopId: s.shop.id,
      jobId: s.job.id,
      stationId: "bore/1/top/A",
      characteristic: "bore_diameter",
      value: 4.0311,
      unit: "in",
      limitMin: 4.0295,
      limitMax: 4.0305,
      verdict: "out_of_spec",
      reason: "out_of_spec",
    });
    const first = await runNotifierOnce();
    const second = await runNotifierOnce();
    expect(first.errors).toEqual([]);
    expect(second.errors).toEqual([]);
    expect(await MailOutbox.count({ where: { shopId: s.shop.id, kind: "flag_digest" } })).toBe(1);
  }, 180_000);
});
