// @vitest-environment jsdom
import { cleanup, render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it } from "vitest";
import { StudiesToDo } from "@/components/admin/gauges/studies-to-do";
import { studyState } from "@/components/admin/gauges/study-tag";
import type { LatestStudyLine } from "@/lib/schemas/gauge-study-overview";
import type { InstrumentRecord } from "@/lib/schemas/instrument";

afterEach(cleanup);

// Invented demo gauges and studies.
const line = (id: number, passed: boolean, dueOn: string): LatestStudyLine => ({
  instrumentId: id,
  passed,
  summary: { kind: "type1", performedOn: "2025-12-01", dueOn, repeatSd: 0.0001, bias: 0 },
});
const gauge = (id: number, label: string) => ({ id, label, serial: `S-${id}` }) as InstrumentRecord;

describe("studyState", () => {
  it("is none, passed, failed, or due from the day after the due date", () => {
    expect(studyState(undefined, "2026-12-03")).toBe("none");
    expect(studyState(line(1, true, "2026-12-03"), "2026-12-03")).toBe("passed");
    expect(studyState(line(1, false, "2027-01-01"), "2026-12-03")).toBe("failed");
    expect(studyState(line(1, true, "2026-12-02"), "2026-12-03")).toBe("due");
  });
});

describe("StudiesToDo", () => {
  it("lists the gauges whose study is due or failed, each linking to its page", () => {
    const latest = new Map([
      [1, line(1, true, "2020-01-01")],
      [2, line(2, false, "2099-01-01")],
      [3, line(3, true, "2099-01-01")],
    ]);
    render(
      <StudiesToDo
        gauges={[gauge(1, "Bore A"), gauge(2, "Mic B"), gauge(3, "Mic C"), gauge(4, "Feeler D")]}
        latest={latest}
      />,
    );
    const items = [...screen.getByTestId("studies-to-do").querySelectorAll("li")].map((li) => li.textContent);
    expect(items).toEqual([
      "Bore A (serial S-1): study due since 2020-01-01",
      "Mic B (serial S-2): its latest study failed",
    ]);
    expect(screen.getByRole("link", { name: "Bore A (serial S-1)" }).getAttribute("href")).toBe("/admin/gauges/1");
    expect(screen.getByText("2 gauges' study is due again or failed")).toBeTruthy();
  });

  it("shows nothing when every study stands", () => {
    const { container } = render(
      <StudiesToDo gauges={[gauge(3, "Mic C")]} latest={new Map([[3, line(3, true, "2099-01-01")]])} />,
    );
    expect(container.textContent).toBe("");
  });
});
