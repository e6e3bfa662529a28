import "server-only";
import type { LimitValues } from "@/lib/schemas/spec";

// One limit of a starter sheet. Every starter figure is a typical value, so each carries the
// common-practice mark until the lead replaces it with the maker's figure.
type Figures = Partial<
  Pick<
    LimitValues,
    "min" | "max" | "nominal" | "tolPlus" | "tolMinus" | "perInchMin" | "perInchMax" | "isoClass" | "gaugeKind"
  >
> & { required?: boolean; label?: string };

export function starterLimit(
  characteristic: LimitValues["characteristic"],
  limitType: LimitValues["limitType"],
  unit: LimitValues["unit"],
  figures: Figures,
  stationPattern = "*",
): LimitValues {
  return { characteristic, stationPattern, limitType, unit, required: true, ...figures, commonPractice: true };
}

/** Words every starter sheet's notes open with; the torque caution follows the maker's word. */
export const STARTER_NOTES =
  "Starter sheet: every figure is a typical value (common practice), not any engine or part maker's. " +
  "Replace each with the maker's specification before you rely on it; a limit you edit loses its mark. " +
  "Fastener torque: use the bolt or engine maker's figure, sequence, steps, angle and lubricant; " +
  "a wrong torque can break a fastener or let a part come loose while the engine runs.";
