"use client";

import { Notice } from "@/components/ui/notice";
import { Button } from "@/components/ui/button";
import type { StationView } from "@/lib/offline/route-status";

// Readings the server refused, each with the server's words and a way back to its station.
export function RefusedNotice({ views, onFix }: { views: StationView[]; onFix: (id: string) => void }) {
  return (
    <Notice
      tone="error"
      title={`${views.length} reading${views.length === 1 ? " was" : "s were"} refused by the server`}
    >
      <ul className="mt-1 flex flex-col gap-2">
        {views.map((v) => (
          <li key={v.station.id} className="flex flex-wrap items-center gap-3">
            <span>
              {v.station.label}: {v.current?.rejection?.reason}
            </span>
            <Button tone="quiet" onClick={() => onFix(v.station.id)}>
              Fix it
            </Button>
          </li>
        ))}
      </ul>
    </Notice>
  );
}
