import type { JobStatus } from "@/lib/domain";

export const STATUS_WORDS: Record<JobStatus, string> = {
  intake: "Intake",
  measuring: "Measuring",
  review: "In review",
  released: "Released",
  closed: "Closed",
};

export function JobStatusTag({ status }: { status: JobStatus }) {
  return (
    <span
      className="inline-flex rounded-tool border-2 border-rule px-2 py-0.5 text-sm font-medium"
      data-status={status}
    >
      {STATUS_WORDS[status]}
    </span>
  );
}
