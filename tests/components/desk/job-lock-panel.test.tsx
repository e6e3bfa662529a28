// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { JobLockPanel } from "@/components/desk/job-lock-panel";
import type { JobDetail } from "@/lib/schemas/job";

// The job page's lock panel: the core's words about what lifts the lock, and for a lead the same
// reopen form (and route) as the release page. Rule of this product (lib/domain/reopen.ts).
const job = (over: Partial<JobDetail["job"]> = {}) =>
  ({
    job: {
      id: 7,
      code: "KF-7",
      title: "Test job",
      status: "released",
      unitSystem: "in",
      locked: true,
      lockedAt: "2026-12-01T09:00:00.000Z",
      hasStandingRelease: true,
      ...over,
    },
  }) as unknown as JobDetail;

function mount(d: JobDetail, role: string) {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={qc}>
      <JobLockPanel d={d} role={role} />
    </QueryClientProvider>,
  );
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe("JobLockPanel", () => {
  it("offers a lead the reopen of a released job and posts it to the release's reopen route", async () => {
    const fetchMock = vi.fn(async () => new Response(JSON.stringify({ release: { id: 1, status: "void" } })));
    vi.stubGlobal("fetch", fetchMock);
    const { container } = mount(job(), "lead");
    expect(container.textContent).toMatch(/Job KF-7 is released: its readings, limits, plan and details cannot change/);
    expect(container.textContent).toMatch(
      /Only a lead can reopen it, with a reason, from the job page or the release page/,
    );
    expect(screen.getByRole("link", { name: "Open the release page" }).getAttribute("href")).toBe("/release/7");
    fireEvent.change(screen.getByLabelText("Why is the job reopened?"), {
      target: { value: "Rod bearing clearance to be checked again" },
    });
    fireEvent.click(screen.getByRole("button", { name: "Reopen and void the release" }));
    await waitFor(() => expect(fetchMock).toHaveBeenCalled());
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe("/api/release/7/reopen");
    expect(init.method).toBe("POST");
    expect(JSON.parse(String(init.body))).toEqual({ reason: "Rod bearing clearance to be checked again" });
  });

  it("shows the admin why the job is locked, with no reopen form", () => {
    mount(job(), "admin");
    expect(screen.getByText(/Only a lead can reopen it/)).toBeTruthy();
    expect(screen.queryByRole("button", { name: "Reopen and void the release" })).toBeNull();
  });

  it("says a closed job is final and offers no reopen, even to a lead", () => {
    const { container } = mount(job({ status: "closed", hasStandingRelease: false }), "lead");
    expect(container.textContent).toMatch(/Job KF-7 is closed: .* A closed job is final and is not reopened\./);
    expect(screen.queryByRole("button", { name: "Reopen and void the release" })).toBeNull();
  });

  it("draws nothing for a job that is not locked", () => {
    const { container } = mount(job({ status: "measuring", locked: false, lockedAt: null }), "lead");
    expect(container.textContent).toBe("");
  });
});
