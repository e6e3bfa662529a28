import "server-only";
import type { TemplateValues } from "@/lib/schemas/spec";
import { STARTER_NOTES, starterLimit as L } from "./starter-limit";

// Starter sheet: carbureted pushrod V8 street build, inch. Common practice throughout (figures
// from memory of usual street rebuild values, not from any maker's sheet or published table):
// bores and journals follow the job's finished sizes; the clearance windows that scale with
// diameter are per inch of it, the rest plain windows. Hydraulic lifters are usual on such a
// build, so there is no lash limit; deck height and skirt size depend on the block and piston, so
// they are left to the lead.
export const STARTER_V8_STREET: TemplateValues = {
  name: "Starter · V8 street, carbureted (typical figures)",
  engineKind: "V8 gasoline, carbureted",
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
    // Common practice for cast or hypereutectic pistons: about 0.00025–0.0006 in per inch of bore.
    L("piston_to_wall", "per_inch", "in", { perInchMin: 0.00025, perInchMax: 0.0006 }),
    L("main_journal_diameter", "job_size_tol", "in", { tolPlus: 0, tolMinus: 0.001, gaugeKind: "micrometer" }),
    L("rod_journal_diameter", "job_size_tol", "in", { tolPlus: 0, tolMinus: 0.001, gaugeKind: "micrometer" }),
    L("main_journal_taper", "max_only", "in", { max: 0.0003 }),
    L("main_journal_out_of_round", "max_only", "in", { max: 0.0003 }),
    L("rod_journal_taper", "max_only", "in", { max: 0.0003 }),
    L("rod_journal_out_of_round", "max_only", "in", { max: 0.0003 }),
    // The shop rule "about a thousandth per inch of journal", with three quarters of it the least.
    L("main_oil_clearance", "per_inch", "in", { perInchMin: 0.00075, perInchMax: 0.001 }),
    L("rod_oil_clearance", "per_inch", "in", { perInchMin: 0.00075, perInchMax: 0.001 }),
    // Naturally aspirated street ring gaps per inch of bore (common practice); oil rails a floor.
    L(
      "ring_end_gap",
      "per_inch",
      "in",
      { perInchMin: 0.004, perInchMax: 0.005, gaugeKind: "feeler" },
      "ring-gap/*/top",
    ),
    L(
      "ring_end_gap",
      "per_inch",
      "in",
      { perInchMin: 0.0045, perInchMax: 0.0055, gaugeKind: "feeler" },
      "ring-gap/*/second",
    ),
    L("ring_end_gap", "min_only", "in", { min: 0.015, gaugeKind: "feeler", required: false }, "ring-gap/*/oil"),
    L("rod_side_clearance", "min_max", "in", { min: 0.01, max: 0.02, gaugeKind: "feeler" }),
    L("crank_end_play", "min_max", "in", { min: 0.002, max: 0.007, gaugeKind: "dial-indicator" }),
    // Fastener torque: typical of small pushrod V8s, oiled threads (from memory). The maker governs.
    L("fastener_torque", "min_max", "lbf_ft", { min: 70, max: 80, gaugeKind: "torque-wrench" }, "torque/main-caps"),
    L("fastener_torque", "min_max", "lbf_ft", { min: 65, max: 70, gaugeKind: "torque-wrench" }, "torque/head-bolts"),
    L("fastener_torque", "min_max", "lbf_ft", { min: 40, max: 45, gaugeKind: "torque-wrench" }, "torque/rod-bolts"),
    L("fastener_torque", "min_max", "lbf_ft", { min: 60, max: 65, gaugeKind: "torque-wrench" }, "torque/flywheel"),
    L("fastener_torque", "min_max", "lbf_ft", { min: 60, max: 70, gaugeKind: "torque-wrench" }, "torque/damper"),
  ],
};
