// DEMO DATA ONLY. Invented spec sheets for the invented demo shop. The figures are plausible
// shop values chosen for the demo, not published limits; real limits come from the engine,
// piston, bearing and fastener makers' instructions.
// Bores and journals follow each job's finished sizes (job_size_tol, or ISO 286 without a
// nominal), so one sheet serves every overbore and undersize; the demo jobs state their sizes.
import type { LimitType } from "@/lib/domain";

type Limit = {
  characteristic: string;
  stationPattern: string;
  limitType: LimitType;
  unit: string;
  min?: number;
  max?: number;
  nominal?: number;
  tolPlus?: number;
  tolMinus?: number;
  perInchMin?: number;
  perInchMax?: number;
  isoClass?: string;
  required: boolean;
  gaugeKind?: string;
  label?: string;
};

const L = (
  characteristic: string,
  limitType: Limit["limitType"],
  unit: string,
  v: Partial<Limit>,
  stationPattern = "*",
): Limit => ({
  characteristic,
  stationPattern,
  limitType,
  unit,
  required: true,
  ...v,
});

export const STREET_V8_INCH: Limit[] = [
  L("bore_diameter", "job_size_tol", "in", {
    tolPlus: 0.0004,
    tolMinus: 0.0001,
    gaugeKind: "dial-bore-gauge",
    label: "Finished bore −0.0001/+0.0004",
  }),
  L("bore_taper", "max_only", "in", { max: 0.0005 }),
  L("bore_out_of_round", "max_only", "in", { max: 0.0005 }),
  L("piston_skirt_diameter", "nominal_tol", "in", {
    nominal: 4.0285,
    tolPlus: 0.0003,
    tolMinus: 0.0003,
    gaugeKind: "micrometer",
  }),
  L("piston_to_wall", "min_max", "in", { min: 0.0012, max: 0.0022 }),
  L("main_journal_diameter", "job_size_tol", "in", { tolPlus: 0.0005, tolMinus: 0.0005, gaugeKind: "micrometer" }),
  L("rod_journal_diameter", "job_size_tol", "in", { tolPlus: 0.0005, tolMinus: 0.0005, gaugeKind: "micrometer" }),
  L("main_journal_taper", "max_only", "in", { max: 0.0003 }),
  L("main_journal_out_of_round", "max_only", "in", { max: 0.0003 }),
  L("rod_journal_taper", "max_only", "in", { max: 0.0003 }),
  L("rod_journal_out_of_round", "max_only", "in", { max: 0.0003 }),
  L("main_oil_clearance", "per_inch", "in", { perInchMin: 0.00075, perInchMax: 0.001 }),
  L("rod_oil_clearance", "min_max", "in", { min: 0.0018, max: 0.0026 }),
  L("ring_end_gap", "min_max", "in", { min: 0.016, max: 0.022, gaugeKind: "feeler" }, "ring-gap/*/top"),
  L("ring_end_gap", "min_max", "in", { min: 0.018, max: 0.025, gaugeKind: "feeler" }, "ring-gap/*/second"),
  L(
    "ring_end_gap",
    "min_max",
    "in",
    { min: 0.015, max: 0.055, gaugeKind: "feeler", required: false },
    "ring-gap/*/oil",
  ),
  L("rod_side_clearance", "min_max", "in", { min: 0.01, max: 0.02, gaugeKind: "feeler" }),
  L("crank_end_play", "min_max", "in", { min: 0.002, max: 0.006, gaugeKind: "dial-indicator" }),
  L("rod_bolt_stretch", "min_max", "in", { min: 0.0055, max: 0.0062 }),
  L("deck_height", "nominal_tol", "in", { nominal: 9.025, tolPlus: 0.003, tolMinus: 0.003, gaugeKind: "deck-gauge" }),
  L("valve_lash", "min_max", "in", { min: 0.016, max: 0.02, gaugeKind: "feeler" }, "lash/*/int"),
  L("valve_lash", "min_max", "in", { min: 0.018, max: 0.022, gaugeKind: "feeler" }, "lash/*/exh"),
  L("fastener_torque", "min_max", "lbf_ft", { min: 70, max: 75, gaugeKind: "torque-wrench" }, "torque/main-caps"),
  L("fastener_torque", "min_max", "lbf_ft", { min: 65, max: 70, gaugeKind: "torque-wrench" }, "torque/head-bolts"),
  L("fastener_torque", "min_max", "lbf_ft", { min: 45, max: 50, gaugeKind: "torque-wrench" }, "torque/rod-bolts"),
  L("fastener_torque", "min_max", "lbf_ft", { min: 60, max: 65, gaugeKind: "torque-wrench" }, "torque/flywheel"),
  L("fastener_torque", "min_max", "lbf_ft", { min: 60, max: 65, gaugeKind: "torque-wrench" }, "torque/damper"),
];

