"use client";

import { memo } from "react";
import { sectionCount, type SectionProgress } from "@/lib/offline/route-status";

// Progress per section, always in view; a tap jumps to the section's first open station.
export const SectionStrip = memo(function SectionStrip({
  sections,
  current,
  onPick,
  onAll,
}: {
  sections: SectionProgress[];
  current: string;
  onPick: (id: string) => void;
  onAll: () => void;
}) {
  return (
    <nav aria-label="Sections" className="flex gap-2 overflow-x-auto pb-1">
      <button
        type="button"
        onClick={onAll}
        className="min-h-16 shrink-0 rounded-tool bg-steel px-4 text-lg font-semibold text-steel-ink"
      >
        All stations
      </button>
      {sections.map((s) => {
        const complete = s.open === 0;
        return (
          <button
            key={s.id}
            type="button"
            onClick={() => onPick(s.id)}
            aria-current={s.id === current ? "step" : undefined}
            data-section={s.id}
            data-done={s.done}
            data-required={s.required}
            className={
              "flex min-h-16 shrink-0 flex-col items-start justify-center rounded-tool border-2 px-3 text-left " +
              "aria-[current=step]:border-steel aria-[current=step]:bg-panel " +
              (complete ? "border-pass" : "border-rule")
            }
          >
            <span className="text-sm font-semibold leading-tight">{s.label}</span>
            <span className="text-sm tabular text-muted">
              {sectionCount(s)}
              {complete ? " · done" : ""}
            </span>
          </button>
        );
      })}
    </nav>
  );
});
