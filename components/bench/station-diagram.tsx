import type { EngineShape, ParsedStation } from "@/lib/domain";

// A small drawing of where the gauge goes: a bore from the side (the depth marked) and from the
// top (the axis marked), a journal from the side (front or rear end) and end-on (the axis), a
// bearing bore with its cap joint, or the engine's cylinders with this one picked out.
// Drawn for Tenthwise. Brass marks the place to measure; words sit beside every mark.
const INK = "rgb(var(--c-ink))";
const RULE = "rgb(var(--c-rule))";
const BRASS = "rgb(var(--c-brass))";
const MUTED = "rgb(var(--c-muted))";

function AxisCircle({
  axis,
  cx,
  cy,
  r,
  joint,
}: {
  axis?: "A" | "B";
  cx: number;
  cy: number;
  r: number;
  joint?: boolean;
}) {
  const on = (a: "A" | "B") => (axis === a ? BRASS : RULE);
  return (
    <g>
      <circle cx={cx} cy={cy} r={r} fill="none" stroke={INK} strokeWidth="3" />
      {joint && (
        <line x1={cx - r - 8} y1={cy} x2={cx + r + 8} y2={cy} stroke={MUTED} strokeWidth="2" strokeDasharray="5 4" />
      )}
      <line x1={cx - r} y1={cy} x2={cx + r} y2={cy} stroke={on(joint ? "B" : "A")} strokeWidth={axis ? 5 : 3} />
      <line x1={cx} y1={cy - r} x2={cx} y2={cy + r} stroke={on(joint ? "A" : "B")} strokeWidth={axis ? 5 : 3} />
      <text x={cx + r + 6} y={cy - 6} fontSize="15" fill={INK} fontWeight={axis === (joint ? "B" : "A") ? 700 : 400}>
        {joint ? "B" : "A"}
      </text>
      <text x={cx + 6} y={cy - r - 6} fontSize="15" fill={INK} fontWeight={axis === (joint ? "A" : "B") ? 700 : 400}>
        {joint ? "A" : "B"}
      </text>
    </g>
  );
}

function Bore({ p }: { p: ParsedStation }) {
  const ys = { top: 34, mid: 70, bottom: 106 } as const;
  return (
    <svg
      viewBox="0 0 300 140"
      className="h-28 w-full max-w-md"
      role="img"
      aria-label={`Bore, ${p.depth ?? ""} depth, axis ${p.axis ?? ""}`}
    >
      <rect x="20" y="16" width="90" height="108" rx="4" fill="none" stroke={INK} strokeWidth="3" />
      {(["top", "mid", "bottom"] as const).map((d) => (
        <g key={d}>
          <line
            x1="20"
            y1={ys[d]}
            x2="110"
            y2={ys[d]}
            stroke={p.depth === d ? BRASS : RULE}
            strokeWidth={p.depth === d ? 6 : 2}
          />
          <text x="116" y={ys[d] + 5} fontSize="14" fill={INK} fontWeight={p.depth === d ? 700 : 400}>
            {d === "mid" ? "middle" : d}
          </text>
        </g>
      ))}
      <AxisCircle axis={p.axis} cx={225} cy={72} r={46} />
      <text x="180" y="136" fontSize="12" fill={MUTED}>
        A thrust · B pin
      </text>
    </svg>
  );
}

function Journal({ p, bearing }: { p: ParsedStation; bearing: boolean }) {
  const x = p.position === "rear" ? 118 : 42;
  return (
    <svg
      viewBox="0 0 300 140"
      className="h-28 w-full max-w-md"
      role="img"
      aria-label={`${bearing ? "Bearing bore" : "Journal"}, ${p.position ?? ""} end, axis ${p.axis ?? ""}`}
    >
      {bearing ? (
        <rect
          x="20"
          y="40"
          width="130"
          height="60"
          rx="6"
          fill="none"
          stroke={INK}
          strokeWidth="3"
          strokeDasharray="0"
        />
      ) : (
        <rect x="20" y="46" width="130" height="48" rx="22" fill="none" stroke={INK} strokeWidth="3" />
      )}
      {(["front", "rear"] as const).map((pos) => {
        const px = pos === "rear" ? 118 : 42;
        const on = p.position === pos;
        return <line key={pos} x1={px} y1="34" x2={px} y2="106" stroke={on ? BRASS : RULE} strokeWidth={on ? 6 : 2} />;
      })}
      <text x={x - 18} y="126" fontSize="14" fill={INK} fontWeight={700}>
        {p.position ?? ""}
      </text>
      <text x="20" y="24" fontSize="12" fill={MUTED}>
        front · rear
      </text>
      <AxisCircle axis={p.axis} cx={228} cy={72} r={42} joint={bearing} />
    </svg>
  );
}

function Cylinders({ n, pick, shape }: { n?: number; pick?: string; shape: EngineShape }) {
  const count = shape.cylinders;
  const w = Math.min(34, 260 / count);
  return (
    <svg
      viewBox="0 0 300 80"
      className="h-16 w-full max-w-md"
      role="img"
      aria-label={n ? `Cylinder ${n} of ${count}` : `Engine, ${count} cylinders`}
    >
      {Array.from({ length: count }, (_, i) => (
        <g key={i}>
          <circle
            cx={20 + w / 2 + i * w}
            cy="34"
            r={w / 2 - 3}
            fill={n === i + 1 ? BRASS : "none"}
            stroke={INK}
            strokeWidth="2.5"
          />
          <text
            x={20 + w / 2 + i * w}
            y="70"
            textAnchor="middle"
            fontSize="13"
            fill={INK}
            fontWeight={n === i + 1 ? 700 : 400}
          >
            {i + 1}
          </text>
        </g>
      ))}
      {pick && (
        <text x="20" y="12" fontSize="12" fill={MUTED}>
          {pick}
        </text>
      )}
    </svg>
  );
}

export function StationDiagram({ p, shape }: { p: ParsedStation; shape: EngineShape }) {
  switch (p.section) {
    case "bore":
      return <Bore p={p} />;
    case "main":
    case "rod":
      return <Journal p={p} bearing={false} />;
    case "main-brg":
    case "rod-brg":
      return <Journal p={p} bearing />;
    case "skirt":
    case "ring-gap":
    case "lash":
      return <Cylinders n={p.cylinder} shape={shape} pick="cylinder" />;
    case "side":
    case "bolt":
      return <Cylinders n={p.rod} shape={shape} pick="rod" />;
    default:
      return null;
  }
}
