// @vitest-environment jsdom
// A gauge that types (a keyboard wedge) sends its figure into whatever has the focus. After every
// tap on the bench the entry field has it again, and a figure typed while something else has it
// still lands in the field; each figure below is then found stored in Dexie.
import { act, cleanup, configure, fireEvent, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { BenchDb } from "@/lib/offline/db";
import { getJobPrefs } from "@/lib/offline/meta";
import type { BenchInstrument, JobPack } from "@/lib/schemas/sync";
import { makePack } from "../../lib/offline/fake-server";
import { mountBenchJob } from "./bench-job-harness";

vi.mock("next/navigation", () => ({ useSearchParams: () => new URLSearchParams(window.location.search) }));
configure({ asyncUtilTimeout: 5000 });
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Two bore gauges on file, one of them a dial bore gauge, and a wrench (invented test gauges).
const gauge = (id: number, kind: string, label: string): BenchInstrument => ({
  id,
  kind,
  label,
  serial: `G-${id}`,
  unit: "in",
  resolution: 0.0001,
  expandedU: 0,
  coverageK: 2,
  calibrationDue: null,
  dialPlusMeansSmaller: true,
  active: true,
});
// A torque needs a torque wrench (a reading names a gauge that can measure its station).
const wrench = { ...gauge(5, "torque_wrench", "Torque wrench"), unit: "lbf_ft", resolution: 1 };
const instruments = [
  gauge(3, "bore_gauge_dial", "Dial bore gauge"),
  gauge(4, "bore_gauge_digital", "Digital bore"),
  wrench,
];
// Invented limit for the test: 65–70 lbf·ft on every torque group.
const torque = {
  characteristic: "fastener_torque",
  stationPattern: "*",
  limitType: "min_max",
  unit: "lbf_ft",
  min: 65,
  max: 70,
  required: true,
} as const;
const base = makePack(1);
const pack: JobPack = { ...base, instruments, spec: [...base.spec, torque] };

const entry = () => screen.getByTestId("entry") as HTMLInputElement;
const station = () => screen.getByTestId("where").getAttribute("data-station");

/** A finger on a button: the browser moves the focus to it, then the click runs. */
async function tap(el: HTMLElement) {
  el.focus();
  await act(async () => void fireEvent.click(el));
}

/** The gauge's keystrokes, sent to whatever has the focus now (no tap on the field first). */
async function gaugeSends(text: string) {
  await waitFor(() => expect(document.activeElement).toBe(entry()));
  await act(async () => {
    for (const ch of text) {
      const target = document.activeElement ?? document.body;
      fireEvent.keyDown(target, { key: ch });
      if (target === entry()) fireEvent.change(entry(), { target: { value: entry().value + ch } });
    }
    fireEvent.keyDown(document.activeElement ?? document.body, { key: "Enter" });
  });
}

async function storedValues(db: BenchDb) {
  return (await db.readings.toCollection().sortBy("takenAt")).map((r) => [r.stationId, r.value]);
}

describe("the entry field keeps the focus after each tap", () => {
  it("change gauge, dial mode, a station jump, the skip sheet closed, a photo taken, the lubricant", async () => {
    const { db } = await mountBenchJob(pack);
    await tap(screen.getByRole("button", { name: "Change gauge" }));
    await tap(screen.getByRole("button", { name: /Digital bore/ }));
    await waitFor(async () => expect(Object.values((await getJobPrefs(db, 1)).gauges)).toEqual([4]));
    await gaugeSends("4.0302");
    await waitFor(async () => expect(await storedValues(db)).toEqual([["bore/1/top/A", 4.0302]]));

    await tap(screen.getByRole("button", { name: "Change gauge" }));
    await tap(screen.getByRole("button", { name: /Dial bore gauge/ }));
    await tap(await screen.findByRole("button", { name: "Dial mode off" }));
    await screen.findByRole("button", { name: "Dial mode on" });
    await gaugeSends("4.0300"); // the setting size
    await waitFor(async () => expect((await getJobPrefs(db, 1)).dialSettings.bore).toBe(4.03));
    await tap(screen.getByRole("button", { name: "Dial mode on" }));
    await screen.findByRole("button", { name: "Dial mode off" });
    await gaugeSends("4.0301");
    await waitFor(async () => expect(await db.readings.count()).toBe(2));

    await tap(screen.getByRole("button", { name: "All stations" }));
    await tap(await screen.findByRole("button", { name: /2 top A/ }));
    await waitFor(() => expect(station()).toBe("bore/2/top/A"));
    await gaugeSends("4.0303");
    await waitFor(async () => expect(await db.readings.count()).toBe(3));

    await tap(screen.getByRole("button", { name: "Skip…" }));
    await tap(await screen.findByRole("button", { name: "Back to measuring" }));
    await gaugeSends("4.0299");
    await waitFor(async () => expect(await db.readings.count()).toBe(4));

    const camera = document.querySelector("input[type=file]") as HTMLInputElement;
    camera.focus();
    const photo = new File([new Uint8Array([255, 216, 255])], "bore.jpg", { type: "image/jpeg" });
    await act(async () => void fireEvent.change(camera, { target: { files: [photo] } }));
    await waitFor(async () => expect(await db.photos.count()).toBe(1));
    await gaugeSends("4.0298");
    await waitFor(async () => expect(await db.readings.count()).toBe(5));

    await tap(screen.getByRole("button", { name: /Fastener torque/ }));
    await waitFor(() => expect(station()).toBe("torque/main-caps"));
    await tap(screen.getByRole("button", { name: "Engine oil" }));
    await waitFor(() => expect(screen.getByRole("button", { name: "Engine oil", pressed: true })).toBeTruthy());
    await gaugeSends("67");
    await waitFor(async () => expect((await storedValues(db)).at(-1)).toEqual(["torque/main-caps", 67]));
    expect(await storedValues(db)).toEqual([
      ["bore/1/top/A", 4.0302],
      ["bore/1/top/B", 4.0301],
      ["bore/2/top/A", 4.0303],
      ["bore/2/top/B", 4.0299],
      ["bore/2/mid/A", 4.0298],
      ["torque/main-caps", 67],
    ]);
  }, 30_000);
});

describe("a figure typed while something else has the focus", () => {
  it("goes to the entry field from a button or the page, and Enter saves it", async () => {
    const { db } = await mountBenchJob(pack);
    screen.getByRole("button", { name: "Change gauge" }).focus(); // focused by the keyboard, no tap
    await act(async () => void fireEvent.keyDown(document.activeElement!, { key: "4" }));
    expect(document.activeElement).toBe(entry());
    expect(entry().value).toBe("4");
    await gaugeSends(".0302");
    await waitFor(async () => expect(await storedValues(db)).toEqual([["bore/1/top/A", 4.0302]]));

    entry().blur();
    expect(document.activeElement).toBe(document.body);
    await act(async () => void fireEvent.keyDown(document.body, { key: "-" }));
    expect(entry().value).toBe("-");
    fireEvent.keyDown(entry(), { key: "Escape" });
    expect(entry().value).toBe("");
  });

  it("stays with the skip reason while it is typed, and a modifier key is left alone", async () => {
    await mountBenchJob(pack);
    await tap(screen.getByRole("button", { name: "Skip…" }));
    const reason = await screen.findByRole("textbox", { name: "Another reason" });
    reason.focus();
    fireEvent.keyDown(reason, { key: "4" });
    expect(document.activeElement).toBe(reason);
    expect(entry().value).toBe("");
    await tap(screen.getByRole("button", { name: "Back to measuring" }));
    await waitFor(() => expect(document.activeElement).toBe(entry()));
    screen.getByRole("button", { name: "Change gauge" }).focus();
    fireEvent.keyDown(document.activeElement!, { key: "4", ctrlKey: true });
    expect(entry().value).toBe("");
  });
});
