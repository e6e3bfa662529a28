// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { BearingsPage } from "@/components/desk/bearings-page";
import type { BearingsView, PointView } from "@/lib/schemas/bearings";

// The lead's bearing page keeps the maker's grade marks of each point (the codes a grade table
// reads): they are shown as saved, typed beside the housing bore, and sent back when the housing
// bores are saved, so saving a bore never wipes a mark. Invented demo figures.
const point = (over: Partial<PointView>): PointView => ({
  point: "main/1",
  label: "Main 1",
  role: "main",
  journalPart: "main/1",
  journal: null,
  housingBore: 2.6405,
  housingGaugeId: null,
  thrust: false,
  housingCode: null,
  journalCode: null,
  window: null,
  upperShellId: null,
  lowerShellId: null,
  byHand: false,
  predicted: null,
  measured: null,
  ...over,
});
const view: BearingsView = {
  job: { id: 7, code: "KF-7", title: "Test job", unit: "in", locked: false, status: "measuring" },
  shells: [],
  points: [point({ housingCode: "B", journalCode: "2" }), point({ point: "main/2", label: "Main 2" })],
  gauges: [],
};

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe("bearing grade marks on the lead's page", () => {
  it("shows the saved marks and sends every point's marks with the housing bores", async () => {
    const fetchMock = vi.fn(async () => new Response(JSON.stringify(view)));
    vi.stubGlobal("fetch", fetchMock);
    const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    render(
      <QueryClientProvider client={qc}>
        <BearingsPage jobId={7} />
      </QueryClientProvider>,
    );
    const housing1 = (await screen.findByLabelText("Housing mark", {
      selector: "#housing-mark-main\\/1",
    })) as HTMLInputElement;
    expect(housing1.value).toBe("B");
    const journal2 = screen.getByLabelText("Journal mark", { selector: "#journal-mark-main\\/2" });
    fireEvent.change(journal2, { target: { value: " 3 " } });
    fireEvent.click(screen.getByRole("button", { name: "Save housing bores" }));
    await waitFor(() => expect(fetchMock.mock.calls.some((c) => (c as unknown[])[1] !== undefined)).toBe(true));
    const put = fetchMock.mock.calls.find((c) => ((c as unknown[])[1] as RequestInit | undefined)?.method === "PUT");
    const sent = JSON.parse(((put as unknown[])[1] as RequestInit).body as string);
    expect(sent.points).toEqual([
      expect.objectContaining({ point: "main/1", housingBore: 2.6405, housingCode: "B", journalCode: "2" }),
      expect.objectContaining({ point: "main/2", housingCode: null, journalCode: "3" }),
    ]);
  });
});
