// @vitest-environment jsdom
// A repeatability run on the tablet, mounted on real Dexie (fake-indexeddb): each figure typed (as a
// gauge types it: digits then Enter) is kept at once, a mistyped one is refused with words and
// kept on screen, undo takes back the last, and a finished run shows the core's figures, the
// server's preview with what saving changes, and is cleared from the tablet only once saved.
import "fake-indexeddb/auto";
import { cleanup, configure, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { BenchProvider, type Bench } from "@/components/bench/bench-context";
import { StudiesHome } from "@/components/bench/studies/studies-home";
import { BenchDb } from "@/lib/offline/db";
import type { EngineHandle } from "@/lib/offline/engine-handle";
import { draftOf, startDraft } from "@/lib/offline/study-drafts";
import { type1Study, DEFAULT_STUDY_THRESHOLDS } from "@/lib/domain/gauge-studies";
import type { BenchInstrument } from "@/lib/schemas/sync";
import { consequenceWords } from "@/lib/domain";

vi.mock("next/navigation", () => ({ useSearchParams: () => new URLSearchParams(window.location.search) }));
configure({ asyncUtilTimeout: 8000 });
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// An invented test gauge and setting master.
const GAUGE: BenchInstrument = {
  id: 3,
  kind: "bore_gauge_digital",
  label: "Digital bore",
  serial: "G-3",
  unit: "in",
  resolution: 0.0001,
  expandedU: 0.0001,
  coverageK: 2,
  rangeMin: 3,
  rangeMax: 6,
  calibrationDue: null,
  dialPlusMeansSmaller: true,
  active: true,
};
const REF = { value: 4.03, expandedU: 0.00005, coverageK: 2 };
const steps = [0, 1, -1, 0, 2, 0, -1, 1, 0, 0, -2, 1, 0, 1, -1, 0, 3, 0, -1, 0, 1, 0, -1, 2, 0];
const readings = steps.map((k) => Number((4.03 + k * 0.0001).toFixed(4)));

let n = 0;
async function mount(kept: number[] = []) {
  const db = new BenchDb(`type1-run-${++n}-${Date.now()}`);
  const draft = { id: 3, kind: GAUGE.kind, label: GAUGE.label, serial: GAUGE.serial, unit: "in", resolution: 0.0001 };
  await startDraft(db, 7, {
    kind: "type1",
    gauge: { ...draft, rangeMin: 3, rangeMax: 6, dialPlusMeansSmaller: true },
    reference: REF,
    readings: kept,
  });
  const result = type1Study({
    readings,
    reference: REF,
    resolution: 0.0001,
    characteristics: [{ characteristic: "bore_diameter", tolerance: 0.0015 }],
    thresholds: DEFAULT_STUDY_THRESHOLDS,
  });
  const study = {
    kind: "type1",
    type1: result,
    grr: null,
    passed: false,
    performedOn: "2026-12-03",
    dueOn: "2027-12-03",
  };
  const consequences = { flagsOpened: 1, flagsClosed: 0, verdictsChanged: 1, requiredStations: 1 };
  const words = consequenceWords(consequences);
  const preview = { consequences, words, wide: false, jobs: [{ jobId: 12, code: "KF-2611", consequences, words }] };
  const server = vi.fn(async (url: RequestInfo | URL, init?: RequestInit) => {
    const path = String(url);
    if (path === "/api/bench/gauges") return Response.json({ instruments: [GAUGE] });
    if (path === "/api/gauges/3/studies/preview") return Response.json({ ...preview, study });
    if (path === "/api/gauges/3/studies" && init?.method === "POST")
      return Response.json({ ...preview, study }, { status: 201 });
    return Response.json({ error: { code: "not_found", message: "Not found" } }, { status: 404 });
  });
  vi.stubGlobal("fetch", server);
  window.history.replaceState(null, "", "/bench/studies?run=type1");
  const bench: Bench = {
    db,
    engine: {} as EngineHandle,
    deviceId: "tab-test",
    actor: { userId: 7, shopId: 1, name: "Rosa", email: "r@x.example", role: "machinist" },
  };
  render(
    <BenchProvider value={bench}>
      <StudiesHome />
    </BenchProvider>,
  );
  const input = (await screen.findByTestId("entry")) as HTMLInputElement;
  return { db, input, server, words };
}

async function type(input: HTMLInputElement, text: string) {
  fireEvent.change(input, { target: { value: text } });
  fireEvent.keyDown(input, { key: "Enter" });
}

describe("a repeatability run on the tablet", () => {
  it("keeps each reading, refuses a mistyped one with words, and undoes the last", async () => {
    const { db, input } = await mount();
    await type(input, "4.0301");
    await waitFor(() => expect(screen.getByTestId("study-count").textContent).toMatch(/^1 of 25/));
    expect((await draftOf(db, 7, "type1"))?.readings).toEqual([4.0301]);
    await type(input, "4.301");
    await waitFor(() => expect(screen.getByTestId("entry-note").textContent).toMatch(/steps of the gauge/));
    expect(input.value).toBe("4.301");
    expect((await draftOf(db, 7, "type1"))?.readings).toEqual([4.0301]);
    fireEvent.click(screen.getByRole("button", { name: "Undo last reading" }));
    await waitFor(() => expect(screen.getByTestId("study-count").textContent).toMatch(/^0 of 25/));
    expect(screen.getByRole("button", { name: "Work out the result" })).toHaveProperty("disabled", true);
  });

  it("shows the result and what saving changes, and clears the run only once the server saved it", async () => {
    // 24 kept from before a reload; the 25th typed.
    const { db, input, server, words } = await mount(readings.slice(0, 24));
    await waitFor(() => expect(screen.getByTestId("study-count").textContent).toMatch(/^24 of 25/));
    await type(input, readings[24].toFixed(4));
    await waitFor(() => expect(screen.getByTestId("study-count").textContent).toMatch(/^25 of 25/));
    fireEvent.click(screen.getByRole("button", { name: "Work out the result" }));
    // The screen shows the core's s of these readings (to 6 places, two past the gauge's step).
    const { sd } = type1Study({
      readings,
      reference: REF,
      resolution: 0.0001,
      characteristics: [],
      thresholds: DEFAULT_STUDY_THRESHOLDS,
    });
    expect(screen.getByTestId("study-sd").textContent).toContain(sd.toFixed(6));
    expect((await screen.findByTestId("study-consequences")).textContent).toMatch(/opens 1 flag, changes 1 verdict/);
    expect(screen.getByRole("list", { name: "Per job" }).textContent).toBe(`KF-2611: ${words}`);
    expect(screen.getByTestId("study-characteristics").textContent).toMatch(/Fails|Passes/);
    fireEvent.click(screen.getByRole("button", { name: "Save the study" }));
    await screen.findByTestId("study-saved");
    const save = server.mock.calls.find(([url, init]) => url === "/api/gauges/3/studies" && init?.method === "POST");
    expect(JSON.parse(String(save?.[1]?.body))).toEqual({
      kind: "type1",
      reference: REF,
      readings,
      confirmedFlagsOpened: 1,
    });
    await waitFor(async () => expect(await draftOf(db, 7, "type1")).toBeUndefined());
  }, 30_000);
});
