import "server-only";
import type { TemplateValues } from "@/lib/schemas/spec";
import { STARTER_NOTES, starterLimit as L } from "./starter-limit";

// Starter sheet: four-cylinder diesel (tractor, industrial or light truck, wet or dry liners),
// metric. The bore and journals are ISO 286 classes around the job's finished sizes (the classes'
// deviations come from ISO 286-2 through the core; choosing H7 and h6 is common practice); every
// other figure is common practice, from memory of usual rebuild values for a bore near 100 mm.
// A diesel's valve lash is set cold with mechanical followers, so it has a window per valve kind.
export const STARTER_DIESEL_FOUR: TemplateValues = {
  name: "Starter · Diesel four, metric (typical figures)",
  engineKind: "Inline four diesel",
  buildKind: "diesel",
  unitSystem: "mm",
  notes: STARTER_NOTES,
  limits: [
    L("bore_diameter", "iso286", "mm", { isoClass: "H7", gaugeKind: "dial-bore-gauge", label: "Finished bore H7" }),
    L("bore_taper", "max_only", "mm", { max: 0.015 }),
    L("bore_out_of_round", "max_only", "mm", { max: 0.01 }),
    L("piston_to_wall", "min_max", "mm", { min: 0.08, max: 0.15 }),
    L("main_journal_diameter", "iso286", "mm", { isoClass: "h6", gaugeKind: "micrometer" }),
    L("rod_journal_diameter", "iso286", "mm", { isoClass: "h6", gaugeKind: "micrometer" }),
    L("main_journal_taper", "max_only", "mm", { max: 0.01 }),
    L("main_journal_out_of_round", "max_only", "mm", { max: 0.008 }),
    L("rod_journal_taper", "max_only", "mm", { max: 0.01 }),
    L("rod_journal_out_of_round", "max_only", "mm", { max: 0.008 }),
    L("main_oil_clearance", "min_max", "mm", { min: 0.04, max: 0.1 }),
    L("rod_oil_clearance", "min_max", "mm", { min: 0.035, max: 0.09 }),
    L("ring_end_gap", "min_max", "mm", { min: 0.3, max: 0.5, gaugeKind: "feeler" }, "ring-gap/*/top"),
    L("ring_end_gap", "min_max", "mm", { min: 0.4, max: 0.65, gaugeKind: "feeler" }, "ring-gap/*/second"),
    L(
      "ring_end_gap",
      "min_max",
      "mm",
      { min: 0.25, max: 0.55, gaugeKind: "feeler", required: false },
      "ring-gap/*/oil",
    ),
    L("rod_side_clearance", "min_max", "mm", { min: 0.15, max: 0.35, gaugeKind: "feeler" }),
    L("crank_end_play", "min_max", "mm", { min: 0.1, max: 0.3, gaugeKind: "dial-indicator" }),
    L("valve_lash", "min_max", "mm", { min: 0.25, max: 0.35, gaugeKind: "feeler" }, "lash/*/int"),
    L("valve_lash", "min_max", "mm", { min: 0.4, max: 0.5, gaugeKind: "feeler" }, "lash/*/exh"),
    // Fastener torque, oiled threads (from memory). Many diesel head and main bolts are finished by
    // an angle the maker gives; the figure here is only the torque step before it.
    L("fastener_torque", "min_max", "nm", { min: 130, max: 150, gaugeKind: "torque-wrench" }, "torque/main-caps"),
    L("fastener_torque", "min_max", "nm", { min: 110, max: 130, gaugeKind: "torque-wrench" }, "torque/head-bolts"),
    L("fastener_torque", "min_max", "nm", { min: 80, max: 100, gaugeKind: "torque-wrench" }, "torque/rod-bolts"),
    L("fastener_torque", "min_max", "nm", { min: 120, max: 140, gaugeKind: "torque-wrench" }, "torque/flywheel"),
    L("fastener_torque", "min_max", "nm", { min: 200, max: 250, gaugeKind: "torque-wrench" }, "torque/damper"),
  ],
};
