// The sync badge's mark: a tick when all is sent, a clock while something waits, a warning sign
// when something went wrong; the shape tells the state apart without its colour.
export function SyncMark({ tone }: { tone: "ok" | "wait" | "bad" }) {
  if (tone === "ok")
    return (
      <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true" className="shrink-0">
        <path d="M3 9.5 7.2 13.5 15 4.5" fill="none" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
      </svg>
    );
  if (tone === "wait")
    return (
      <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true" className="shrink-0">
        <circle cx="9" cy="9" r="7" fill="none" stroke="currentColor" strokeWidth="2.5" />
        <path d="M9 5v4.5l3 2" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
      </svg>
    );
  return (
    <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true" className="shrink-0">
      <path d="M9 1.5 17 16H1Z" fill="currentColor" />
      <path d="M9 6.5v4.5M9 13.3v.2" stroke="white" strokeWidth="2.2" strokeLinecap="round" />
    </svg>
  );
}
