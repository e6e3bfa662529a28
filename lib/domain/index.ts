// The public face of the measurement core. Tablet (offline verdicts) and server (authoritative
// verdicts) both import from here; nothing outside lib/domain re-implements a formula.
export * from "./units";
export * from "./geometry";
export * from "./clearances";
export * from "./fasteners";
export * from "./build-math";
export * from "./thermal";
export * from "./uncertainty";
export * from "./iso286";
export * from "./enums";
export * from "./types";
export * from "./verdict";
export * from "./limits";
export * from "./stations";
export * from "./bench-route";
export * from "./derive";
export * from "./dial-gauge";
export * from "./plausible-range";
export * from "./gauge-uncertainty";
export * from "./current-reading";
export * from "./progress";
export * from "./job-lock";
export * from "./gauges";
export * from "./gauge-range";
export * from "./reading-input";
export * from "./reach";
export * from "./words";
