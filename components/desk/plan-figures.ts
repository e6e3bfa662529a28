// The build plan's figures, every one computed by the measurement core (lib/domain); this file
// only decides which figures the entered values allow and keeps the core's own messages when a
// combination cannot work. Pure: used live on the plan page and wherever the plan is shown.
import {
  ccToCubicIn,
  compressionHeight,
  compressionRatio,
  cubicInToCc,
  deckClearanceFor,
  displacement,
  rodRatio,
  valveLift,
  type CompressionHeightResult,
  type CompressionRatioResult,
  type LengthUnit,
} from "@/lib/domain";
import { pistonCcOf, type BuildPlan } from "@/lib/schemas/build-plan";

export type Figure<T> = { ok: true; value: T } | { ok: false; why: string };

type PlanValues = Partial<Omit<BuildPlan, "format" | "version" | "volumeUnit">> & { lengthUnit: LengthUnit };

const WORDS: Record<string, string> = {
  bore: "the bore",
  stroke: "the stroke",
  rodLength: "the rod length",
  compressionHeight: "the compression height",
  deckHeight: "the deck height",
  chamberCc: "the chamber volume",
  gasketBore: "the gasket bore",
  gasketThickness: "the gasket thickness",
  pistonVolumeCc: "the dish or dome volume",
  intakeLobeLift: "the intake lobe lift",
  exhaustLobeLift: "the exhaust lobe lift",
  rockerRatio: "the rocker ratio",
  intakeLash: "the intake lash",
  exhaustLash: "the exhaust lash",
  cylinders: "the cylinder count",
};

const isNum = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x);

/** Runs `compute` when every needed value is a number; otherwise says which to enter. */
function attempt<T>(needs: Record<string, unknown>, compute: () => T): Figure<T> {
  const missing = Object.entries(needs)
    .filter(([, v]) => !isNum(v))
    .map(([k]) => WORDS[k] ?? k);
  if (missing.length) return { ok: false, why: `Enter ${missing.join(", ").replace(/, ([^,]*)$/, " and $1")}` };
  try {
    return { ok: true, value: compute() };
  } catch (err) {
    return { ok: false, why: err instanceof Error ? err.message : String(err) };
  }
}

export type PlanFigures = {
  displacement: Figure<{ cubicIn: number; cc: number; litres: number }>;
  rodRatio: Figure<number>;
  deckClearance: Figure<number>;
  zeroDeck: Figure<CompressionHeightResult>;
  compression: Figure<CompressionRatioResult>;
  intakeLift: Figure<{ gross: number; net: number }>;
  exhaustLift: Figure<{ gross: number; net: number }>;
};

export function planFigures(p: PlanValues, cylinders: number): PlanFigures {
  const { bore, stroke, rodLength, deckHeight, gasketBore, gasketThickness, chamberCc, rockerRatio } = p;
  const ch = p.compressionHeight;
  const pistonVolumeCc = p.pistonTop === "flat" ? 0 : p.pistonVolumeCc;
  const deckClearance = attempt({ deckHeight, stroke, rodLength, compressionHeight: ch }, () =>
    deckClearanceFor({ deckHeight: deckHeight!, stroke: stroke!, rodLength: rodLength!, compressionHeight: ch! }),
  );
  return {
    displacement: attempt({ bore, stroke, cylinders }, () => {
      const raw = displacement(bore!, stroke!, cylinders);
      // in → in³; mm → mm³, and 1 cc = 1000 mm³.
      const cc = p.lengthUnit === "in" ? cubicInToCc(raw) : raw / 1000;
      return { cubicIn: p.lengthUnit === "in" ? raw : ccToCubicIn(cc), cc, litres: cc / 1000 };
    }),
    rodRatio: attempt({ rodLength, stroke }, () => rodRatio(rodLength!, stroke!)),
    deckClearance,
    zeroDeck: attempt({ deckHeight, stroke, rodLength }, () =>
      compressionHeight({ deckHeight: deckHeight!, stroke: stroke!, rodLength: rodLength!, deckClearance: 0 }),
    ),
    compression: deckClearance.ok
      ? attempt({ bore, stroke, gasketBore, gasketThickness, chamberCc, pistonVolumeCc }, () =>
          compressionRatio({
            lengthUnit: p.lengthUnit,
            bore: bore!,
            stroke: stroke!,
            gasketBore: gasketBore!,
            gasketThickness: gasketThickness!,
            deckClearance: deckClearance.value,
            chamberCc: chamberCc!,
            pistonCc: pistonCcOf({ pistonTop: p.pistonTop ?? "flat", pistonVolumeCc }),
          }),
        )
      : {
          ok: false,
          why: `Needs the deck clearance: ${deckClearance.why.charAt(0).toLowerCase()}${deckClearance.why.slice(1)}`,
        },
    intakeLift: attempt({ intakeLobeLift: p.intakeLobeLift, rockerRatio, intakeLash: p.intakeLash }, () =>
      valveLift(p.intakeLobeLift!, rockerRatio!, p.intakeLash!),
    ),
    exhaustLift: attempt({ exhaustLobeLift: p.exhaustLobeLift, rockerRatio, exhaustLash: p.exhaustLash }, () =>
      valveLift(p.exhaustLobeLift!, rockerRatio!, p.exhaustLash!),
    ),
  };
}
