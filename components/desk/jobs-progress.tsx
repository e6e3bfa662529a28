// Progress of a job's required stations: a bar and the figures in words, so it reads without
// colour. Used on the jobs board and the job page.
export function JobsProgress({ done, required }: { done: number; required: number }) {
  const figures = { "data-testid": "required-progress", "data-done": done, "data-required": required };
  if (required === 0)
    return (
      <span className="text-sm text-muted" {...figures}>
        No required stations
      </span>
    );
  const pct = Math.round((done / required) * 100);
  return (
    <span
      className="flex min-w-40 flex-col gap-1"
      title={`${done} of ${required} required stations measured`}
      {...figures}
    >
      <span className="text-sm tabular">
        <span className="font-semibold">{done}</span> of {required} · {pct}%
      </span>
      <span className="h-2 w-full overflow-hidden rounded-full border border-rule bg-paper" aria-hidden="true">
        <span className="block h-full bg-steel" style={{ width: `${pct}%` }} />
      </span>
    </span>
  );
}

/** Open and disposed flags in words; nothing open reads as a plain dash-free "none". */
export function JobsFlagCount({ open, disposed }: { open: number; disposed: number }) {
  if (open === 0 && disposed === 0) return <span className="text-sm text-muted">None open</span>;
  return (
    <span className="flex flex-col text-sm">
      {open > 0 && <span className="font-semibold text-fail">{open} open</span>}
      {disposed > 0 && <span className="text-muted">{disposed} awaiting re-check</span>}
    </span>
  );
}
