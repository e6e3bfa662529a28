// @vitest-environment jsdom
import { act, cleanup, configure, fireEvent, screen, waitFor } from "@testing-library/react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import type { Bench } from "@/components/bench/bench-context";
import type { BenchDb } from "@/lib/offline/db";
import type { ServerReading } from "@/lib/schemas/sync";
import { makePack } from "../../lib/offline/fake-server";
import { mountBenchJob } from "./bench-job-harness";

// The job id comes from the address bar (/bench/job?id=1), which the harness sets.
vi.mock("next/navigation", () => ({ useSearchParams: () => new URLSearchParams(window.location.search) }));
configure({ asyncUtilTimeout: 5000 }); // Dexie commits under a loaded test run can take a while

// The test spec: bore 4.0300 +0.0005/-0.0005 in (fake-server.ts), no gauge on file (no guard band).
const pack = makePack(1);
let db: BenchDb;
let bench: Bench;

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

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
/** The current section's progress in the strip ("3 of 16"), counted from the readings in Dexie. */
const progress = () => screen.getByRole("button", { current: "step" }).lastElementChild?.textContent ?? "";

describe("bench entry", () => {
  beforeEach(async () => {
    ({ db, bench } = await mountBenchJob(pack));
  });

  it("gauge keystrokes + Enter save the reading, show the verdict at once and move on with no tap", async () => {
    expect(station()).toBe("bore/1/top/A");
    expect(progress()).toMatch(/^0 of \d+/);
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
    await waitFor(() => expect(progress()).toMatch(/^1 of \d+/)); // the route re-read the stored reading
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

describe("the pack refresh once the screen has settled", () => {
  it("a limit the lead tightened meanwhile judges the next entry", async () => {
    // Invented limit for the test: the lead narrowed the bore to ±0.0001 in on the server.
    const tightened = { ...pack.spec[0], tolPlus: 0.0001, tolMinus: 0.0001 };
    const serverPack = { ...pack, job: { ...pack.job, specRevision: 2 }, spec: [tightened] };
    const { server, db } = await mountBenchJob(pack, { serverPack });
    await waitFor(async () => expect((await db.jobs.get(1))?.pack.spec[0].tolPlus).toBe(0.0001));
    expect(server).toHaveBeenCalledWith("/api/bench/jobs/1", expect.anything());
    // The screen has the refreshed pack (not only the store), so the next entry is judged by it.
    await waitFor(() => expect(screen.getByTestId("job-screen").getAttribute("data-spec-revision")).toBe("2"));
    await act(async () => gaugeTypes("4.0302"));
    expect(screen.getByTestId("last-entry").getAttribute("data-verdict")).toBe("out_of_spec");
  });

  it("a reading another tablet took arrives with the pack and counts at once", async () => {
    const theirs: ServerReading = {
      id: "0b6f7f0e-3f4c-4d2a-9a57-6a3e8f1f2a20",
      jobId: 1,
      stationId: "bore/2/top/A",
      characteristic: "bore_diameter",
      value: 4.0301,
      unit: "in",
      valueCanonical: 102.36454, // 4.0301 in × 25.4 mm/in (NIST SP 811, B.8, exact)
      entryMode: "direct",
      dialSetting: null,
      dialDeviation: null,
      instrumentId: null,
      partTempC: null,
      gaugeTempC: null,
      lubricant: null,
      skipped: false,
      skipReason: null,
      note: null,
      supersedes: null,
      supersededBy: null,
      takenAt: "2026-12-01T08:00:00.000Z",
      receivedAt: "2026-12-01T08:00:01.000Z",
      takenBy: 8,
      deviceId: "tab-other",
      verdict: "in_spec",
      verdictNote: null,
      limitMin: 4.0295,
      limitMax: 4.0305,
      deviation: 0.0001,
    };
    const { db } = await mountBenchJob(pack, { serverPack: { ...pack, readings: [theirs] } });
    expect(progress()).toMatch(/^0 of \d+/);
    await waitFor(() => expect(progress()).toMatch(/^1 of \d+/));
    expect(await db.readings.get(theirs.id)).toMatchObject({ state: "synced", deviceId: "tab-other" });
  });

  it("a job released meanwhile turns read-only, saying why", async () => {
    const lockReason = "Job T-1 was released on 1 Dec 2026; readings are locked. Ask the lead to reopen it.";
    const released = { status: "released", locked: true, lockedAt: "2026-12-01T09:00:00.000Z", lockReason } as const;
    await mountBenchJob(pack, { serverPack: { ...pack, job: { ...pack.job, ...released } } });
    expect((await screen.findByText(/This job is released/)).closest("[role]")?.textContent).toContain(lockReason);
    expect((screen.getByTestId("entry") as HTMLInputElement).disabled).toBe(true);
    expect(screen.getByRole("button", { name: "Save" })).toHaveProperty("disabled", true);
  });
});
