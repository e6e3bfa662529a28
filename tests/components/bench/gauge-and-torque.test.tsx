// @vitest-environment jsdom
// The bench refuses, before storing, a reading its gauge cannot take (the core's gaugeRefusal, the
// same words the server uses), keeping what was typed; a saved torque shows its verdict and the
// lubricant in words, and no message shows an internal unit code. Wrenches and limits are invented
// test figures (a 20–150 lbf·ft click wrench is a common size, common practice).
import "fake-indexeddb/auto";
import { act, cleanup, configure, fireEvent, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { BenchInstrument, JobPack } from "@/lib/schemas/sync";
import { BENCH_GAUGES, makePack } from "../../lib/offline/fake-server";
import { mountBenchJob } from "./bench-job-harness";

vi.mock("next/navigation", () => ({ useSearchParams: () => new URLSearchParams(window.location.search) }));
configure({ asyncUtilTimeout: 5000 });
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const wrench: BenchInstrument = {
  ...BENCH_GAUGES.find((g) => g.kind === "torque_wrench")!,
  id: 40,
  label: "Click wrench",
  serial: "TW-9",
  rangeMin: 20,
  rangeMax: 150,
};
function torquePack(): JobPack {
  const pack = makePack(1);
  const torque = { characteristic: "fastener_torque", stationPattern: "*", limitType: "min_max" } as const;
  const spec = [...pack.spec, { ...torque, unit: "lbf_ft", min: 65, max: 70, required: true } as const];
  const instruments = [...pack.instruments.filter((g) => g.kind !== "torque_wrench"), wrench];
  return { ...pack, spec, instruments };
}
function type(input: HTMLInputElement, text: string) {
  fireEvent.change(input, { target: { value: text } });
  fireEvent.keyDown(input, { key: "Enter" });
}
async function toTorque(input: HTMLInputElement) {
  fireEvent.click(screen.getByRole("button", { name: /Fastener torque/ }));
  await waitFor(() => expect(screen.getByTestId("where").getAttribute("data-station")).toBe("torque/main-caps"));
  fireEvent.click(screen.getByRole("button", { name: "Engine oil" }));
  await waitFor(() => expect(screen.getByRole("button", { name: "Engine oil", pressed: true })).toBeTruthy());
  return input;
}

describe("a torque past the wrench's range", () => {
  it("is refused before it is stored, says which wrench to pick, and keeps what was typed", async () => {
    const { db, input } = await mountBenchJob(torquePack());
    await toTorque(input);
    await act(async () => type(input, "210"));
    expect(screen.getByRole("alert").textContent).toBe(
      "'Click wrench' (TW-9) reads 20–150 lbf·ft; 210 lbf·ft is outside its range. " +
        "Pick a torque wrench whose range holds 210 lbf·ft: " +
        "none on file holds it, so ask the admin to register one under Gauges",
    );
    expect(input.value).toBe("210");
    expect(await db.readings.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
  });

  it("a figure that cannot be a torque is refused with the unit as a person writes it", async () => {
    const { db, input } = await mountBenchJob(torquePack());
    await toTorque(input);
    await act(async () => type(input, "9000"));
    const words = screen.getByRole("alert").textContent!;
    expect(words).toMatch(/^9000 lbf·ft cannot be a fastener torque/);
    expect(words).not.toMatch(/lbf_ft|\bnm\b/);
    expect(await db.readings.count()).toBe(0);
  });
});

describe("a saved torque", () => {
  it("shows its verdict and the lubricant in words on the last-saved card", async () => {
    const { db, input } = await mountBenchJob(torquePack());
    await toTorque(input);
    await act(async () => type(input, "72"));
    await waitFor(async () => expect(await db.readings.count()).toBe(1));
    const card = screen.getByTestId("last-entry");
    await waitFor(() => expect(card.getAttribute("data-verdict")).toBe("out_of_spec")); // 72 against 65–70
    expect(card.textContent).toContain("Out of spec");
    expect(screen.getByTestId("last-lubricant").textContent).toBe("Lubricant: Engine oil");
    expect(card.textContent).not.toMatch(/engine-oil|lbf_ft|torque\/main-caps/);
    expect((await db.readings.toArray())[0]).toMatchObject({ value: 72, instrumentId: 40, lubricant: "engine-oil" });
  });
});

describe("a station with no suitable gauge on file", () => {
  it("refuses the reading and says which kind of gauge to register", async () => {
    const pack = { ...makePack(1), instruments: BENCH_GAUGES.filter((g) => g.kind === "outside_mic") };
    const { db, input } = await mountBenchJob(pack);
    await act(async () => type(input, "4.0302"));
    expect(screen.getByRole("alert").textContent).toMatch(
      /^No gauge is named for this reading\. Pick a dial bore gauge or bore gauge whose range holds 4\.0302 in: none/,
    );
    expect(input.value).toBe("4.0302");
    expect(await db.readings.count()).toBe(0);
  });
});
