"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import { lockedJobWords } from "@/lib/domain";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { api } from "@/lib/client/api";
import type { FlagDetail as Detail } from "@/lib/schemas/flag";
import { DispositionForm } from "./disposition-form";
import { DecisionTag, ReasonTag } from "./flag-tags";
import { FlagHistory } from "./flag-history";
import { DecisionHistory, DerivedFed } from "./flag-record";
import { age, beyondLimit, deviationText, limitsText, when, withUnit } from "./format";

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="flex flex-col">
      <dt className="text-sm text-muted">{label}</dt>
      <dd className="tabular font-medium">{children}</dd>
    </div>
  );
}

function Summary({ d }: { d: Detail }) {
  const f = d.flag;
  const beyond = beyondLimit(f.value, f.limitMin, f.limitMax);
  return (
    <dl className="grid gap-4 rounded-tool border-2 border-rule bg-panel p-4 sm:grid-cols-2 lg:grid-cols-4">
      <Fact label="Value">{withUnit(f.value, f.unit)}</Fact>
      <Fact label="Limits">{limitsText(f.limitMin, f.limitMax, f.unit)}</Fact>
      <Fact label="From nominal">{deviationText(f.deviation, f.unit)}</Fact>
      <Fact label="Beyond the limit by">
        {beyond === null ? "inside the limits" : withUnit(Math.abs(beyond), f.unit)}
      </Fact>
      <Fact label="Gauge">
        {f.gauge ? `${f.gauge.label} · ${f.gauge.serial}` : f.derived ? "computed from readings" : "none recorded"}
      </Fact>
      <Fact label="Gauge calibration due">{f.gauge?.calibrationDue ?? "—"}</Fact>
      <Fact label="Taken">{f.takenBy ? `${f.takenBy} · ${when(f.takenAt)}` : "—"}</Fact>
      <Fact label="Age">
        {age(f.judgedAt)}, from {f.takenAt ? "the reading" : "when the computed value was flagged"}
        <span className="block text-sm text-muted">Flag raised {when(f.createdAt)}</span>
      </Fact>
    </dl>
  );
}

export function FlagDetailView({ flagId, canDecide }: { flagId: number; canDecide: boolean }) {
  const q = useQuery({ queryKey: ["flag", flagId], queryFn: () => api<Detail>(`/api/flags/${flagId}`) });
  if (q.isPending) return <p className="text-muted">Loading the flag…</p>;
  if (q.isError)
    return (
      <Notice tone="error" title="Could not load this flag">
        {q.error.message}
      </Notice>
    );
  const d = q.data;
  const f = d.flag;
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-2">
        <Link
          href={`/desk/flags?job=${d.job.id}`}
          className="no-print inline-flex min-h-11 items-center self-start text-sm text-steel underline"
        >
          ← Flags of job {d.job.code}
        </Link>
        <p className="font-mono text-sm text-muted">
          {d.job.code} · {d.job.title}
        </p>
        <h1 className="text-3xl font-semibold">{f.station}</h1>
        <p className="text-muted">
          {f.characteristicLabel}
          {f.derived ? " (computed value)" : ""}
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <VerdictBadge verdict={f.verdict} size="lg" />
          <ReasonTag reason={f.reason} />
          <DecisionTag state={f.state} disposition={f.disposition} operation={f.operation} />
        </div>
      </div>
      <Summary d={d} />
      {f.reason === "gauge_past_due" && (
        <Notice tone="caution" title="Read with a gauge past its calibration due date">
          The figure itself {f.verdict === "in_spec" ? "is within the limits" : "is outside or near the limits"}, but
          the gauge was overdue when it was taken, so it cannot be trusted as is. Measure again with a calibrated gauge,
          or accept with the reason (for example, checked against a setting master).
        </Notice>
      )}
      {f.state === "closed" && (
        <Notice title="Closed">
          Closed {when(f.closedAt)}
          {f.closedByReadingId
            ? " by a newer reading at the station (see the readings below)"
            : " when the limits changed and the value no longer needed attention"}
          . The decisions stay on record.
        </Notice>
      )}
      {f.state !== "closed" && d.job.locked && (
        <Notice title="Job locked">{lockedJobWords(d.job, "its decisions")}</Notice>
      )}
      <FlagHistory stations={d.stations} />
      <DerivedFed derived={d.derived} isDerived={f.derived} />
      <DecisionHistory entries={d.dispositions} />
      {canDecide && f.state !== "closed" && !d.job.locked && <DispositionForm flagId={f.id} />}
    </div>
  );
}
