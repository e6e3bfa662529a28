import type { ReactNode } from "react";

// Status in words AND shape (never colour alone), so a printout or a colour-blind reader gets it.
export type StatusTone = "good" | "soon" | "bad" | "off";

const TONE: Record<StatusTone, string> = {
  good: "border-pass bg-pass-soft text-pass",
  soon: "border-watch bg-watch-soft text-watch",
  bad: "border-fail bg-fail-soft text-fail",
  off: "border-rule bg-paper text-muted",
};

function Shape({ tone }: { tone: StatusTone }) {
  return (
    <svg width="14" height="14" viewBox="0 0 16 16" aria-hidden="true" className="shrink-0">
      {tone === "good" && (
        <>
          <circle cx="8" cy="8" r="7" fill="currentColor" />
          <path
            d="M4.5 8.3 7 10.8 11.6 5.6"
            fill="none"
            stroke="white"
            strokeWidth="2"
            strokeLinecap="round"
            strokeLinejoin="round"
          />
        </>
      )}
      {tone === "soon" && <path d="M8 1 15 14H1Z" fill="currentColor" />}
      {tone === "bad" && (
        <>
          <rect x="1" y="1" width="14" height="14" rx="1.5" fill="currentColor" />
          <path d="M8 4v5M8 11.5v.5" stroke="white" strokeWidth="2.2" strokeLinecap="round" />
        </>
      )}
      {tone === "off" && (
        <>
          <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeWidth="2" />
          <path d="M3.8 12.2 12.2 3.8" stroke="currentColor" strokeWidth="2" />
        </>
      )}
    </svg>
  );
}

export function StatusTag({ tone, children }: { tone: StatusTone; children: ReactNode }) {
  return (
    <span
      className={
        "inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border-2 px-2.5 py-0.5 text-sm " +
        `font-semibold ${TONE[tone]}`
      }
      data-tone={tone}
    >
      <Shape tone={tone} />
      {children}
    </span>
  );
}
