"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { StatusTag } from "@/components/admin/status-tag";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/client/api";
import { gaugeRangeWords, instrumentKindWords, unitWords } from "@/lib/domain";
import type { LatestStudyLine } from "@/lib/schemas/gauge-study-overview";
import type { InstrumentRecord } from "@/lib/schemas/instrument";
import { CalibrationTag } from "./calibration-tag";
import { StudyTag, studyState } from "./study-tag";
import { CertificateCell } from "./certificate-upload";

export function GaugeRow({
  gauge,
  study,
  canEdit,
  onEdit,
}: {
  gauge: InstrumentRecord;
  study: LatestStudyLine | undefined;
  canEdit: boolean;
  onEdit: () => void;
}) {
  const qc = useQueryClient();
  const [error, setError] = useState<string | null>(null);
  const [confirm, setConfirm] = useState(false);
  const toggle = useMutation({
    mutationFn: (active: boolean) => api(`/api/instruments/${gauge.id}`, { method: "PATCH", json: { active } }),
    onSuccess: () => {
      setConfirm(false);
      setError(null);
      void qc.invalidateQueries({ queryKey: ["instruments"] });
    },
    onError: (err) => setError(err instanceof ApiError ? err.message : "Could not reach the server; try again."),
  });
  const unit = unitWords(gauge.unit);
  const kind = instrumentKindWords(gauge.kind);
  return (
    <tr
      className={`border-t-2 border-rule align-top ${gauge.active ? "" : "text-muted"}`}
      data-testid={`gauge-${gauge.serial}`}
    >
      <td className="p-3">
        <Link
          href={`/admin/gauges/${gauge.id}`}
          className="inline-flex min-h-11 items-center font-semibold text-steel underline"
        >
          {gauge.label}
        </Link>
        <div className="text-sm">
          {kind} · serial <span className="font-mono">{gauge.serial}</span>
        </div>
        {gauge.kind === "bore_gauge_dial" && (
          <div className="text-xs">
            {gauge.dialPlusMeansSmaller ? "Plus on the dial = smaller bore" : "Plus on the dial = larger bore"}
          </div>
        )}
      </td>
      <td className="whitespace-nowrap p-3 text-sm tabular">
        <div>
          Resolution {gauge.resolution} {unit}
        </div>
        <div>
          U = {gauge.expandedU} {unit} (k = {gauge.coverageK})
        </div>
        {gauge.rangeMin !== null ? (
          <div>Measures {gaugeRangeWords(gauge)}</div>
        ) : (
          <div className="font-semibold text-fail">No measuring range on file: edit to add it</div>
        )}
      </td>
      <td className="whitespace-nowrap p-3 text-sm tabular">
        <div>Calibrated {gauge.calibratedOn}</div>
        <div className="font-semibold text-ink">Due {gauge.calibrationDue}</div>
        <div className="mt-1">{study ? `Study due ${study.summary.dueOn}` : "No study"}</div>
      </td>
      <td className="p-3">
        {gauge.active ? (
          <span className="flex flex-col items-start gap-2">
            <CalibrationTag status={gauge.status} daysLeft={gauge.daysLeft} />
            <StudyTag state={studyState(study, new Date().toISOString().slice(0, 10))} />
          </span>
        ) : (
          <StatusTag tone="off">Deactivated</StatusTag>
        )}
      </td>
      <td className="p-3">
        <CertificateCell gauge={gauge} canEdit={canEdit && gauge.active} />
      </td>
      {canEdit && (
        <td className="no-print p-3">
          <div className="flex flex-wrap gap-2">
            {gauge.active && !confirm && (
              <Button tone="quiet" onClick={onEdit}>
                Edit
              </Button>
            )}
            {gauge.active && !confirm && (
              <Button tone="quiet" onClick={() => setConfirm(true)}>
                Deactivate
              </Button>
            )}
            {!gauge.active && (
              <Button tone="quiet" disabled={toggle.isPending} onClick={() => toggle.mutate(true)}>
                Reactivate
              </Button>
            )}
            {confirm && (
              <>
                <Button tone="danger" disabled={toggle.isPending} onClick={() => toggle.mutate(false)}>
                  Yes, take it out of use
                </Button>
                <Button tone="quiet" onClick={() => setConfirm(false)}>
                  Cancel
                </Button>
              </>
            )}
          </div>
          {confirm && <p className="mt-1 text-sm">The tablet stops offering it; readings already taken keep it.</p>}
          {error && (
            <p role="alert" className="mt-1 text-sm font-medium text-fail">
              {error}
            </p>
          )}
        </td>
      )}
    </tr>
  );
}
