import { VERDICT_WORDS, type Verdict } from "@/lib/domain";

// Each verdict has a colour, a word and a shape, so it reads in black and white and for
// colour-blind users: a round dot in spec, a diamond when marginal, a square cross when out.
const TONE: Record<Verdict, string> = {
  in_spec: "bg-pass-soft text-pass border-pass",
  marginal: "bg-watch-soft text-watch border-watch",
  out_of_spec: "bg-fail-soft text-fail border-fail",
};

export function VerdictShape({ verdict, size = 16 }: { verdict: Verdict; size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 16 16" aria-hidden="true" className="shrink-0">
      {verdict === "in_spec" && <circle cx="8" cy="8" r="6.5" fill="currentColor" />}
      {verdict === "marginal" && <path d="M8 0.8 15.2 8 8 15.2 0.8 8Z" fill="currentColor" />}
      {verdict === "out_of_spec" && (
        <>
          <rect x="1" y="1" width="14" height="14" rx="1.5" fill="currentColor" />
          <path d="M4.5 4.5 11.5 11.5M11.5 4.5 4.5 11.5" stroke="white" strokeWidth="2.2" strokeLinecap="round" />
        </>
      )}
    </svg>
  );
}

export function VerdictBadge({ verdict, size = "md" }: { verdict: Verdict; size?: "sm" | "md" | "lg" }) {
  const pad =
    size === "lg" ? "px-4 py-2 text-xl gap-3" : size === "sm" ? "px-2 py-0.5 text-xs gap-1" : "px-3 py-1 text-sm gap-2";
  return (
    <span
      className={`inline-flex items-center rounded-full border-2 font-semibold ${pad} ${TONE[verdict]}`}
      data-verdict={verdict}
    >
      <VerdictShape verdict={verdict} size={size === "lg" ? 22 : size === "sm" ? 11 : 15} />
      {VERDICT_WORDS[verdict]}
    </span>
  );
}
