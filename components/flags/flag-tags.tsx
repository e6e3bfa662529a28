import { DISPOSITION_WORDS, REASON_TAG_WORDS, REASON_WORDS, STATE_WORDS } from "@/lib/schemas/flag";
import type { Disposition, FlagReason, FlagState } from "@/lib/schemas/enums";

// Reason and decision tags: words first, a small outline shape second, never colour alone.
function ReasonShape({ reason }: { reason: FlagReason }) {
  return (
    <svg width="12" height="12" viewBox="0 0 12 12" aria-hidden="true" className="shrink-0">
      {reason === "out_of_spec" && (
        <path d="M2 2 10 10M10 2 2 10" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
      )}
      {reason === "marginal" && <path d="M6 1 11 6 6 11 1 6Z" fill="none" stroke="currentColor" strokeWidth="1.8" />}
      {(reason === "gauge_study_failed" || reason === "gauge_study_due") && (
        <path d="M1.5 9.5h9M3 9.5V7M6 9.5V4M9 9.5V2" fill="none" stroke="currentColor" strokeWidth="1.6" />
      )}
      {reason === "gauge_past_due" && (
        <>
          <circle cx="6" cy="6" r="4.8" fill="none" stroke="currentColor" strokeWidth="1.6" />
          <path d="M6 3.2V6l2 1.4" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
        </>
      )}
    </svg>
  );
}

export function ReasonTag({ reason }: { reason: FlagReason }) {
  const short = REASON_TAG_WORDS[reason];
  return (
    <span
      className="inline-flex items-center gap-1.5 text-sm font-medium"
      title={REASON_WORDS[reason]}
      data-reason={reason}
    >
      <ReasonShape reason={reason} />
      {short}
    </span>
  );
}

export function DecisionTag({
  state,
  disposition,
  operation,
}: {
  state: FlagState;
  disposition: Disposition | null;
  operation?: string | null;
}) {
  const decided = disposition ? `${DISPOSITION_WORDS[disposition]}${operation ? `: ${operation}` : ""}` : null;
  const text =
    state === "open"
      ? "Open: needs a decision"
      : state === "closed"
        ? STATE_WORDS.closed
        : (decided ?? STATE_WORDS[state]);
  const tone =
    state === "open"
      ? "border-brass bg-paper text-ink"
      : state === "closed"
        ? "border-rule bg-paper text-muted"
        : "border-steel bg-paper text-ink";
  return (
    <span
      className={`inline-flex flex-col rounded-tool border-2 px-2 py-0.5 text-sm font-medium ${tone}`}
      data-state={state}
    >
      <span>{text}</span>
      {state === "closed" && decided && <span className="text-xs">decided: {decided.toLowerCase()}</span>}
    </span>
  );
}
