// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { PlanEditor } from "@/components/desk/plan-editor";
import type { BuildPlanView } from "@/lib/schemas/build-plan";

// The build plan warns, before saving, when the parts do not fit, and saving then asks once more.
// Stack-up (common practice): deck clearance = deck height − stroke/2 − rod length − compression
// height = 9.025 − 1.74 − 5.7 − 1.6 = −0.015 in, the piston 0.015 in (0.381 mm) out of the hole.
const plan = (over: Record<string, unknown> = {}) => ({
  format: "tenthwise.build-plan",
  version: 1,
  lengthUnit: "in",
  volumeUnit: "cc",
  bore: 4.03,
  stroke: 3.48,
  rodLength: 5.7,
  compressionHeight: 1.6,
  deckHeight: 9.025,
  pistonTop: "dish",
  pistonVolumeCc: 5,
  chamberCc: 64,
  gasketBore: 4.1,
  gasketThickness: 0.04,
  notes: "",
  ...over,
});
const view = (p: Record<string, unknown>): BuildPlanView =>
  ({
    plan: p,
    job: { id: 3, code: "KF-3", title: "Test", unitSystem: "in", locked: false },
    engine: { cylinders: 8, nominalBore: 4, nominalStroke: 3.48, description: "Test V8" },
  }) as unknown as BuildPlanView;

function mount(p: Record<string, unknown>) {
  const fetchMock = vi.fn(async (_url: string, init?: RequestInit) =>
    Response.json(init?.method === "PUT" ? view(JSON.parse(String(init.body))) : view(p)),
  );
  vi.stubGlobal("fetch", fetchMock);
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={qc}>
      <PlanEditor jobId={3} />
    </QueryClientProvider>,
  );
  return fetchMock;
}
const puts = (m: ReturnType<typeof mount>) => m.mock.calls.filter(([, init]) => init?.method === "PUT");

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe("the build plan's fit warning", () => {
  it("shows why the parts do not fit, asks once more on save, and saves only when told", async () => {
    const fetchMock = mount(plan());
    const warnings = await screen.findByTestId("plan-fit-warnings");
    expect(warnings.textContent).toMatch(/piston stands 0.015 in above the deck/);
    expect(warnings.textContent).toMatch(/Piston-to-head clearance is only 0.025 in/);
    fireEvent.click(screen.getByRole("button", { name: "Save plan" }));
    await screen.findByRole("heading", { name: "Save a plan whose parts do not fit?" });
    expect(puts(fetchMock)).toHaveLength(0);
    fireEvent.click(screen.getByRole("button", { name: "Save anyway" }));
    await waitFor(() => expect(puts(fetchMock)).toHaveLength(1));
  });

  it("saves a plan that fits at once; a flat head (0 cc chamber) is accepted", async () => {
    const fetchMock = mount(plan({ compressionHeight: 1.56, chamberCc: 0, pistonVolumeCc: 60 }));
    await screen.findByRole("button", { name: "Save plan" });
    expect(screen.queryByTestId("plan-fit-warnings")).toBeNull();
    fireEvent.click(screen.getByRole("button", { name: "Save plan" }));
    await waitFor(() => expect(puts(fetchMock)).toHaveLength(1));
    expect(JSON.parse(String(puts(fetchMock)[0][1]!.body)).chamberCc).toBe(0);
  });
});
