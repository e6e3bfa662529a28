// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen } from "@testing-library/react";
import { useState } from "react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { applyKey, Keypad } from "@/components/bench/keypad";

afterEach(cleanup);

function Harness({ onEnter = () => {} }: { onEnter?: () => void }) {
  const [v, setV] = useState("");
  return (
    <>
      <output data-testid="value">{v}</output>
      <Keypad onKey={(k) => setV((d) => applyKey(d, k))} onEnter={onEnter} />
    </>
  );
}

const tap = (name: string) => fireEvent.click(screen.getByRole("button", { name }));

describe("glove keypad", () => {
  it("builds a value from taps: digits, point, sign, delete, clear", () => {
    render(<Harness />);
    for (const k of ["4", "Decimal point", "0", "3", "0", "2"]) tap(k);
    expect(screen.getByTestId("value").textContent).toBe("4.0302");
    tap("Decimal point");
    expect(screen.getByTestId("value").textContent).toBe("4.0302");
    tap("Delete last");
    expect(screen.getByTestId("value").textContent).toBe("4.030");
    tap("Plus or minus");
    expect(screen.getByTestId("value").textContent).toBe("-4.030");
    tap("Plus or minus");
    expect(screen.getByTestId("value").textContent).toBe("4.030");
    tap("Clear");
    expect(screen.getByTestId("value").textContent).toBe("");
  });

  it("Save calls the entry action; every key is a big target and a key press never takes the focus", () => {
    const onEnter = vi.fn();
    render(<Harness onEnter={onEnter} />);
    fireEvent.click(screen.getByRole("button", { name: "Save" }));
    expect(onEnter).toHaveBeenCalledTimes(1);
    const keys = screen.getAllByRole("button");
    expect(keys).toHaveLength(15);
    for (const k of keys) {
      expect(k.className).toMatch(/min-h-16/); // 4rem = 64 CSS px, the glove target
      expect(fireEvent.pointerDown(k)).toBe(false); // default prevented: the entry field keeps the focus
    }
  });

  it("caps a runaway value and ignores a second decimal point", () => {
    expect(applyKey("1234567890.12", "3")).toBe("1234567890.12");
    expect(applyKey("4.03", ".")).toBe("4.03");
    expect(applyKey("", "sign")).toBe("-");
  });
});
