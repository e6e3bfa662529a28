import { JobsProgress } from "@/components/desk/jobs-progress";
import { Notice } from "@/components/ui/notice";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { VERDICTS, type Verdict } from "@/lib/domain";
import type { JobDetail } from "./queries";

// The readings summary of a job: per bench section, required stations done and the verdicts
// of the current readings; then the values computed from them.

function Count({ n, verdict }: { n: number; verdict: Verdict }) {
  // The column header carries colour, word and shape; a zero stays quiet.
  return (
    <td className={`px-3 py-2 text-right tabular ${n ? "font-semibold" : "text-muted"}`} data-verdict={verdict}>
      {n}
    </td>
  );
}

export function JobSummary({ summary }: { summary: JobDetail["summary"] }) {
  if (summary.routeError)
    return (
      <Notice tone="error" title="This engine has no bench route">
        {summary.routeError}. Fix the engine on the job&apos;s edit page.
      </Notice>
    );
  const totals = summary.sections.reduce(
    (t, s) => ({ done: t.done + s.requiredDone, required: t.required + s.required }),
    { done: 0, required: 0 },
  );
  return (
    <section className="flex flex-col gap-3" aria-labelledby="readings-summary">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="readings-summary" className="text-xl font-semibold">
          Readings
        </h2>
        <span className="text-sm text-muted">
          {summary.currentCount} stations with a current reading · {summary.readingCount} readings in all
        </span>
      </div>
      <div className="flex items-center gap-3">
        <span className="font-medium">Required stations</span>
        <JobsProgress {...totals} />
      </div>
      <div className="overflow-x-auto rounded-tool border-2 border-rule bg-panel">
        <table className="w-full border-collapse text-sm">
          <thead className="bg-paper">
            <tr>
              <th scope="col" className="px-3 py-2 text-left">
                Section
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Required done
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Measured
              </th>
              {VERDICTS.map((v) => (
                <th key={v} scope="col" className="px-3 py-2 text-right">
                  <VerdictBadge verdict={v} size="sm" />
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {summary.sections.map((s) => (
              <tr
                key={s.id}
                className="border-t border-rule"
                data-section={s.id}
                data-done={s.requiredDone}
                data-required={s.required}
              >
                <th scope="row" className="px-3 py-2 text-left font-medium">
                  {s.label}
                </th>
                <td className="px-3 py-2 text-right tabular">
                  {s.required ? `${s.requiredDone} of ${s.required}` : "not required"}
                </td>
                <td className="px-3 py-2 text-right tabular">
                  {s.measured} of {s.stations}
                </td>
                {VERDICTS.map((v) => (
                  <Count key={v} n={s.verdicts[v]} verdict={v} />
                ))}
              </tr>
            ))}
            <tr className="border-t-2 border-rule bg-paper">
              <th scope="row" className="px-3 py-2 text-left font-medium">
                Computed values (clearances, taper, out-of-round, stretch)
              </th>
              <td className="px-3 py-2 text-right text-muted" colSpan={2}>
                {summary.derived.pending ? `${summary.derived.pending} waiting for readings` : ""}
              </td>
              {VERDICTS.map((v) => (
                <Count key={v} n={summary.derived[v]} verdict={v} />
              ))}
            </tr>
          </tbody>
        </table>
      </div>
    </section>
  );
}
