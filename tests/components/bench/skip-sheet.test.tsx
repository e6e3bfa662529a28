// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { SkipSheet } from "@/components/bench/skip-sheet";

afterEach(cleanup);

describe("the skip sheet's own reason", () => {
  it("is counted as typed; one too long is refused in words and kept, never cut short", () => {
    const onSkip = vi.fn();
    render(<SkipSheet station="Cylinder 1 bore" onSkip={onSkip} onClose={() => {}} />);
    const reason = screen.getByRole("textbox", { name: "Another reason" }) as HTMLInputElement;
    const long = "Bore sleeved by the customer's other shop; ".repeat(7); // 301 characters with the end space
    fireEvent.change(reason, { target: { value: long } });
    expect(reason.value).toBe(long);
    expect(screen.getByText("300 of 255 characters")).toBeTruthy();
    fireEvent.click(screen.getByRole("button", { name: "Skip with this reason" }));
    expect(screen.getByRole("alert").textContent).toBe(
      "The skip reason is 300 characters long; shorten it to 255 or fewer",
    );
    expect(onSkip).not.toHaveBeenCalled();
    expect(reason.value).toBe(long);
    fireEvent.change(reason, { target: { value: "Bore sleeved by the customer's other shop" } });
    expect(screen.queryByRole("alert")).toBeNull();
    fireEvent.click(screen.getByRole("button", { name: "Skip with this reason" }));
    expect(onSkip).toHaveBeenCalledWith("Bore sleeved by the customer's other shop");
  });
});
