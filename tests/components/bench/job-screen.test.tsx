// @vitest-environment jsdom
import "fake-indexeddb/auto";
import { act, cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { useLiveQuery } from "dexie-react-hooks";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { configure } from "@testing-library/react";
import { BenchProvider, type Bench } from "@/components/bench/bench-context";
import { JobScreen } from "@/components/bench/job-screen";
import { BenchDb } from "@/lib/offline/db";
import { getJobPrefs } from "@/lib/offline/meta";
import { savePack } from "@/lib/offline/packs";
import { readingsOfJob } from "@/lib/offline/readings";
import type { EngineHandle } from "@/lib/offline/engine-handle";
import { makePack } from "../../lib/offline/fake-server";

configure({ asyncUtilTimeout: 5000 }); // Dexie commits under a loaded test run can take a while

// The test spec: bore 4.0300 +0.0005/-0.0005 in (fake-server.ts), no gauge on file (no guard band).
const pack = makePack(1);
let db: BenchDb;
let bench: Bench;
let n = 0;

function Live() {
  const readings = useLiveQuery(() => readingsOfJob(db, 1), []);
  const prefs = useLiveQuery(() => getJobPrefs(db, 1), []);
  return readings && prefs ? <JobScreen pack={pack} readings={readings} prefs={prefs} /> : null;
}

beforeEach(async () => {
  db = new BenchDb(`screen-${++n}-${Date.now()}`);
  await savePack(db, pack);
  const engine = { afterEntry: vi.fn(), sync: vi.fn() } as unknown as EngineHandle;
  bench = {
    db,
    engine,
    deviceId: "tab-test",
    actor: { userId: 7, shopId: 1, name: "Rosa", email: "r@x.example", role: "machinist" },
  };
  render(
    <BenchProvider value={bench}>
      <Live />
    </BenchProvider>,
  );
  const input = await screen.findByTestId("entry");
  await waitFor(() => expect(document.activeElement).toBe(input));
});
afterEach(cleanup);

/** What a gauge sends: one keystroke per character into the focused field, then Enter. */
function gaugeTypes(text: string) {
  const input = screen.getByTestId("entry") as HTMLInputElement;
  expect(document.activeElement).toBe(input);
  for (const ch of text) {
    fireEvent.keyDown(input, { key: ch });
    fireEvent.change(input, { target: { value: input.value + ch } });
    fireEvent.keyUp(input, { key: ch });
  }
  fireEvent.keyDown(input, { key: "Enter" });
}

const station = () => screen.getByTestId("where").getAttribute("data-station");

describe("bench entry", () => {
  it("gauge keystrokes + Enter save the reading, show the verdict at once and move on with no tap", async () => {
    expect(station()).toBe("bore/1/top/A");
    await act(async () => gaugeTypes("4.0302"));
    const last = screen.getByTestId("last-entry");
    expect(last.getAttribute("data-verdict")).toBe("in_spec");
    expect(last.textContent).toContain("In spec");
    expect(screen.getByTestId("deviation").textContent).toBe("2 tenths over");
    await waitFor(() => expect(station()).toBe("bore/1/top/B"));
    await waitFor(async () => expect(await db.outbox.count()).toBe(1));
    const [r] = await db.readings.toArray();
    expect(r).toMatchObject({
      stationId: "bore/1/top/A",
      value: 4.0302,
      unit: "in",
      state: "pending",
      entryMode: "direct",
      takenBy: 7,
      deviceId: "tab-test",
    });
    expect(bench.engine.afterEntry).toHaveBeenCalled();
    expect((screen.getByTestId("entry") as HTMLInputElement).value).toBe("");
  });

  it("an out-of-spec reading asks for a confirming one; the second supersedes the first and the route moves on", async () => {
    await act(async () => gaugeTypes("4.0312"));
    expect(screen.getByTestId("last-entry").getAttribute("data-verdict")).toBe("out_of_spec");
    expect(screen.getByRole("alert").textContent).toMatch(/Measure this station again to confirm/);
    expect(screen.getByTestId("deviation").textContent).toBe("12 tenths over");
    expect(station()).toBe("bore/1/top/A");
    await waitFor(async () => expect(await db.readings.count()).toBe(1));
    await act(async () => gaugeTypes("4.0311"));
    await waitFor(() => expect(station()).toBe("bore/1/top/B"));
    await waitFor(async () => expect(await db.readings.count()).toBe(2));
    const [first, second] = await db.readings.toCollection().sortBy("takenAt");
    expect(second.supersedes).toBe(first.id);
  });

  it("the keypad works the same way, and a bad figure is refused in words with the text kept", async () => {
    for (const k of ["4", "0", "Decimal point", "3", "0", "2"])
      fireEvent.click(screen.getByRole("button", { name: k }));
    fireEvent.click(screen.getByRole("button", { name: "Save" }));
    const note = await screen.findByText(/Check the decimal point/);
    expect(note.getAttribute("role")).toBe("alert");
    expect((screen.getByTestId("entry") as HTMLInputElement).value).toBe("40.302");
    expect(await db.readings.count()).toBe(0);
    fireEvent.click(screen.getByRole("button", { name: "Clear" }));
    for (const k of ["4", "Decimal point", "0", "3", "0", "1"])
      fireEvent.click(screen.getByRole("button", { name: k }));
    await act(async () => void fireEvent.click(screen.getByRole("button", { name: "Save" })));
    expect(screen.getByTestId("last-entry").getAttribute("data-verdict")).toBe("in_spec");
    await waitFor(async () => expect(await db.readings.count()).toBe(1));
  });

  it("a physical keyboard's Escape clears the field; skipping needs a reason and moves on", async () => {
    const input = screen.getByTestId("entry") as HTMLInputElement;
    fireEvent.change(input, { target: { value: "4.03" } });
    fireEvent.keyDown(input, { key: "Escape" });
    expect(input.value).toBe("");
    fireEvent.click(screen.getByRole("button", { name: "Skip…" }));
    fireEvent.click(await screen.findByRole("button", { name: "Skip with this reason" })); // the sheet loads on demand
    expect(screen.getByRole("alert").textContent).toMatch(/Type why the station is skipped/);
    await act(async () => void fireEvent.click(screen.getByRole("button", { name: "Not on this engine" })));
    await waitFor(() => expect(station()).toBe("bore/1/top/B"));
    const [r] = await db.readings.toArray();
    expect(r).toMatchObject({ skipped: true, skipReason: "Not on this engine", value: null });
  });
});
