import type { BenchInstrument } from "./sync";

// GET /api/bench/gauges: the shop's gauges in use as a job pack carries them, each with the
// setting master a repeatability study reads, so the tablet offers its certificate's figures.

/** A setting master (ring or gauge block) on file with a gauge: size and expanded U (k = 2), in the gauge's unit. */
export type SettingMaster = { label: string | null; size: number; u: number };

export type StudyGauge = BenchInstrument & { master: SettingMaster | null };

export type BenchGaugesReply = { instruments: StudyGauge[] };
