import "server-only";
import type { TemplateValues } from "@/lib/schemas/spec";
import { STARTER_NOTES, starterLimit as L } from "./starter-limit";

// Starter sheet: inline six gasoline (an older pushrod six, cast iron block), inch. Common practice
// throughout, from memory of usual rebuild values; bores and journals follow the job's finished
// sizes. The rod side clearance is tighter than a V8's (one rod per journal).
export const STARTER_INLINE_SIX: TemplateValues = {
  name: "Starter · Inline six, gasoline (typical figures)",
  engineKind: "Inline six gasoline",
  buildKind: "street",
  unitSystem: "in",
  notes: STARTER_NOTES,
  limits: [
    L("bore_diameter", "job_size_tol", "in", {
      tolPlus: 0.0005,
      tolMinus: 0,
      gaugeKind: "dial-bore-gauge",
      label: "Finished bore +0.0005/−0",
    }),
    L("bore_taper", "max_only", "in", { max: 0.0005 }),
    L("bore_out_of_round", "max_only", "in", { max: 0.0005 }),
    L("piston_to_wall", "min_max", "in", { min: 0.001, max: 0.002 }),
    L("main_journal_diameter", "job_size_tol", "in", { tolPlus: 0, tolMinus: 0.001, gaugeKind: "micrometer" }),
    L("rod_journal_diameter", "job_size_tol", "in", { tolPlus: 0, tolMinus: 0.001, gaugeKind: "micrometer" }),
    L("main_journal_taper", "max_only", "in", { max: 0.0005 }),
    L("main_journal_out_of_round", "max_only", "in", { max: 0.0005 }),
    L("rod_journal_taper", "max_only", "in", { max: 0.0005 }),
    L("rod_journal_out_of_round", "max_only", "in", { max: 0.0005 }),
    L("main_oil_clearance", "min_max", "in", { min: 0.001, max: 0.0025 }),
    L("rod_oil_clearance", "min_max", "in", { min: 0.001, max: 0.0025 }),
    L(
      "ring_end_gap",
      "per_inch",
      "in",
      { perInchMin: 0.003, perInchMax: 0.005, gaugeKind: "feeler" },
      "ring-gap/*/top",
    ),
    L(
      "ring_end_gap",
      "per_inch",
      "in",
      { perInchMin: 0.003, perInchMax: 0.0055, gaugeKind: "feeler" },
      "ring-gap/*/second",
    ),
    L("ring_end_gap", "min_only", "in", { min: 0.015, gaugeKind: "feeler", required: false }, "ring-gap/*/oil"),
    L("rod_side_clearance", "min_max", "in", { min: 0.006, max: 0.014, gaugeKind: "feeler" }),
    L("crank_end_play", "min_max", "in", { min: 0.004, max: 0.008, gaugeKind: "dial-indicator" }),
    // Fastener torque, oiled threads (from memory of older sixes). The maker governs.
    L("fastener_torque", "min_max", "lbf_ft", { min: 60, max: 70, gaugeKind: "torque-wrench" }, "torque/main-caps"),
    L("fastener_torque", "min_max", "lbf_ft", { min: 85, max: 95, gaugeKind: "torque-wrench" }, "torque/head-bolts"),
    L("fastener_torque", "min_max", "lbf_ft", { min: 35, max: 45, gaugeKind: "torque-wrench" }, "torque/rod-bolts"),
    L("fastener_torque", "min_max", "lbf_ft", { min: 50, max: 60, gaugeKind: "torque-wrench" }, "torque/flywheel"),
    L("fastener_torque", "min_max", "lbf_ft", { min: 80, max: 100, gaugeKind: "torque-wrench" }, "torque/damper"),
  ],
};
