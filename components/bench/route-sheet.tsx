"use client";

import { sectionCount, type SectionProgress, type StationView } from "@/lib/offline/route-status";
import { STATE_TONE, STATE_WORDS, StateShape } from "./station-state";

// Every station of the job, by section, to jump to any of them. Big tiles (≥ 64 px), each with
// its state in a word and a shape.
function shortName(v: StationView): string {
  return v.station.id.split("/").slice(1).join(" ") || v.station.label;
}

export function RouteSheet({
  sections,
  views,
  current,
  onPick,
  onClose,
}: {
  sections: SectionProgress[];
  views: StationView[];
  current: string;
  onPick: (id: string) => void;
  onClose: () => void;
}) {
  return (
    <div
      role="dialog"
      aria-modal="true"
      aria-label="All stations"
      className="fixed inset-0 z-40 flex flex-col bg-paper"
    >
      <div className="flex items-center justify-between gap-3 border-b-2 border-rule px-4 py-3">
        <h2 className="text-2xl font-bold">All stations</h2>
        <button
          type="button"
          onClick={onClose}
          className="min-h-16 rounded-tool bg-steel px-6 text-lg font-semibold text-steel-ink"
        >
          Close
        </button>
      </div>
      <div className="flex-1 overflow-y-auto px-4 py-4">
        {sections.map((s) => (
          <section key={s.id} className="mb-6">
            <h3 className="mb-2 text-lg font-semibold">
              {s.label} <span className="text-muted">· {sectionCount(s)}</span>
            </h3>
            <ul className="grid grid-cols-[repeat(auto-fill,minmax(7.5rem,1fr))] gap-3">
              {views
                .filter((v) => v.station.section === s.id)
                .map((v) => (
                  <li key={v.station.id}>
                    <button
                      type="button"
                      onClick={() => onPick(v.station.id)}
                      aria-current={v.station.id === current ? "location" : undefined}
                      title={v.station.label}
                      data-station={v.station.id}
                      className={
                        "flex min-h-16 w-full flex-col items-start justify-center gap-0.5 rounded-tool border-2 " +
                        "px-3 py-1 text-left aria-[current=location]:outline aria-[current=location]:outline-4 " +
                        "aria-[current=location]:outline-steel " +
                        STATE_TONE[v.state]
                      }
                    >
                      <span className="font-semibold text-ink">{shortName(v)}</span>
                      <span className="inline-flex items-center gap-1 text-sm font-semibold">
                        <StateShape state={v.state} size={12} />
                        {STATE_WORDS[v.state]}
                      </span>
                    </button>
                  </li>
                ))}
            </ul>
          </section>
        ))}
      </div>
    </div>
  );
}
