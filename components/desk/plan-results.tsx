import type { ReactNode } from "react";
import { Notice } from "@/components/ui/notice";
import type { LengthUnit } from "@/lib/domain";
import type { Figure, PlanFigures } from "./plan-figures";

// The build plan's figures as the lead reads them. Rounding is for reading only (the figures
// come unrounded from the core): volumes to 0.1 cc, ratios to 0.01, lengths to the gauge step.
export const PLAN_DIGITS = { in: 4, mm: 3, liftIn: 3, liftMm: 2 } as const;

const fmt = (x: number, digits: number) => x.toFixed(digits);
export const lengthText = (x: number, unit: LengthUnit) =>
  `${fmt(x, unit === "in" ? PLAN_DIGITS.in : PLAN_DIGITS.mm)} ${unit}`;
export const liftText = (x: number, unit: LengthUnit) =>
  `${fmt(x, unit === "in" ? PLAN_DIGITS.liftIn : PLAN_DIGITS.liftMm)} ${unit}`;

function Item<T>({
  label,
  figure,
  children,
  testId,
}: {
  label: string;
  figure: Figure<T>;
  children: (v: T) => ReactNode;
  testId: string;
}) {
  return (
    <div className="flex flex-col gap-1 border-t border-rule py-3 first:border-t-0" data-testid={testId}>
      <dt className="text-sm text-muted">{label}</dt>
      <dd>
        {figure.ok ? (
          children(figure.value)
        ) : (
          <span className="text-sm text-muted" data-state="missing">
            {figure.why}
          </span>
        )}
      </dd>
    </div>
  );
}

function Part({ name, cc, testId }: { name: string; cc: number; testId: string }) {
  return (
    <li className="flex justify-between gap-4">
      <span>{name}</span>
      <span className="font-mono tabular" data-testid={testId}>
        {fmt(cc, 2)} cc
      </span>
    </li>
  );
}

function FitVerdict({
  f,
  gasketThickness,
  unit,
}: {
  f: PlanFigures;
  gasketThickness?: number | null;
  unit: LengthUnit;
}) {
  if (!f.zeroDeck.ok) return <span className="text-sm text-muted">{f.zeroDeck.why}</span>;
  // Above the deck by at least the gasket's thickness, the crown reaches the head face.
  const hitsHead =
    f.deckClearance.ok && typeof gasketThickness === "number" && -f.deckClearance.value >= gasketThickness;
  const fits = f.zeroDeck.value.fits && !hitsHead;
  const reason = !f.zeroDeck.value.fits
    ? f.zeroDeck.value.reason
    : hitsHead
      ? "The piston crown stands at or above the head face at top dead centre; use a lower compression height or a thicker gasket"
      : null;
  return (
    <span className="flex flex-col gap-1">
      <span
        className={
          "inline-flex w-fit items-center gap-2 rounded-tool border-2 px-2 py-0.5 font-semibold " +
          (fits ? "border-pass text-pass" : "border-fail text-fail")
        }
        data-testid="plan-fits"
      >
        <span aria-hidden="true">{fits ? "●" : "■"}</span>
        {fits ? "Parts fit the block" : "Parts do not fit"}
      </span>
      {reason && <span className="text-sm">{reason}</span>}
      <span className="text-sm text-muted">
        Compression height for a zero deck:{" "}
        <span className="font-mono" data-testid="plan-zero-deck">
          {lengthText(f.zeroDeck.value.compressionHeight, unit)}
        </span>
      </span>
    </span>
  );
}

type Inputs = { gasketThickness?: number | null; chamberCc?: number | null; pistonCc: number };

export function PlanResults({ f, unit, inputs }: { f: PlanFigures; unit: LengthUnit; inputs: Inputs }) {
  return (
    <section
      aria-labelledby="plan-figures"
      className="flex flex-col gap-3 rounded-tool border-2 border-rule bg-panel p-4"
    >
      <h2 id="plan-figures" className="text-xl font-semibold">
        Figures
      </h2>
      <dl aria-live="polite">
        <Item label="Displacement" figure={f.displacement} testId="plan-displacement">
          {(d) => (
            <span className="font-mono text-lg tabular">
              <span data-testid="plan-cubic-in">{fmt(d.cubicIn, 1)} in³</span> ·{" "}
              <span data-testid="plan-cc">{fmt(d.cc, 0)} cc</span> ·{" "}
              <span data-testid="plan-litres">{fmt(d.litres, 2)} L</span>
            </span>
          )}
        </Item>
        <Item label="Compression ratio" figure={f.compression} testId="plan-compression">
          {(c) => (
            <div className="flex flex-col gap-2">
              <span className="font-mono text-2xl font-semibold tabular" data-testid="plan-ratio">
                {fmt(c.ratio, 2)} : 1
              </span>
              <ul className="flex flex-col gap-0.5 text-sm">
                <Part name="Swept volume (one cylinder)" cc={c.sweptCc} testId="plan-swept" />
                <Part name="Chamber (in the head)" cc={inputs.chamberCc ?? 0} testId="plan-chamber-cc" />
                <Part name="Gasket" cc={c.gasketCc} testId="plan-gasket-cc" />
                <Part name="Deck (piston below deck +, above −)" cc={c.deckCc} testId="plan-deck-cc" />
                <Part name="Piston (dish +, dome −)" cc={inputs.pistonCc} testId="plan-piston-cc" />
                <Part name="Clearance volume (the four above)" cc={c.clearanceCc} testId="plan-clearance" />
              </ul>
            </div>
          )}
        </Item>
        <Item label="Rod ratio (rod length ÷ stroke)" figure={f.rodRatio} testId="plan-rod-ratio">
          {(r) => (
            <span className="font-mono text-lg tabular" data-testid="plan-rod-ratio-value">
              {fmt(r, 3)}
            </span>
          )}
        </Item>
        <Item label="Deck clearance at top dead centre" figure={f.deckClearance} testId="plan-deck">
          {(d) => (
            <span className="font-mono text-lg tabular">
              <span data-testid="plan-deck-value">{lengthText(Math.abs(d), unit)}</span>{" "}
              <span className="font-sans text-base">
                {d > 0 ? "below the deck" : d < 0 ? "above the deck" : "level with the deck"}
              </span>
            </span>
          )}
        </Item>
        <div className="border-t border-rule py-3">
          <dt className="text-sm text-muted">Will the crank, rod and piston fit?</dt>
          <dd>
            <FitVerdict f={f} gasketThickness={inputs.gasketThickness} unit={unit} />
          </dd>
        </div>
        {(["intake", "exhaust"] as const).map((v) => (
          <Item
            key={v}
            label={`${v === "intake" ? "Intake" : "Exhaust"} valve lift (gross / net of lash)`}
            figure={f[`${v}Lift`]}
            testId={`plan-${v}-lift`}
          >
            {(l) => (
              <span className="font-mono text-lg tabular">
                <span data-testid={`plan-${v}-gross`}>{liftText(l.gross, unit)}</span> /{" "}
                <span data-testid={`plan-${v}-net`}>{liftText(l.net, unit)}</span>
              </span>
            )}
          </Item>
        ))}
      </dl>
      <Notice tone="caution" title="Caution">
        These figures are worked out from the values entered. They do not replace the engine, piston, gasket, cam and
        rocker makers&apos; specifications: confirm the deck clearance, piston-to-head and piston-to-valve clearance on
        the engine itself before it runs.
      </Notice>
    </section>
  );
}
