"use client";

import { memo } from "react";
import { COMMON_PRACTICE_WORDS, parseStationId, type EngineShape } from "@/lib/domain";
import type { StationView } from "@/lib/offline/route-status";
import { StationDiagram } from "./station-diagram";
import { StateTag } from "./station-state";

// Where am I: section, position in it, the station in words, a small drawing, and its state.
export const StationHeader = memo(function StationHeader({
  view,
  sectionLabel,
  index,
  of,
  shape,
  commonPractice,
}: {
  view: StationView;
  sectionLabel: string;
  index: number;
  of: number;
  shape: EngineShape;
  /** The station's limit is a starter sheet's typical figure (the lead has not replaced it). */
  commonPractice: boolean;
}) {
  const p = parseStationId(view.station.id);
  return (
    <section
      className="flex flex-col gap-1.5"
      aria-label="Where you are"
      data-testid="where"
      data-station={view.station.id}
    >
      <p className="flex flex-wrap items-center gap-x-3 text-base font-semibold text-muted">
        <span>{sectionLabel}</span>
        <span>
          station {index} of {of}
        </span>
        <StateTag state={view.state} />
      </p>
      <h2 className="text-2xl font-bold leading-tight">{view.station.label}</h2>
      {commonPractice && (
        <p className="rounded-tool border-l-4 border-watch bg-watch-soft p-2 text-sm" data-testid="common-practice">
          Limit: {COMMON_PRACTICE_WORDS}
        </p>
      )}
      {view.revisit && (
        <p className="rounded-tool border-l-4 border-brass bg-watch-soft p-2 text-base font-semibold">
          Sent back by the lead:{" "}
          {view.revisit.disposition === "machine_again"
            ? `machine again${view.revisit.operation ? ` (${view.revisit.operation})` : ""}, then measure`
            : "measure again"}
          {view.revisit.dispositionReason ? ` · “${view.revisit.dispositionReason}”` : ""}
        </p>
      )}
      {view.current?.state === "rejected" && view.current.rejection && (
        <p
          className="rounded-tool border-l-4 border-fail bg-fail-soft p-2 text-base font-semibold text-fail"
          role="alert"
        >
          The server refused this reading: {view.current.rejection.reason}. Enter the corrected value and Save to send
          it again.
        </p>
      )}
      <StationDiagram p={p} shape={shape} />
    </section>
  );
});
