"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { SKIP_REASON_MAX, skipReasonProblem } from "@/lib/schemas/text-limits";

// Skipping a station always needs a reason; the usual ones are one tap, anything else is typed.
const REASONS = [
  "Not on this engine",
  "Part is out for machining",
  "Lead said to skip it",
  "Cannot reach it in this setup",
];

export function SkipSheet({
  station,
  onSkip,
  onClose,
}: {
  station: string;
  onSkip: (reason: string) => void;
  onClose: () => void;
}) {
  const [other, setOther] = useState("");
  const [error, setError] = useState<string>();
  // Counted as typed and refused in words when too long; never cut short without a word.
  const length = other.trim().length;
  function skipOther() {
    if (!length) return setError("Type why the station is skipped, or pick one of the reasons above");
    const problem = skipReasonProblem(other);
    if (problem) return setError(problem);
    onSkip(other.trim());
  }
  return (
    <div
      role="dialog"
      aria-modal="true"
      aria-label="Skip this station"
      className="fixed inset-0 z-40 flex items-end justify-center bg-ink/40 sm:items-center"
    >
      <div className="flex w-full max-w-xl flex-col gap-4 rounded-t-tool bg-paper p-5 sm:rounded-tool">
        <h2 className="text-2xl font-bold">Skip: {station}</h2>
        <div className="grid gap-3 sm:grid-cols-2">
          {REASONS.map((r) => (
            <button
              key={r}
              type="button"
              onClick={() => onSkip(r)}
              className="min-h-16 rounded-tool border-2 border-rule bg-panel px-4 text-left text-lg font-semibold"
            >
              {r}
            </button>
          ))}
        </div>
        <div className="flex flex-col gap-1">
          <label className="flex flex-col gap-1.5">
            <span className="font-medium">Another reason</span>
            <input
              value={other}
              onChange={(e) => {
                setOther(e.target.value);
                setError(undefined);
              }}
              aria-invalid={length > SKIP_REASON_MAX || undefined}
              aria-describedby="tw-skip-count"
              className="min-h-16 rounded-tool border-2 border-rule bg-panel px-3 text-lg"
            />
          </label>
          <span
            id="tw-skip-count"
            className={`text-sm ${length > SKIP_REASON_MAX ? "font-semibold text-fail" : "text-muted"}`}
          >
            {length} of {SKIP_REASON_MAX} characters
          </span>
        </div>
        {error && (
          <p className="font-semibold text-fail" role="alert">
            {error}
          </p>
        )}
        <div className="flex flex-wrap gap-3">
          <Button big onClick={skipOther}>
            Skip with this reason
          </Button>
          <Button big tone="quiet" onClick={onClose}>
            Back to measuring
          </Button>
        </div>
      </div>
    </div>
  );
}
