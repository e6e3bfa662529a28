"use client";

import { REASON_WORDS } from "@/lib/schemas/flag";
import type { FlagListQuery } from "@/lib/schemas/flag";
import { VERDICT_WORDS, VERDICTS } from "@/lib/domain";
import { FLAG_REASONS } from "@/lib/schemas/enums";

export type JobOption = { id: number; code: string; title: string };
type Filters = Pick<FlagListQuery, "state" | "job" | "verdict" | "reason">;

const STATE_CHOICES: [Filters["state"], string][] = [
  ["active", "Open and decided (not closed)"],
  ["open", "Open: needs a decision"],
  ["disposed", "Decided, not closed yet"],
  ["closed", "Closed"],
  ["all", "All flags"],
];

const field = "min-h-11 rounded-tool border-2 border-rule bg-paper px-2";

export function FlagFilters({
  value,
  jobs,
  onChange,
}: {
  value: Filters;
  jobs: JobOption[];
  onChange: (next: Partial<Filters>) => void;
}) {
  return (
    <div className="no-print flex flex-wrap items-end gap-3" role="group" aria-label="Filters">
      <label className="flex flex-col gap-1 text-sm font-medium">
        State
        <select
          className={field}
          value={value.state}
          onChange={(e) => onChange({ state: e.target.value as Filters["state"] })}
        >
          {STATE_CHOICES.map(([v, w]) => (
            <option key={v} value={v}>
              {w}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Job
        <select
          className={field}
          value={value.job ?? ""}
          onChange={(e) => onChange({ job: e.target.value ? Number(e.target.value) : undefined })}
        >
          <option value="">Every job</option>
          {jobs.map((j) => (
            <option key={j.id} value={j.id}>
              {j.code} · {j.title}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Verdict
        <select
          className={field}
          value={value.verdict ?? ""}
          onChange={(e) => onChange({ verdict: (e.target.value || undefined) as Filters["verdict"] })}
        >
          <option value="">Any verdict</option>
          {[...VERDICTS].reverse().map((v) => (
            <option key={v} value={v}>
              {VERDICT_WORDS[v]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Reason
        <select
          className={field}
          value={value.reason ?? ""}
          onChange={(e) => onChange({ reason: (e.target.value || undefined) as Filters["reason"] })}
        >
          <option value="">Any reason</option>
          {FLAG_REASONS.map((r) => (
            <option key={r} value={r}>
              {REASON_WORDS[r]}
            </option>
          ))}
        </select>
      </label>
    </div>
  );
}
