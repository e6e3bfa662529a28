// A gauge's uncertainty budget after JCGM 100 (the GUM): its certificate (U/k), the repeatability
// its latest study found and its resolution (δ/√12), combined in quadrature and expanded at k = 2.
// One reading is judged at a time, so the study's s itself counts, not s/√n.
import { uncertaintyAtK2 } from "../gauge-uncertainty";
import { readingUncertainty } from "../uncertainty";
import type { BudgetLine, GaugeBudget, GaugeStudySummary } from "./types";

export interface GaugeBudgetInput {
  /** The certificate's expanded uncertainty at its coverage factor k. */
  expandedU: number;
  coverageK: number;
  /** The gauge's smallest step; 0 or absent leaves the line out. */
  resolution?: number;
  study?: Pick<GaugeStudySummary, "repeatSd"> | null;
}

/** Each standard uncertainty of the gauge, their combination uc and the expanded U = 2·uc. */
export function gaugeBudget(input: GaugeBudgetInput): GaugeBudget {
  const certificateAtK2 = uncertaintyAtK2(input.expandedU, input.coverageK);
  const resolution = input.resolution ?? 0;
  const repeatSd = input.study?.repeatSd ?? 0;
  const r = readingUncertainty({ calibrationU: certificateAtK2, k: 2, resolution, repeatSd, repeatN: 1 });
  const lines: BudgetLine[] = [{ source: "certificate", standardU: r.uCal }];
  if (input.study) lines.push({ source: "repeatability", standardU: r.uRep });
  if (resolution > 0) lines.push({ source: "resolution", standardU: r.uRes });
  return { lines, uc: r.uc, U: r.U };
}
