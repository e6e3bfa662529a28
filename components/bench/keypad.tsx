"use client";

import { memo, type PointerEvent } from "react";

// The glove keypad: every key at least 64 CSS px tall (and wider than tall) with 10 px between
// keys, no hover, no drag,
// no long-press. Keys never take the focus away from the entry field, so a gauge's keystrokes
// still land there after a tap.
export type PadKey = "0" | "1" | "2" | "3" | "4" | "5" | "6" | "7" | "8" | "9" | "." | "sign" | "back" | "clear";

const keepFocus = (e: PointerEvent) => e.preventDefault();

function Key({
  label,
  name,
  onPress,
  className = "",
}: {
  label: string;
  name: string;
  onPress: () => void;
  className?: string;
}) {
  return (
    <button
      type="button"
      aria-label={name}
      onPointerDown={keepFocus}
      onClick={onPress}
      className={
        "min-h-16 select-none rounded-tool border-2 border-rule bg-panel text-3xl font-semibold text-ink " +
        `active:bg-rule ${className}`
      }
    >
      {label}
    </button>
  );
}

export function applyKey(draft: string, key: PadKey): string {
  if (key === "clear") return "";
  if (key === "back") return draft.slice(0, -1);
  if (key === "sign") return draft.startsWith("-") ? draft.slice(1) : `-${draft.replace(/^\+/, "")}`;
  if (key === "." && draft.includes(".")) return draft;
  if (draft.replace(/^[+-]/, "").length >= 12) return draft;
  return draft + key;
}

export const Keypad = memo(function Keypad({
  onKey,
  onEnter,
  enterLabel = "Save",
  disabled = false,
}: {
  onKey: (k: PadKey) => void;
  onEnter: () => void;
  enterLabel?: string;
  disabled?: boolean;
}) {
  const digit = (d: PadKey) => <Key key={d} label={d} name={d} onPress={() => onKey(d)} />;
  return (
    <div className="grid grid-cols-4 gap-2.5" role="group" aria-label="Keypad" data-testid="keypad">
      {(["7", "8", "9"] as const).map(digit)}
      <Key label="⌫" name="Delete last" onPress={() => onKey("back")} className="text-2xl" />
      {(["4", "5", "6"] as const).map(digit)}
      <Key label="Clear" name="Clear" onPress={() => onKey("clear")} className="text-xl" />
      {(["1", "2", "3"] as const).map(digit)}
      <button
        type="button"
        onPointerDown={keepFocus}
        onClick={onEnter}
        disabled={disabled}
        className={
          "row-span-2 min-h-16 select-none rounded-tool bg-steel text-2xl font-bold text-steel-ink " +
          "active:brightness-90 disabled:opacity-50"
        }
      >
        {enterLabel}
      </button>
      <Key label="±" name="Plus or minus" onPress={() => onKey("sign")} />
      {digit("0")}
      <Key label="." name="Decimal point" onPress={() => onKey(".")} />
    </div>
  );
});
