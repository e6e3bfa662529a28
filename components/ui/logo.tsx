// The Tenthwise mark: a bore seen end-on, ten graduations over its top arc, and the
// gauge line across it. Drawn for Tenthwise; uses currentColor so it follows the theme.
export function LogoMark({ size = 36, className = "" }: { size?: number; className?: string }) {
  const ticks = Array.from({ length: 11 }, (_, i) => {
    const a = Math.PI * (1.1 + (0.8 * i) / 10);
    const r1 = 13.5;
    const r2 = i % 5 === 0 ? 9.5 : 11.2;
    return {
      x1: 20 + r1 * Math.cos(a),
      y1: 21 + r1 * Math.sin(a),
      x2: 20 + r2 * Math.cos(a),
      y2: 21 + r2 * Math.sin(a),
    };
  });
  return (
    <svg width={size} height={size} viewBox="0 0 40 40" aria-hidden="true" className={className}>
      <rect x="1" y="1" width="38" height="38" rx="9" className="fill-steel" />
      <circle cx="20" cy="21" r="13.5" fill="none" stroke="white" strokeWidth="2.2" />
      {ticks.map((t, i) => (
        <line key={i} {...t} stroke="white" strokeWidth={i % 5 === 0 ? 1.8 : 1.1} strokeLinecap="round" />
      ))}
      <line x1="9" y1="27.5" x2="31" y2="22.5" className="stroke-brass" strokeWidth="3" strokeLinecap="round" />
    </svg>
  );
}

export function Wordmark({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-semibold tracking-tight ${className}`}>
      <LogoMark size={32} />
      <span className="text-xl">
        Tenth<span className="text-brass">wise</span>
      </span>
    </span>
  );
}
