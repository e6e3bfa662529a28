"use client";

import { memo } from "react";
import { FastenerCaution } from "@/components/ui/notice";
import { LUBRICANT_LABELS, type Lubricant } from "@/lib/domain";

// Torque figures mean nothing without the lubricant (it changes the preload a torque gives), so
// the lubricant is picked before a torque is saved, with the fastener caution beside it.
export const LubricantPicker = memo(function LubricantPicker({
  value,
  onPick,
}: {
  value?: string;
  onPick: (l: Lubricant) => void;
}) {
  return (
    <div className="flex flex-col gap-2">
      <FastenerCaution />
      <p className="font-semibold">Lubricant on the threads and under the head</p>
      <div className="grid grid-cols-2 gap-2">
        {(Object.keys(LUBRICANT_LABELS) as Lubricant[]).map((l) => (
          <button
            key={l}
            type="button"
            onClick={() => onPick(l)}
            aria-pressed={value === l}
            className={
              "min-h-16 rounded-tool border-2 border-rule bg-panel px-3 text-left font-semibold " +
              "aria-pressed:border-steel aria-pressed:bg-steel aria-pressed:text-steel-ink"
            }
          >
            {LUBRICANT_LABELS[l]}
          </button>
        ))}
      </div>
    </div>
  );
});
