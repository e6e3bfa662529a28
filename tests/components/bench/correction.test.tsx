// @vitest-environment jsdom
// A figure saved where a kept reading already stands replaces it. Where the route stays on such a
// station (the last open one, a jump back) the bench asks first; "Measure again" and the
// confirming reading after an out-of-spec figure were asked for, so they record at once.
import { act, cleanup, configure, fireEvent, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { BenchDb } from "@/lib/offline/db";
import type { JobPack } from "@/lib/schemas/sync";
import { makePack } from "../../lib/offline/fake-server";
import { mountBenchJob } from "./bench-job-harness";

vi.mock("next/navigation", () => ({ useSearchParams: () => new URLSearchParams(window.location.search) }));
configure({ asyncUtilTimeout: 5000 });
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// The test spec: bore 4.0300 ± 0.0005 in (fake-server.ts); a route cut to two stations.
const full = makePack(1);
const [bores] = full.route.sections;
const pack: JobPack = {
  ...full,
  route: { sections: [{ ...bores, stations: bores.stations.slice(0, 2) }], total: 2 },
};
const [A, B] = pack.route.sections[0].stations.map((s) => s.id);

const entry = () => screen.getByTestId("entry") as HTMLInputElement;
const note = () => screen.getByTestId("entry-note").textContent ?? "";
const station = () => screen.getByTestId("where").getAttribute("data-station");

async function gaugeSends(text: string) {
  await act(async () => {
    fireEvent.change(entry(), { target: { value: text } });
    fireEvent.keyDown(entry(), { key: "Enter" });
  });
}
const enterAgain = () => act(async () => void fireEvent.keyDown(entry(), { key: "Enter" }));
const kept = async (db: BenchDb) => (await db.readings.toCollection().sortBy("takenAt")).map((r) => r.value);

describe("a correction at a station that already has a reading", () => {
  it("at the last open station is asked about first; the same figure again records it", async () => {
    const { db } = await mountBenchJob(pack);
    await gaugeSends("4.0302");
    await waitFor(() => expect(station()).toBe(B));
    await gaugeSends("4.0301"); // the last open station: the route stays here
    await waitFor(async () => expect(await kept(db)).toEqual([4.0302, 4.0301]));
    expect(station()).toBe(B);

    await gaugeSends("4.0304");
    expect(note()).toMatch(/already has 4\.0301 in.*Save again to record 4\.0304 in as a correction/);
    expect(screen.getByTestId("entry-note").getAttribute("role")).toBe("alert");
    expect(entry().value).toBe("4.0304"); // kept, and selected so a gauge's next figure replaces it
    await new Promise((r) => setTimeout(r, 50));
    expect(await kept(db)).toEqual([4.0302, 4.0301]);

    await enterAgain();
    await waitFor(async () => expect(await kept(db)).toEqual([4.0302, 4.0301, 4.0304]));
    const [, first, fix] = await db.readings.toCollection().sortBy("takenAt");
    expect(fix).toMatchObject({ stationId: B, supersedes: first.id });
    expect(note()).not.toMatch(/correction/);
  });

  it("after a jump back asks too; a different figure is asked about again, Clear keeps the reading", async () => {
    const { db } = await mountBenchJob(pack);
    await gaugeSends("4.0302");
    await waitFor(() => expect(station()).toBe(B));
    fireEvent.click(screen.getByRole("button", { name: "All stations" }));
    fireEvent.click(await screen.findByRole("button", { name: /1 top A/ }));
    await waitFor(() => expect(station()).toBe(A));
    await gaugeSends("4.0299");
    expect(note()).toMatch(/already has 4\.0302 in \(in spec\)/);
    await gaugeSends("4.0298");
    expect(note()).toMatch(/record 4\.0298 in as a correction/);
    fireEvent.click(screen.getByRole("button", { name: "Clear" }));
    expect(note()).not.toMatch(/correction/);
    await enterAgain();
    expect(await kept(db)).toEqual([4.0302]);
  });

  it("after Measure again, and for the confirming reading, records at once", async () => {
    const { db } = await mountBenchJob(pack);
    await gaugeSends("4.0302");
    await waitFor(() => expect(station()).toBe(B));
    fireEvent.click(screen.getByRole("button", { name: "Measure again" }));
    await waitFor(() => expect(station()).toBe(A));
    await gaugeSends("4.0303");
    await waitFor(async () => expect(await kept(db)).toEqual([4.0302, 4.0303]));
    await waitFor(() => expect(station()).toBe(B));
    await gaugeSends("4.0312"); // out of spec: the bench asks for a confirming reading
    await waitFor(async () => expect(await kept(db)).toHaveLength(3));
    await gaugeSends("4.0311");
    await waitFor(async () => expect(await kept(db)).toEqual([4.0302, 4.0303, 4.0312, 4.0311]));
    expect(note()).not.toMatch(/correction/);
  });
});
