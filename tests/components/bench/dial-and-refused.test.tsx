// @vitest-environment jsdom
import "fake-indexeddb/auto";
import { act, cleanup, configure, fireEvent, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { BenchDb } from "@/lib/offline/db";
import { getJobPrefs } from "@/lib/offline/meta";
import { applyPushResults } from "@/lib/offline/outbox";
import { recordReading } from "@/lib/offline/readings";
import type { BenchInstrument, JobPack } from "@/lib/schemas/sync";
import { makePack } from "../../lib/offline/fake-server";
import { mountBenchJob } from "./bench-job-harness";

// The job id comes from the address bar (/bench/job?id=1), which the harness sets.
vi.mock("next/navigation", () => ({ useSearchParams: () => new URLSearchParams(window.location.search) }));
configure({ asyncUtilTimeout: 5000 });
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const dialGauge: BenchInstrument = {
  id: 3,
  kind: "bore_gauge_dial",
  label: "Dial bore gauge",
  serial: "DB-1",
  unit: "in",
  resolution: 0.0001,
  expandedU: 0,
  coverageK: 2,
  calibrationDue: null,
  dialPlusMeansSmaller: true,
  active: true,
};
async function mount(pack: JobPack, seed?: (db: BenchDb) => Promise<void>) {
  const { db, input } = await mountBenchJob(pack, { seed });
  return { db, input };
}

function type(input: HTMLInputElement, text: string) {
  fireEvent.change(input, { target: { value: text } });
  fireEvent.keyDown(input, { key: "Enter" });
}

describe("dial bore gauge mode", () => {
  it("asks for the setting size once per group, shows the sign convention, and saves the computed diameter", async () => {
    const { db, input } = await mount({ ...makePack(1), instruments: [dialGauge] });
    fireEvent.click(screen.getByRole("button", { name: "Dial mode off" }));
    await screen.findByRole("button", { name: "Dial mode on" });
    expect(screen.getByTestId("dial-sign").textContent).toMatch(/plus \(\+\) reading means a smaller bore/);
    expect(screen.getByRole("button", { name: "Set size" })).toBeTruthy();
    await act(async () => type(input, "4.0300"));
    await waitFor(async () => expect((await getJobPrefs(db, 1)).dialSettings.bore).toBe(4.03));
    await screen.findByRole("button", { name: "Save" });
    expect(screen.getByText(/set at 4\.0300 in · \+ means smaller/)).toBeTruthy();
    await act(async () => type(input, "-0.0002")); // the needle 2 tenths minus: a bigger bore
    await waitFor(async () => expect(await db.readings.count()).toBe(1));
    const [r] = await db.readings.toArray();
    expect(r).toMatchObject({
      stationId: "bore/1/top/A",
      entryMode: "dial",
      dialSetting: 4.03,
      dialDeviation: -0.0002,
      value: 4.0302,
      instrumentId: 3,
    });
    expect(screen.getByTestId("last-entry").textContent).toContain("4.0302");
    // The next station of the group keeps the setting: the next entry is a dial reading at once.
    await act(async () => type(input, "0.0001"));
    await waitFor(async () => expect(await db.readings.count()).toBe(2));
    expect((await db.readings.toCollection().sortBy("takenAt")).at(-1)?.value).toBe(4.0299);
  }, 20_000);
});

describe("a reading the server refused", () => {
  it("is listed with the server's words, and fixing it sends the same reading again", async () => {
    let refusedId = "";
    const { db, input } = await mount(makePack(1), async (db) => {
      const r = await recordReading(
        db,
        { jobId: 1, stationId: "bore/1/top/A", value: 4.0302, unit: "in" },
        { deviceId: "tab-test", takenBy: 7 },
      );
      refusedId = r.id;
      await applyPushResults(
        db,
        [r],
        [
          {
            index: 0,
            id: r.id,
            status: "rejected",
            code: "invalid",
            reason: "The gauge was retired before this reading",
          },
        ],
      );
    });
    expect((await screen.findByText(/refused by the server/)).textContent).toMatch(/1 reading was refused/);
    expect(screen.getAllByText(/The gauge was retired before this reading/).length).toBeGreaterThan(0);
    fireEvent.click(screen.getByRole("button", { name: "Fix it" }));
    expect(screen.getByTestId("where").getAttribute("data-station")).toBe("bore/1/top/A");
    await act(async () => type(input, "4.0301"));
    await waitFor(async () => expect((await db.readings.get(refusedId))?.state).toBe("pending"));
    expect(await db.readings.count()).toBe(1);
    expect((await db.readings.get(refusedId))?.value).toBe(4.0301);
    expect(await db.outbox.get(refusedId)).toBeTruthy();
  });
});

describe("the gauge proposed at a station", () => {
  it("is the outside micrometer on a main journal, with depth, inside and outside micrometers on file", async () => {
    const mic = (id: number, kind: string, label: string) => ({ ...dialGauge, id, kind, label, serial: `M-${id}` });
    const instruments = [
      mic(11, "depth_mic", "Depth micrometer"),
      mic(12, "inside_mic", "Inside micrometer"),
      mic(13, "outside_mic", "Outside micrometer"),
    ];
    await mount({ ...makePack(1), instruments });
    fireEvent.click(screen.getByRole("button", { name: /Main journals/ }));
    await waitFor(() => expect(screen.getByTestId("where").getAttribute("data-station")).toBe("main/1/front/A"));
    expect(screen.getByText("Gauge: Outside micrometer (M-13)")).toBeTruthy();
  });
});

describe("a torque entry", () => {
  it("is judged the moment it is saved, with the lubricant picked", async () => {
    // Invented limit for the test: 65–70 lbf·ft on every torque group.
    const torque = { characteristic: "fastener_torque", stationPattern: "*", limitType: "min_max" } as const;
    const pack = makePack(1);
    const spec = [...pack.spec, { ...torque, unit: "lbf_ft", min: 65, max: 70, required: true } as const];
    const { input } = await mount({ ...pack, spec });
    fireEvent.click(screen.getByRole("button", { name: /Fastener torque/ }));
    await waitFor(() => expect(screen.getByTestId("where").getAttribute("data-station")).toBe("torque/main-caps"));
    fireEvent.click(screen.getByRole("button", { name: "Engine oil" }));
    await waitFor(() => expect(screen.getByRole("button", { name: "Engine oil", pressed: true })).toBeTruthy());
    await act(async () => type(input, "72"));
    await waitFor(() => expect(screen.getByTestId("last-entry").getAttribute("data-verdict")).toBe("out_of_spec"));
  });
});
