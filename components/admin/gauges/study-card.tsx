import { StatusTag } from "@/components/admin/status-tag";
import { AnovaTable } from "@/components/gauge-studies/anova-table";
import { StudyHistogram } from "@/components/gauge-studies/histogram";
import { RunChart } from "@/components/gauge-studies/run-chart";
import { Type1Figures } from "@/components/gauge-studies/type1-figures";
import { withUnit } from "@/components/flags/format";
import type { GaugeStudyRecord } from "@/lib/schemas/gauge-studies";

// One kept study on the gauge's page: what it was, who took it, when it is due, whether it passed,
// and its figures and charts (a repeatability run) or its ANOVA table (an R&R study).
const KIND_WORDS = { type1: "Repeatability study", grr: "R&R study" } as const;

function Body({ study }: { study: GaugeStudyRecord }) {
  const { unit } = study;
  if (study.type1 && study.readings && study.reference) {
    const r = study.type1;
    return (
      <div className="flex flex-col gap-4">
        <p className="text-sm">
          Reference {withUnit(study.reference.value, unit)}, its U {withUnit(study.reference.expandedU, unit)} (k ={" "}
          {study.reference.coverageK}); gauge step {withUnit(study.resolution, unit)}.
        </p>
        <Type1Figures result={r} unit={unit} />
        <div className="flex flex-wrap gap-4">
          <RunChart
            readings={study.readings}
            reference={study.reference.value}
            unit={unit}
            characteristics={r.perCharacteristic}
            mean={r.mean}
          />
          <StudyHistogram
            readings={study.readings}
            reference={study.reference.value}
            resolution={study.resolution}
            unit={unit}
            mean={r.mean}
            sd={r.sd}
          />
        </div>
      </div>
    );
  }
  if (study.grr) {
    return (
      <div className="flex flex-col gap-3">
        {study.appraisers && <p className="text-sm">Appraisers: {study.appraisers.join(", ")}.</p>}
        {study.tolerance !== null && <p className="text-sm">Tolerance T = {withUnit(study.tolerance, unit)}.</p>}
        <AnovaTable result={study.grr} unit={unit} />
      </div>
    );
  }
  return <p className="text-sm text-muted">This study&apos;s figures are not on file.</p>;
}

export function StudyCard({ study, open }: { study: GaugeStudyRecord; open: boolean }) {
  return (
    <details open={open} className="rounded-tool border-2 border-rule bg-panel p-3" data-study={study.id}>
      <summary className="flex min-h-11 cursor-pointer flex-wrap items-center gap-x-3 gap-y-1">
        <span className="font-semibold">
          {KIND_WORDS[study.kind]} of {study.performedOn}
        </span>
        <StatusTag tone={study.passed ? "good" : "bad"}>{study.passed ? "Passed" : "Failed"}</StatusTag>
        <span className="text-sm text-muted">
          by {study.performedBy.name || "(unknown)"} · due again {study.summary.dueOn}
        </span>
      </summary>
      <div className="mt-3">
        <Body study={study} />
      </div>
    </details>
  );
}
