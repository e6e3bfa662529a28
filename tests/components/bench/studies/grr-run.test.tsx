// @vitest-environment jsdom
// An R&R study on the tablet, on real Dexie (fake-indexeddb): the people, parts and trials are
// checked with words, then figures go into the cells in the order shown (trial by trial, each
// person through every part), each kept at once; undo takes back the last.
import "fake-indexeddb/auto";
import { cleanup, configure, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { BenchProvider, type Bench } from "@/components/bench/bench-context";
import { StudiesHome } from "@/components/bench/studies/studies-home";
import { BenchDb } from "@/lib/offline/db";
import type { EngineHandle } from "@/lib/offline/engine-handle";
import { draftOf, startDraft } from "@/lib/offline/study-drafts";

vi.mock("next/navigation", () => ({ useSearchParams: () => new URLSearchParams(window.location.search) }));
configure({ asyncUtilTimeout: 8000 });
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// An invented test micrometer.
const GAUGE = {
  id: 4,
  kind: "outside_mic",
  label: "Mic 2–3 in",
  serial: "M-4",
  unit: "in",
  resolution: 0.0001,
  rangeMin: 2,
  rangeMax: 3,
  dialPlusMeansSmaller: true,
};

async function mount() {
  const db = new BenchDb(`grr-run-${Date.now()}`);
  await startDraft(db, 7, { kind: "grr", gauge: GAUGE, design: null, measurements: [] });
  vi.stubGlobal(
    "fetch",
    vi.fn(async () => Response.json({ instruments: [] })),
  );
  window.history.replaceState(null, "", "/bench/studies?run=grr");
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
  await screen.findByRole("form", { name: "Study design" });
  return db;
}

const type = (input: HTMLElement, text: string) => {
  fireEvent.change(input, { target: { value: text } });
  fireEvent.keyDown(input, { key: "Enter" });
};

describe("an R&R study on the tablet", () => {
  it("asks for a second person, then takes figures cell by cell in the order shown", async () => {
    const db = await mount();
    fireEvent.click(screen.getByRole("button", { name: "Start measuring" }));
    expect((await screen.findByRole("alert")).textContent).toBe("Name 2 or 3 people who will each measure every part");
    fireEvent.change(screen.getByLabelText("Person 2"), { target: { value: "Ben" } });
    fireEvent.click(within(screen.getByRole("group", { name: "Parts" })).getByRole("button", { name: "5" }));
    fireEvent.click(within(screen.getByRole("group", { name: "Trials" })).getByRole("button", { name: "2" }));
    fireEvent.change(screen.getByLabelText(/Tolerance T/), { target: { value: "0.0010" } });
    fireEvent.click(screen.getByRole("button", { name: "Start measuring" }));
    const input = await screen.findByTestId("entry");
    expect((await draftOf(db, 7, "grr"))?.design).toEqual({
      appraisers: ["Rosa", "Ben"],
      parts: 5,
      trials: 2,
      tolerance: 0.001,
    });
    for (const [i, v] of ["2.5001", "2.5102", "2.4903", "2.5204", "2.4805"].entries()) {
      type(input, v);
      await waitFor(() => expect(screen.getByTestId("study-count").textContent).toBe(`${i + 1} of 20`));
    }
    expect(screen.getByText("Trial 1 · Ben · part 1")).toBeTruthy();
    type(input, "25.001");
    await waitFor(() => expect(screen.getByTestId("entry-note").textContent).toMatch(/outside what Mic 2–3 in reads/));
    fireEvent.click(screen.getByRole("button", { name: "Undo last figure" }));
    await waitFor(() => expect(screen.getByTestId("study-count").textContent).toBe("4 of 20"));
    expect(screen.getByText("Trial 1 · Rosa · part 5")).toBeTruthy();
    expect((await draftOf(db, 7, "grr"))?.measurements.at(-1)).toEqual({
      appraiser: 1,
      part: 4,
      trial: 1,
      value: 2.5204,
    });
  }, 30_000);
});
