import { JOB_SIZE_WORDS, JOB_SIZES, sizeChangeWords, type JobSize } from "@/lib/domain";
import type { JobDetail } from "./queries";

// The job's finished sizes on its page, each with how far it is from the engine's standard size.
const STANDARD: Record<JobSize, (e: JobDetail["engine"]) => number | null> = {
  bore: (e) => e.nominalBore,
  mainJournal: (e) => e.nominalMainJournal,
  rodJournal: (e) => e.nominalRodJournal,
};

export function JobFinishedSizes({ d }: { d: JobDetail }) {
  const unit = d.job.unitSystem;
  return (
    <>
      {JOB_SIZES.map((size) => {
        const value = d.job.finishedSizes[size];
        const name = JOB_SIZE_WORDS[size].replace(/ size$/, "");
        const change = sizeChangeWords(value, STANDARD[size](d.engine), unit);
        return (
          <span key={size} className="block text-sm" data-size={size}>
            {name[0].toUpperCase()}
            {name.slice(1)}:{" "}
            {value === null ? (
              <span className="text-muted">not stated</span>
            ) : (
              <>
                <span className="tabular font-medium">
                  {value} {unit}
                </span>
                {change && <span className="text-muted"> · {change}</span>}
              </>
            )}
          </span>
        );
      })}
    </>
  );
}
