"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { CalibrationTag } from "@/components/admin/gauges/calibration-tag";
import { StudyTag, studyState } from "@/components/admin/gauges/study-tag";
import { BudgetTable } from "@/components/gauge-studies/budget-table";
import { Notice } from "@/components/ui/notice";
import { api } from "@/lib/client/api";
import { gaugeBudget, instrumentKindWords } from "@/lib/domain";
import type { GaugeStudyRecord } from "@/lib/schemas/gauge-studies";
import type { InstrumentRecord } from "@/lib/schemas/instrument";
import { SettingMasterForm } from "./setting-master-form";
import { StudyCard } from "./study-card";

// A gauge's own page: calibration and study dates side by side, the uncertainty budget its verdicts
// use (the core's, from the certificate, the latest study and the step), and every study it has had.
const today = () => new Date().toISOString().slice(0, 10);

function Dates({ gauge, latest }: { gauge: InstrumentRecord; latest: GaugeStudyRecord | undefined }) {
  const line = latest && { instrumentId: gauge.id, passed: latest.passed, summary: latest.summary };
  return (
    <dl className="grid grid-cols-[auto_1fr] items-center gap-x-4 gap-y-2 text-sm sm:grid-cols-[auto_auto_auto_1fr]">
      <dt className="text-muted">Calibrated</dt>
      <dd className="tabular">{gauge.calibratedOn || "—"}</dd>
      <dt className="text-muted">Calibration due</dt>
      <dd className="flex flex-wrap items-center gap-2 tabular">
        {gauge.calibrationDue || "—"} <CalibrationTag status={gauge.status} daysLeft={gauge.daysLeft} />
      </dd>
      <dt className="text-muted">Latest study</dt>
      <dd className="tabular">{latest ? latest.performedOn : "none yet"}</dd>
      <dt className="text-muted">Study due</dt>
      <dd className="flex flex-wrap items-center gap-2 tabular" data-testid="study-due">
        {latest ? latest.summary.dueOn : "—"} <StudyTag state={studyState(line, today())} />
      </dd>
    </dl>
  );
}

export function GaugeStudiesPage({ gaugeId, canEdit }: { gaugeId: number; canEdit: boolean }) {
  const gauge = useQuery({
    queryKey: ["instrument", gaugeId],
    queryFn: () => api<{ instrument: InstrumentRecord }>(`/api/instruments/${gaugeId}`),
  });
  const studies = useQuery({
    queryKey: ["gauge-studies", gaugeId],
    queryFn: () => api<{ studies: GaugeStudyRecord[] }>(`/api/gauges/${gaugeId}/studies`),
  });
  const error = gauge.error ?? studies.error;
  if (error)
    return (
      <Notice tone="error" title="Could not load this gauge">
        {error.message}
      </Notice>
    );
  if (!gauge.data || !studies.data) return <p className="text-muted">Loading the gauge…</p>;
  const g = gauge.data.instrument;
  const list = studies.data.studies;
  const latest = list[0];
  const budget = gaugeBudget({
    expandedU: g.expandedU,
    coverageK: g.coverageK,
    resolution: g.resolution,
    study: latest?.summary ?? null,
  });
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-semibold">{g.label}</h1>
        <p className="text-muted">
          {instrumentKindWords(g.kind)} · serial <span className="font-mono">{g.serial}</span> ·{" "}
          <Link href="/admin/gauges" className="inline-flex min-h-11 items-center text-steel underline">
            All gauges
          </Link>
        </p>
      </div>
      <Dates gauge={g} latest={latest} />
      <section className="max-w-3xl rounded-tool border-2 border-rule bg-panel p-4">
        <BudgetTable
          budget={budget}
          unit={g.unit}
          certificate={{ expandedU: g.expandedU, coverageK: g.coverageK }}
          resolution={g.resolution}
          study={latest?.summary ?? null}
        />
      </section>
      <SettingMasterForm key={g.id} gauge={g} canEdit={canEdit} />
      <section aria-labelledby="studies-h" className="flex flex-col gap-3">
        <h2 id="studies-h" className="text-xl font-semibold">
          Studies ({list.length})
        </h2>
        {list.length === 0 && (
          <p className="text-muted">
            No study yet. Run one on the tablet (Studies): 25 to 50 readings of a setting master, or an R&amp;R study.
          </p>
        )}
        {list.map((s, i) => (
          <StudyCard key={s.id} study={s} open={i === 0} />
        ))}
      </section>
    </div>
  );
}
