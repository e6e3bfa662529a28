// Correction of a length reading to the ISO 1 standard reference temperature of 20 °C.
// A gauge set on a steel master grows with the part, so with a gauge temperature the
// differential form applies: L20 = L·(1 + αg·(tg − 20))/(1 + αp·(tp − 20)) (ISO/TR 16015:2003
// nominal differential expansion; formula form from memory). Without a gauge temperature the
// gauge is taken to be at 20 °C (or length-invariant) and L20 = L/(1 + αp·(tp − 20)).
import { requireFinite } from "./checks";

/** ISO 1:2022 standard reference temperature for geometrical product specification. */
export const REFERENCE_TEMP_C = 20;

export interface ExpansionCoefficient {
  label: string;
  /** Linear expansion coefficient per °C (= per K), near room temperature. */
  alpha: number;
  source: string;
}

const CALLISTER_B6 =
  "Callister & Rethwisch, Materials Science and Engineering: An Introduction, Appendix B, Table B.6 (from ASM Handbooks)";

/** Coefficients for materials a machine shop measures, each with where the figure comes from. */
export const EXPANSION_COEFFICIENTS = {
  greyCastIron: { label: "Grey cast iron (G3000)", alpha: 11.4e-6, source: CALLISTER_B6 },
  compactedGraphiteIron: {
    label: "Compacted graphite iron",
    alpha: 11.5e-6,
    source: "ASM Handbook Vol. 1, Compacted Graphite Irons (about 11–12 ×10⁻⁶/K), from memory",
  },
  aluminium356: { label: "Aluminium casting alloy 356.0 / A356.0", alpha: 21.5e-6, source: CALLISTER_B6 },
  aluminium319: {
    label: "Aluminium casting alloy 319.0",
    alpha: 21.5e-6,
    source: "ASM Handbook Vol. 2, Properties of Cast Aluminum Alloys, 319.0 (20–100 °C), from memory",
  },
  forgedPiston2618: {
    label: "Forged aluminium piston alloy 2618",
    alpha: 22.3e-6,
    source: "ASM Handbook Vol. 2, Properties of Wrought Aluminum Alloys, 2618-T61 (20–100 °C), from memory",
  },
  forgedPiston4032: {
    label: "Forged aluminium piston alloy 4032 (high silicon)",
    alpha: 19.4e-6,
    source: "ASM Handbook Vol. 2, Properties of Wrought Aluminum Alloys, 4032-T6 (20–100 °C), from memory",
  },
  steel4140: { label: "Alloy steel 4140", alpha: 12.3e-6, source: CALLISTER_B6 },
  steel4340: { label: "Alloy steel 4340", alpha: 12.3e-6, source: `${CALLISTER_B6}, from memory` },
  gaugeSteel: {
    label: "Gauge and setting-master steel",
    alpha: 11.5e-6,
    source: "ISO 3650:1998, 6.2.2 (gauge block steel (11.5 ± 1.0) ×10⁻⁶/K), from memory",
  },
} as const satisfies Record<string, ExpansionCoefficient>;

export type ExpansionMaterial = keyof typeof EXPANSION_COEFFICIENTS;

export interface CorrectTo20CInput {
  length: number;
  partTempC: number;
  alphaPart: number;
  /** Temperature of the gauge (and its setting master); omit when the gauge is at 20 °C. */
  gaugeTempC?: number;
  /** Defaults to gauge steel when a gauge temperature is given without one. */
  alphaGauge?: number;
}

function requireAlpha(value: number, name: string): void {
  requireFinite(value, name);
  // Engineering metals sit near 1e-5/K; a value ≥ 1e-3 is almost surely entered as µm/m·K.
  if (Math.abs(value) >= 1e-3) {
    throw new Error(`${name} ${value} looks like µm/m·K; enter it per °C (e.g. 11.4e-6, not 11.4)`);
  }
}

/** Length the part would have at 20 °C. */
export function correctTo20C(input: CorrectTo20CInput): number {
  const { length, partTempC, alphaPart, gaugeTempC, alphaGauge } = input;
  requireFinite(length, "Length");
  requireFinite(partTempC, "Part temperature (°C)");
  requireAlpha(alphaPart, "Part expansion coefficient");
  const partGrowth = 1 + alphaPart * (partTempC - REFERENCE_TEMP_C);
  if (gaugeTempC === undefined) return length / partGrowth;
  requireFinite(gaugeTempC, "Gauge temperature (°C)");
  const ag = alphaGauge ?? EXPANSION_COEFFICIENTS.gaugeSteel.alpha;
  requireAlpha(ag, "Gauge expansion coefficient");
  return (length * (1 + ag * (gaugeTempC - REFERENCE_TEMP_C))) / partGrowth;
}
