// @vitest-environment jsdom
import "fake-indexeddb/auto";
import { cleanup, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { BenchProvider, type Bench } from "@/components/bench/bench-context";
import { SyncBadge } from "@/components/bench/sync-badge";
import { BenchDb } from "@/lib/offline/db";
import type { EngineHandle } from "@/lib/offline/engine-handle";
import { patchSyncStatus } from "@/lib/offline/meta";
import { addPhoto } from "@/lib/offline/photos";
import { recordReading } from "@/lib/offline/readings";

afterEach(cleanup);

describe("the sync badge", () => {
  it("counts photos waiting with the readings, and says the server is not reachable while the network is up", async () => {
    const db = new BenchDb(`badge-${Date.now()}`);
    const ctx = { deviceId: "tab-test", takenBy: 7 };
    await recordReading(db, { jobId: 1, stationId: "bore/1/top/A", value: 4.0302, unit: "in" }, ctx);
    await recordReading(db, { jobId: 1, stationId: "bore/1/top/B", value: 4.0301, unit: "in" }, ctx);
    const photo = new File([new Uint8Array([255, 216, 255])], "bore.jpg", { type: "image/jpeg" });
    await addPhoto(db, photo, { jobId: 1, ownerType: "job", ownerId: "1" }, 7);
    await patchSyncStatus(db, { lastOutcome: "unreachable", lastError: "No connection to the server", failures: 1 });
    const bench: Bench = {
      db,
      engine: { afterEntry: vi.fn(), sync: vi.fn() } as unknown as EngineHandle,
      deviceId: "tab-test",
      actor: { userId: 7, shopId: 1, name: "Rosa", email: "r@x.example", role: "machinist" },
    };
    render(
      <BenchProvider value={bench}>
        <SyncBadge />
      </BenchProvider>,
    );
    const badge = screen.getByTestId("sync-badge");
    await waitFor(() => expect(badge.getAttribute("data-photos")).toBe("1"));
    expect(badge.getAttribute("data-pending")).toBe("2");
    expect(badge.textContent).toContain("3 to send");
    expect(badge.textContent).toContain("2 readings and 1 photo wait to be sent");
    expect(screen.getByTestId("sync-connection").textContent).toMatch(/^Network on, but the server is not reachable/);
    expect(badge.textContent).not.toMatch(/Online/);
  });
});
