"use client";

import type { AuditFacets } from "@/lib/schemas/audit";

// The audit filters. Every value lives in the page's URL, so a filtered view can be shared.
export type Filters = Record<"job" | "user" | "action" | "entity" | "from" | "to", string>;
export const FILTER_KEYS = ["job", "user", "action", "entity", "from", "to"] as const;

const box = "min-h-11 rounded-tool border-2 border-rule bg-paper px-2";

function Pick({
  label,
  value,
  onChange,
  options,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  options: { value: string; label: string }[];
}) {
  return (
    <label className="flex flex-col gap-1 text-sm font-medium">
      {label}
      <select className={box} value={value} onChange={(e) => onChange(e.target.value)}>
        <option value="">Any</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}

export function AuditFilters({
  facets,
  value,
  onChange,
  error,
}: {
  facets?: AuditFacets;
  value: Filters;
  onChange: (f: Filters) => void;
  error?: Record<string, string[]>;
}) {
  const set = (k: keyof Filters) => (v: string) => onChange({ ...value, [k]: v });
  const f = facets ?? { jobs: [], users: [], actions: [], entities: [] };
  return (
    <form
      className="grid gap-3 rounded-tool border-2 border-rule bg-panel p-4 sm:grid-cols-3 lg:grid-cols-6"
      onSubmit={(e) => e.preventDefault()}
      aria-label="Filter the audit trail"
    >
      <Pick
        label="Job"
        value={value.job}
        onChange={set("job")}
        options={f.jobs.map((j) => ({ value: String(j.id), label: `${j.code} · ${j.title}` }))}
      />
      <Pick
        label="Who"
        value={value.user}
        onChange={set("user")}
        options={f.users.map((u) => ({ value: String(u.id), label: u.name }))}
      />
      <Pick
        label="Action"
        value={value.action}
        onChange={set("action")}
        options={f.actions.map((a) => ({ value: a, label: a }))}
      />
      <Pick
        label="Entity"
        value={value.entity}
        onChange={set("entity")}
        options={f.entities.map((e) => ({ value: e, label: e }))}
      />
      {(["from", "to"] as const).map((k) => (
        <label key={k} className="flex flex-col gap-1 text-sm font-medium">
          {k === "from" ? "From (UTC day)" : "To (UTC day)"}
          <input
            type="date"
            className={`${box} ${error?.[k] ? "border-fail" : ""}`}
            value={value[k]}
            onChange={(e) => set(k)(e.target.value)}
          />
          {error?.[k] && <span className="font-medium text-fail">{error[k][0]}</span>}
        </label>
      ))}
    </form>
  );
}
