import { VerdictShape } from "@/components/ui/verdict-badge";
import { VERDICT_WORDS, isVerdict } from "@/lib/domain";
import type { StationState } from "@/lib/offline/route-status";

// How a station's state looks on the route: a word, a colour and a shape, never colour alone.
// The three verdicts reuse the verdict shapes (dot, diamond, crossed square).
export const STATE_WORDS: Record<StationState, string> = {
  todo: "To do",
  ...VERDICT_WORDS,
  no_limit: "Logged",
  skipped: "Skipped",
  rejected: "Refused",
  confirm: "Confirm",
  revisit: "Sent back",
};

export const STATE_TONE: Record<StationState, string> = {
  todo: "border-rule bg-panel text-ink",
  in_spec: "border-pass bg-pass-soft text-pass",
  marginal: "border-watch bg-watch-soft text-watch",
  out_of_spec: "border-fail bg-fail-soft text-fail",
  no_limit: "border-steel bg-panel text-steel",
  skipped: "border-muted bg-paper text-muted",
  rejected: "border-fail bg-fail-soft text-fail",
  confirm: "border-fail bg-panel text-fail",
  revisit: "border-brass bg-watch-soft text-ink",
};

export function StateShape({ state, size = 14 }: { state: StationState; size?: number }) {
  if (isVerdict(state)) return <VerdictShape verdict={state} size={size} />;
  if (state === "confirm") return <VerdictShape verdict="out_of_spec" size={size} />;
  const common = {
    width: size,
    height: size,
    viewBox: "0 0 16 16",
    "aria-hidden": true as const,
    className: "shrink-0",
  };
  switch (state) {
    case "todo":
      return (
        <svg {...common}>
          <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeWidth="2" />
        </svg>
      );
    case "no_limit":
      return (
        <svg {...common}>
          <rect x="3" y="3" width="10" height="10" rx="2" fill="none" stroke="currentColor" strokeWidth="2.2" />
        </svg>
      );
    case "skipped":
      return (
        <svg {...common}>
          <path d="M3 8h10" stroke="currentColor" strokeWidth="2.6" strokeLinecap="round" />
        </svg>
      );
    case "rejected":
      return (
        <svg {...common}>
          <path d="M8 1 15.5 14.5H.5Z" fill="currentColor" />
          <path d="M8 5.5v4M8 12v.3" stroke="white" strokeWidth="2" strokeLinecap="round" />
        </svg>
      );
    case "revisit":
      return (
        <svg {...common}>
          <path
            d="M12.5 5.5A5 5 0 1 0 13 10"
            fill="none"
            stroke="currentColor"
            strokeWidth="2.2"
            strokeLinecap="round"
          />
          <path
            d="M13.5 1.5v4.5H9"
            fill="none"
            stroke="currentColor"
            strokeWidth="2.2"
            strokeLinecap="round"
            strokeLinejoin="round"
          />
        </svg>
      );
    default:
      return null;
  }
}

export function StateTag({ state }: { state: StationState }) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-full border-2 px-2.5 py-0.5 text-sm font-semibold ${STATE_TONE[state]}`}
      data-state={state}
    >
      <StateShape state={state} />
      {STATE_WORDS[state]}
    </span>
  );
}
