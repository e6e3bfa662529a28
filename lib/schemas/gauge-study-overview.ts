import type { GaugeStudySummary } from "@/lib/domain/gauge-studies/types";

// Each gauge's latest study as the gauge list shows it (GET /api/gauge-studies/latest): enough to
// say "study due 2027-06-01", whether it passed, and to list the gauges whose study is due or failed.
export type LatestStudyLine = {
  instrumentId: number;
  passed: boolean;
  summary: GaugeStudySummary;
};
