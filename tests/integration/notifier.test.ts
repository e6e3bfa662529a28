// The background notifier's start-up rules (instrumentation.ts): Node.js runtime only, never
// during `next build`, one timer per process; and one pass that finds nothing sends nothing.
import { afterEach, describe, expect, it } from "vitest";
import { register } from "@/instrumentation";
import { notifierRunning, runNotifierOnce, startNotifier, stopNotifier } from "@/lib/server/notifier";

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

  it("queues nothing new on a second pass, and reports no errors", async () => {
    await runNotifierOnce();
    const again = await runNotifierOnce();
    expect(again.errors).toEqual([]);
    expect([again.releaseMails, again.digests, again.ready]).toEqual([0, 0, 0]);
  });
});
