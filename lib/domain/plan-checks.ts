// A build plan's figures, checked where they are typed: each size a real one (refused otherwise),
// and the parts' fit in the block (a warning the lead confirms before saving: a builder may mean
// it, but never by accident).
import { compressionRatio, deckClearanceFor } from "./build-math";
import type { LengthUnit } from "./enums";
import { sizeProblem, type FieldProblem, type SizeKind } from "./plausible-limit";
import { farFromNominalBore, figureProblem } from "./plausible-range";
import type { CharacteristicId, EngineShape } from "./types";
import { cleanDecimal, convertLength } from "./units";

type N = number | null | undefined;
/** The plan's figures: lengths in `lengthUnit`, volumes in cc; pistonCc + for a dish, − for a dome. */
export type PlanSizes = {
  lengthUnit: LengthUnit;
  bore?: N;
  stroke?: N;
  rodLength?: N;
  compressionHeight?: N;
  deckHeight?: N;
  gasketBore?: N;
  gasketThickness?: N;
  intakeLobeLift?: N;
  exhaustLobeLift?: N;
  intakeLash?: N;
  exhaustLash?: N;
  chamberCc?: N;
  pistonCc?: N;
};

const num = (v: N): v is number => typeof v === "number" && Number.isFinite(v);

const AS_CHARACTERISTIC: Partial<Record<keyof PlanSizes, CharacteristicId>> = {
  bore: "bore_diameter",
  gasketBore: "bore_diameter",
  deckHeight: "deck_height",
  intakeLash: "valve_lash",
  exhaustLash: "valve_lash",
};
const AS_SIZE: Partial<Record<keyof PlanSizes, SizeKind>> = {
  stroke: "stroke",
  rodLength: "rodLength",
  compressionHeight: "compressionHeight",
  gasketThickness: "gasketThickness",
  intakeLobeLift: "lobeLift",
  exhaustLobeLift: "lobeLift",
};

/** Sizes no real engine has (a slipped decimal point, the wrong unit), and a bore far from the engine's. */
export function planFigureProblems(
  p: PlanSizes,
  engine?: Pick<EngineShape, "unitSystem" | "nominalSizes">,
): FieldProblem[] {
  const out: FieldProblem[] = [];
  for (const [field, c] of Object.entries(AS_CHARACTERISTIC) as [keyof PlanSizes, CharacteristicId][]) {
    const v = p[field] as N;
    const why = num(v) && v > 0 ? figureProblem(c, v, p.lengthUnit) : undefined;
    if (why) out.push({ field, message: why });
  }
  for (const [field, kind] of Object.entries(AS_SIZE) as [keyof PlanSizes, SizeKind][]) {
    const v = p[field] as N;
    const why = num(v) && v > 0 ? sizeProblem(kind, v, p.lengthUnit) : undefined;
    if (why) out.push({ field, message: why });
  }
  if (num(p.bore) && !out.some((x) => x.field === "bore")) {
    const why = farFromNominalBore(p.bore, p.lengthUnit, engine);
    if (why) out.push({ field: "bore", message: why });
  }
  return out;
}

/**
 * How far a piston may stand above the deck at top dead centre, and the least piston-to-head
 * clearance (crown to head face, with the gasket) before rod stretch and piston rock at speed
 * bring them together. Common practice, from memory: builders rarely go past 0.010 in out of the
 * hole and keep at least about 0.030–0.040 in piston-to-head; 5 mm down the hole means a wrong part.
 */
export const FIT_LIMITS_MM = { aboveDeck: 0.25, pistonToHead: 0.75, belowDeck: 5 } as const;

const words = (mm: number, unit: LengthUnit) =>
  unit === "in" ? `${cleanDecimal(Number(convertLength(mm, "mm", "in").toFixed(4)))} in` : `${mm} mm`;
const show = (v: number, unit: LengthUnit) => `${cleanDecimal(Number(v.toFixed(unit === "in" ? 4 : 3)))} ${unit}`;

/** Why the parts do not fit together, in words; empty when they do or the figures are not all there. */
export function planFitWarnings(p: PlanSizes): string[] {
  const { deckHeight, stroke, rodLength, compressionHeight, lengthUnit: unit } = p;
  if (![deckHeight, stroke, rodLength, compressionHeight].every((v) => num(v) && v > 0)) return [];
  const out: string[] = [];
  const deck = deckClearanceFor({
    deckHeight: deckHeight!,
    stroke: stroke!,
    rodLength: rodLength!,
    compressionHeight: compressionHeight!,
  });
  const mm = (v: number) => convertLength(v, unit, "mm");
  if (mm(-deck) > FIT_LIMITS_MM.aboveDeck)
    out.push(
      `At top dead centre the piston stands ${show(-deck, unit)} above the deck, more than the ` +
        `${words(FIT_LIMITS_MM.aboveDeck, unit)} builders allow; check the compression height, rod length, stroke ` +
        "and deck height",
    );
  if (mm(deck) > FIT_LIMITS_MM.belowDeck)
    out.push(
      `At top dead centre the piston stays ${show(deck, unit)} down the bore; check the compression height and rod ` +
        "length are for this block",
    );
  if (num(p.gasketThickness)) {
    const toHead = deck + p.gasketThickness;
    if (toHead <= 0)
      out.push("The piston crown reaches the head face at top dead centre; the parts cannot run together");
    else if (mm(toHead) < FIT_LIMITS_MM.pistonToHead)
      out.push(
        `Piston-to-head clearance is only ${show(toHead, unit)} (deck clearance plus gasket); most builders keep ` +
          `at least ${words(FIT_LIMITS_MM.pistonToHead, unit)}, since rods stretch and pistons rock at speed`,
      );
  }
  const volumes = [p.bore, p.gasketBore, p.gasketThickness, p.chamberCc];
  if (volumes.every(num) && p.bore! > 0 && p.gasketBore! > 0) {
    try {
      compressionRatio({
        lengthUnit: unit,
        bore: p.bore!,
        stroke: stroke!,
        gasketBore: p.gasketBore!,
        gasketThickness: p.gasketThickness!,
        deckClearance: deck,
        chamberCc: p.chamberCc!,
        pistonCc: p.pistonCc ?? 0,
      });
    } catch (err) {
      out.push((err as Error).message);
    }
  }
  return out;
}
