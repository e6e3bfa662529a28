"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api } from "@/lib/client/api";
import type { LatestStudyLine } from "@/lib/schemas/gauge-study-overview";
import { DUE_SOON_DAYS, type InstrumentRecord } from "@/lib/schemas/instrument";
import { GaugeForm } from "./gauge-form";
import { GaugeRow } from "./gauge-row";
import { StudiesToDo } from "./studies-to-do";
import { StudySettingsForm } from "./study-settings-form";

type Editing = { mode: "new" } | { mode: "edit"; gauge: InstrumentRecord } | null;

export function GaugeAdmin({ canEdit }: { canEdit: boolean }) {
  const [editing, setEditing] = useState<Editing>(null);
  const [showAll, setShowAll] = useState(false);
  const gauges = useQuery({
    queryKey: ["instruments", showAll ? "all" : "active"],
    queryFn: () => api<{ instruments: InstrumentRecord[] }>(`/api/instruments${showAll ? "?include=all" : ""}`),
  });
  const studies = useQuery({
    queryKey: ["gauge-studies", "latest"],
    queryFn: () => api<{ studies: LatestStudyLine[] }>("/api/gauge-studies/latest"),
  });
  const latest = new Map((studies.data?.studies ?? []).map((l) => [l.instrumentId, l]));
  const list = gauges.data?.instruments ?? [];
  const pastDue = list.filter((g) => g.active && g.status === "past_due").length;
  return (
    <div className="flex flex-col gap-5">
      {canEdit && !editing && (
        <div className="no-print">
          <Button onClick={() => setEditing({ mode: "new" })}>Register a gauge</Button>
        </div>
      )}
      {editing && (
        <GaugeForm
          key={editing.mode === "edit" ? editing.gauge.id : "new"}
          gauge={editing.mode === "edit" ? editing.gauge : undefined}
          onDone={() => setEditing(null)}
        />
      )}
      {pastDue > 0 && (
        <Notice
          tone="caution"
          title={`${pastDue} gauge${pastDue === 1 ? " is" : "s are"} past the calibration due date`}
        >
          Readings taken with a gauge past due are flagged for the lead. Send it for calibration, then enter the new
          dates and certificate.
        </Notice>
      )}
      <StudiesToDo gauges={list.filter((g) => g.active)} latest={latest} />
      <label className="no-print flex min-h-11 items-center gap-2 text-sm">
        <input type="checkbox" checked={showAll} onChange={(e) => setShowAll(e.target.checked)} className="h-5 w-5" />
        Show deactivated gauges too
      </label>
      <section aria-label="Gauges" className="overflow-x-auto rounded-tool border-2 border-rule bg-panel">
        {gauges.isPending && <p className="p-4 text-muted">Loading gauges…</p>}
        {gauges.isError && (
          <div className="p-4">
            <Notice tone="error" title="Could not load the gauges">
              {gauges.error.message}
            </Notice>
          </div>
        )}
        {gauges.data && list.length === 0 && (
          <p className="p-4 text-muted">No gauges registered yet.{canEdit ? " Register the first one above." : ""}</p>
        )}
        {list.length > 0 && (
          <table className="w-full text-left">
            <thead className="bg-paper text-sm text-muted">
              <tr>
                <th className="p-3 font-semibold">Gauge</th>
                <th className="p-3 font-semibold">Resolution and U</th>
                <th className="p-3 font-semibold">Calibration</th>
                <th className="p-3 font-semibold">Status</th>
                <th className="p-3 font-semibold">Certificate</th>
                {canEdit && <th className="no-print p-3 font-semibold">Actions</th>}
              </tr>
            </thead>
            <tbody>
              {list.map((g) => (
                <GaugeRow
                  key={g.id}
                  gauge={g}
                  study={latest.get(g.id)}
                  canEdit={canEdit}
                  onEdit={() => setEditing({ mode: "edit", gauge: g })}
                />
              ))}
            </tbody>
          </table>
        )}
      </section>
      <p className="text-sm text-muted">
        Status: in calibration; due within {DUE_SOON_DAYS} days (the tablet warns too); past due from the day after the
        due date. U (k = 2) widens the marginal band of every verdict taken with the gauge; with a study, the
        gauge&apos;s page shows how its repeatability and step join the certificate&apos;s U.
      </p>
      <StudySettingsForm canEdit={canEdit} />
    </div>
  );
}
