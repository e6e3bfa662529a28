// Bolt and thread math. Formulas mix quantities, so inputs must be in one consistent system:
// lbf, in, in², psi (torque in lbf·in) or N, mm, mm², MPa (torque in N·mm). Convert lbf·ft or
// N·m before calling (× 12, × 1000). SAFETY: these are estimates for planning and checking
// only; the fastener maker's torque, stretch and lubricant instructions govern.

/** Caution the app shows beside any torque, preload or stretch figure. */
export const FASTENER_CAUTION =
  "Estimate only. Follow the fastener and engine maker's torque, stretch and lubricant " +
  "specifications; wrong lubricant or reused bolts can overload a fastener and it can fail in service.";

function requirePositive(value: number, name: string): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new Error(`${name} must be a number greater than zero; got ${String(value)}`);
  }
}

function requireNonNegative(value: number, name: string): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0) {
    throw new Error(`${name} must be zero or more; got ${String(value)}`);
  }
}

/**
 * Tensile stress area of a Unified inch thread, in²: 0.7854·(d − 0.9743/n)².
 * Source: ASME B1.1 (Unified Inch Screw Threads), tensile stress area formula; same values
 * tabled in Shigley's Mechanical Engineering Design, Table 8-2.
 */
export function tensileStressAreaUnified(diameterIn: number, threadsPerInch: number): number {
  requirePositive(diameterIn, "Thread major diameter (in)");
  requirePositive(threadsPerInch, "Threads per inch");
  const root = diameterIn - 0.9743 / threadsPerInch;
  if (root <= 0) throw new Error("Threads per inch is too coarse for this diameter; check both figures");
  return 0.7854 * root * root;
}

/**
 * Tensile stress area of an ISO metric thread, mm²: π/4·((d2 + d3)/2)², which for the basic
 * profile is π/4·(d − 0.938194·P)² (0.938194 = 13√3/24; often printed rounded as 0.9382).
 * Source: ISO 898-1:2013, 9.1.6.1 formula for As,nom; Shigley Table 8-1 (from memory).
 */
export function tensileStressAreaMetric(diameterMm: number, pitchMm: number): number {
  requirePositive(diameterMm, "Thread major diameter (mm)");
  requirePositive(pitchMm, "Thread pitch (mm)");
  const mean = diameterMm - ((13 * Math.sqrt(3)) / 24) * pitchMm;
  if (mean <= 0) throw new Error("Pitch is too coarse for this diameter; check both figures");
  return (Math.PI / 4) * mean * mean;
}

/** Elastic elongation δ = F·L/(A·E) (Hooke's law; Shigley Ch. 8). */
export function boltElongation(force: number, length: number, area: number, modulus: number): number {
  requireNonNegative(force, "Bolt force");
  requirePositive(length, "Grip length");
  requirePositive(area, "Cross-section area");
  requirePositive(modulus, "Elastic modulus");
  return (force * length) / (area * modulus);
}

export interface BoltStiffnessInput {
  shankArea: number;
  stressArea: number;
  modulus: number;
  /** Unthreaded length within the grip (0 for a fully threaded bolt). */
  shankLength: number;
  /** Threaded length within the grip. */
  threadLength: number;
}

/**
 * Bolt stiffness as shank and threaded length in series: 1/k = Ls/(As·E) + Lt/(At·E).
 * Source: Shigley's Mechanical Engineering Design (Budynas & Nisbett), Ch. 8, Eq. 8-17
 * (equation number from memory).
 */
export function boltStiffness(input: BoltStiffnessInput): number {
  const { shankArea, stressArea, modulus, shankLength, threadLength } = input;
  requirePositive(shankArea, "Shank area");
  requirePositive(stressArea, "Tensile stress area");
  requirePositive(modulus, "Elastic modulus");
  requireNonNegative(shankLength, "Shank length");
  requireNonNegative(threadLength, "Thread length");
  if (shankLength + threadLength === 0) throw new Error("Shank and thread length cannot both be zero");
  const compliance = shankLength / (shankArea * modulus) + threadLength / (stressArea * modulus);
  return 1 / compliance;
}

/** Preload from torque, F = T/(K·d) (Shigley Eq. 8-27). Torque in force × length of d's unit. */
export function preloadFromTorque(torque: number, nutFactor: number, diameter: number): number {
  requireNonNegative(torque, "Torque");
  requirePositive(nutFactor, "Nut factor K");
  requirePositive(diameter, "Nominal diameter");
  return torque / (nutFactor * diameter);
}

/** Torque for a preload, T = K·F·d (Shigley Eq. 8-27). */
export function torqueForPreload(preload: number, nutFactor: number, diameter: number): number {
  requireNonNegative(preload, "Preload");
  requirePositive(nutFactor, "Nut factor K");
  requirePositive(diameter, "Nominal diameter");
  return nutFactor * preload * diameter;
}

/**
 * Proof load Fp = At·Sp and the usual preload for a reused joint, Fi = 0.75·Fp.
 * Source: Shigley Ch. 8, Eq. 8-31 (0.75 reused, 0.90 permanent; from memory).
 */
export function recommendedPreload(input: { stressArea: number; proofStrength: number; fraction?: number }): {
  proofLoad: number;
  preload: number;
} {
  const { stressArea, proofStrength, fraction = 0.75 } = input;
  requirePositive(stressArea, "Tensile stress area");
  requirePositive(proofStrength, "Proof strength");
  if (!(fraction > 0 && fraction <= 1)) throw new Error(`Preload fraction must be in (0, 1]; got ${fraction}`);
  const proofLoad = stressArea * proofStrength;
  return { proofLoad, preload: fraction * proofLoad };
}

export type ThreadCondition =
  "unspecified" | "dry_black_oxide" | "zinc_plated" | "oiled" | "cadmium_plated" | "anti_seize" | "moly_paste";

export interface NutFactorEntry {
  label: string;
  nutFactor: number;
  source: string;
}

const SHIGLEY_8_15 =
  "Shigley's Mechanical Engineering Design (Budynas & Nisbett), Table 8-15 (after Blake & Kurtz), from memory";

/** Nut factor K by thread condition. K scatters widely (±25 % or more); a maker's figure governs. */
export const NUT_FACTORS: Readonly<Record<ThreadCondition, NutFactorEntry>> = {
  unspecified: {
    label: "Steel, condition not stated",
    nutFactor: 0.2,
    source:
      "Shigley's Mechanical Engineering Design, Ch. 8 text beside Eq. 8-27 (K = 0.2 when not stated), from memory",
  },
  dry_black_oxide: { label: "Dry, non-plated black finish", nutFactor: 0.3, source: SHIGLEY_8_15 },
  zinc_plated: { label: "Zinc-plated, dry", nutFactor: 0.2, source: SHIGLEY_8_15 },
  oiled: { label: "Lubricated (engine oil)", nutFactor: 0.18, source: SHIGLEY_8_15 },
  cadmium_plated: { label: "Cadmium-plated", nutFactor: 0.16, source: SHIGLEY_8_15 },
  anti_seize: { label: "Anti-seize compound", nutFactor: 0.12, source: SHIGLEY_8_15 },
  moly_paste: {
    label: "Molybdenum disulfide assembly paste",
    nutFactor: 0.1,
    source: "common practice, from memory (published figures scatter about 0.08–0.14; use the lube maker's K)",
  },
};