export const TRACTOR_DIESEL_MM: Limit[] = [
  L("bore_diameter", "iso286", "mm", { isoClass: "H7", gaugeKind: "dial-bore-gauge", label: "Finished bore H7" }),
  L("bore_taper", "max_only", "mm", { max: 0.015 }),
  L("bore_out_of_round", "max_only", "mm", { max: 0.012 }),
  L("piston_skirt_diameter", "nominal_tol", "mm", {
    nominal: 103.88,
    tolPlus: 0.01,
    tolMinus: 0.01,
    gaugeKind: "micrometer",
  }),
  L("piston_to_wall", "min_max", "mm", { min: 0.1, max: 0.16 }),
  L("main_journal_diameter", "job_size_tol", "mm", { tolPlus: 0, tolMinus: 0.02, gaugeKind: "micrometer" }),
  L("rod_journal_diameter", "job_size_tol", "mm", { tolPlus: 0, tolMinus: 0.02, gaugeKind: "micrometer" }),
  L("main_journal_taper", "max_only", "mm", { max: 0.008 }),
  L("main_journal_out_of_round", "max_only", "mm", { max: 0.008 }),
  L("rod_journal_taper", "max_only", "mm", { max: 0.008 }),
  L("rod_journal_out_of_round", "max_only", "mm", { max: 0.008 }),
  L("main_oil_clearance", "min_max", "mm", { min: 0.04, max: 0.09 }),
  L("rod_oil_clearance", "min_max", "mm", { min: 0.035, max: 0.08 }),
  L("ring_end_gap", "min_max", "mm", { min: 0.3, max: 0.5, gaugeKind: "feeler" }, "ring-gap/*/top"),
  L("ring_end_gap", "min_max", "mm", { min: 0.5, max: 0.75, gaugeKind: "feeler" }, "ring-gap/*/second"),
  L("ring_end_gap", "min_max", "mm", { min: 0.25, max: 0.55, gaugeKind: "feeler", required: false }, "ring-gap/*/oil"),
  L("rod_side_clearance", "min_max", "mm", { min: 0.15, max: 0.35, gaugeKind: "feeler" }),
  L("crank_end_play", "min_max", "mm", { min: 0.1, max: 0.3, gaugeKind: "dial-indicator" }),
  L("rod_bolt_stretch", "min_max", "mm", { min: 0.14, max: 0.18 }),
  L("deck_height", "nominal_tol", "mm", { nominal: 330.0, tolPlus: 0.05, tolMinus: 0.05, gaugeKind: "deck-gauge" }),
  L("valve_lash", "min_max", "mm", { min: 0.28, max: 0.32, gaugeKind: "feeler" }, "lash/*/int"),
  L("valve_lash", "min_max", "mm", { min: 0.43, max: 0.47, gaugeKind: "feeler" }, "lash/*/exh"),
  L("fastener_torque", "min_max", "nm", { min: 150, max: 160, gaugeKind: "torque-wrench" }, "torque/main-caps"),
  L("fastener_torque", "min_max", "nm", { min: 120, max: 130, gaugeKind: "torque-wrench" }, "torque/head-bolts"),
  L("fastener_torque", "min_max", "nm", { min: 95, max: 105, gaugeKind: "torque-wrench" }, "torque/rod-bolts"),
  L("fastener_torque", "min_max", "nm", { min: 130, max: 140, gaugeKind: "torque-wrench" }, "torque/flywheel"),
  L("fastener_torque", "min_max", "nm", { min: 200, max: 220, gaugeKind: "torque-wrench" }, "torque/damper"),
];

/** The sizes each demo job states, in its units (invented demo figures). */
export const DEMO_SIZES = {
  v8: {
    engine: { nominalBore: 4.0, nominalMainJournal: 2.449, nominalRodJournal: 2.099 },
    job: { finishedBore: 4.03, finishedMainJournal: 2.449, finishedRodJournal: 2.099 },
  },
  diesel: {
    engine: { nominalBore: 103.5, nominalMainJournal: 85.0, nominalRodJournal: 70.0 },
    job: { finishedBore: 104.0, finishedMainJournal: 85.0, finishedRodJournal: 70.0 },
  },
  six: {
    engine: { nominalBore: 3.5625, nominalMainJournal: 2.4985, nominalRodJournal: 2.1235 },
    job: { finishedBore: 3.5925, finishedMainJournal: 2.4985, finishedRodJournal: 2.1235 },
  },
} as const;

export const VINTAGE_SIX_INCH: Limit[] = STREET_V8_INCH.map((l) => {
  const over: Record<string, Partial<Limit>> = {
    bore_diameter: { tolPlus: 0.0005, tolMinus: 0.0001, label: "Finished bore −0.0001/+0.0005" },
    piston_skirt_diameter: { nominal: 3.5905, tolPlus: 0.0003, tolMinus: 0.0003 },
    deck_height: { nominal: 9.38, tolPlus: 0.004, tolMinus: 0.004 },
    piston_to_wall: { min: 0.0015, max: 0.0025 },
  };
  return { ...l, ...(over[l.characteristic] ?? {}) };
});
