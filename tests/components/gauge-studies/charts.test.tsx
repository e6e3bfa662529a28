// @vitest-environment jsdom
import { cleanup, render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it } from "vitest";
import { StudyHistogram } from "@/components/gauge-studies/histogram";
import { RunChart } from "@/components/gauge-studies/run-chart";

// Invented demo readings of a 1.0000 in setting master on a 0.0001 in gauge.
const steps = [0, 1, -1, 0, 2, 0, -1, 1, 0, 0, -2, 1, 0, 1, -1, 0, 3, 0, -1, 0, 1, 0, -1, 2, 0];
const readings = steps.map((k) => Number((1 + k * 0.0001).toFixed(4)));
const bores = [
  { characteristic: "main_bearing_bore", tolerance: 0.002 },
  { characteristic: "bore_diameter", tolerance: 0.0015 },
];

afterEach(cleanup);

describe("RunChart", () => {
  it("draws one marker per reading and the ±0.1 T band of the tightest tolerance", () => {
    const { container } = render(
      <RunChart readings={readings} reference={1} unit="in" characteristics={bores} mean={1.00002} />,
    );
    const text = screen.getByTestId("study-run-chart").textContent;
    expect(container.querySelectorAll(".recharts-line-dots circle")).toHaveLength(25);
    // Tightest T = 0.0015 in, so the band is ±0.00015 in: the readings at −2, +2, +2 and +3 steps lie outside.
    expect(text).toMatch(/±0\.00015 in for Cylinder bore diameter \(T = 0\.0015 in, the tightest it judges\)/);
    expect(text).toMatch(/4 readings outside\./);
    expect(text).toMatch(/25 readings of a reference of 1\.0000 in; mean 1\.00002 in/);
    expect(container.querySelectorAll(".recharts-reference-line")).toHaveLength(4);
  });

  it("says so when no tolerance is known and draws no band or mean without them", () => {
    const { container } = render(<RunChart readings={readings} reference={1} unit="in" />);
    expect(screen.getByTestId("study-run-chart").textContent).toMatch(/No tolerance given, so no ±0\.1 T band\./);
    expect(container.querySelectorAll(".recharts-reference-line")).toHaveLength(1);
  });

  it("shows an empty frame before the first reading", () => {
    render(<RunChart readings={[]} reference={1} unit="mm" />);
    expect(screen.getByText("No readings yet")).toBeTruthy();
  });
});

describe("StudyHistogram", () => {
  it("draws a bar per bin and marks the reference's bin", () => {
    const { container } = render(
      <StudyHistogram readings={readings} reference={1} resolution={0.0001} unit="in" mean={1.00002} sd={0.00011} />,
    );
    expect(container.querySelectorAll(".recharts-bar-rectangle")).toHaveLength(6);
    const text = screen.getByTestId("study-histogram").textContent;
    expect(text).toMatch(/Readings per bin of 0\.0001 in/);
    expect(text).toMatch(/Solid line: the bin holding the reference\./);
    expect(text).toMatch(/Dashed curve/);
    expect(container.querySelector(".recharts-line")).not.toBeNull();
  });

  it("draws no curve without the core's s", () => {
    const { container } = render(<StudyHistogram readings={readings} reference={1} resolution={0.0001} unit="in" />);
    expect(screen.getByTestId("study-histogram").textContent).not.toMatch(/Dashed curve/);
    expect(container.querySelector(".recharts-line")).toBeNull();
  });
});
