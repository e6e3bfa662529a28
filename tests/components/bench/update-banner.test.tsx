// @vitest-environment jsdom
import "fake-indexeddb/auto";
import { act, cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { BenchProvider } from "@/components/bench/bench-context";
import { UpdateBanner } from "@/components/bench/update-banner";
import { BenchDb } from "@/lib/offline/db";
import { recordReading } from "@/lib/offline/readings";
import type { EngineHandle } from "@/lib/offline/engine-handle";

// A stand-in for @serwist/window: records listeners so the test can announce a waiting worker.
const listeners = new Map<string, (e: { isUpdate?: boolean }) => void>();
const serwist = {
  addEventListener: (t: string, fn: (e: { isUpdate?: boolean }) => void) => listeners.set(t, fn),
  removeEventListener: (t: string) => listeners.delete(t),
  messageSkipWaiting: vi.fn(),
};
vi.mock("@serwist/next/react", () => ({ useSerwist: () => ({ serwist }) }));

afterEach(cleanup);

async function mount() {
  const db = new BenchDb(`update-${Date.now()}-${Math.random()}`);
  render(
    <BenchProvider
      value={{
        db,
        engine: {} as EngineHandle,
        deviceId: "tab-test",
        actor: { userId: 7, shopId: 1, name: "Rosa", email: "r@x.example", role: "machinist" },
      }}
    >
      <UpdateBanner />
    </BenchProvider>,
  );
  await waitFor(() => expect(listeners.has("waiting")).toBe(true));
  return db;
}

describe("app update", () => {
  it("is offered only once the outbox is empty, and applied on the machinist's tap", async () => {
    const db = await mount();
    expect(screen.queryByTestId("update-banner")).toBeNull();
    await recordReading(
      db,
      { jobId: 1, stationId: "bore/1/top/A", value: 4.0302, unit: "in" },
      { deviceId: "tab-test", takenBy: 7 },
    );
    act(() => listeners.get("waiting")!({}));
    const banner = await screen.findByTestId("update-banner");
    await waitFor(() => expect(banner.textContent).toMatch(/offered once the 1 waiting reading is sent/));
    expect(screen.queryByRole("button", { name: "Update now" })).toBeNull();
    await db.outbox.clear(); // the server acknowledged it
    fireEvent.click(await screen.findByRole("button", { name: "Update now" }));
    await waitFor(() => expect(serwist.messageSkipWaiting).toHaveBeenCalledTimes(1));
  });

  it("never reloads on the first install, only when an applied update takes control", async () => {
    const reload = vi.fn();
    Object.defineProperty(window, "location", { value: { ...window.location, reload }, writable: true });
    await mount();
    listeners.get("controlling")!({ isUpdate: false });
    expect(reload).not.toHaveBeenCalled();
    listeners.get("controlling")!({ isUpdate: true });
    expect(reload).toHaveBeenCalledTimes(1);
  });
});
