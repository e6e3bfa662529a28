// The DECIMAL columns the desk and admin forms write, and the one refinement that refuses, in
// words, a figure its column cannot keep exactly (lib/domain/stored-figures.ts: too many decimal
// places, or past the column's range), so MariaDB never rounds a typed figure silently nor
// refuses it with an error the form cannot place.
import type { z } from "zod";
import { storedFigureProblem, type ColumnPrecision } from "@/lib/domain";

/** engines.nominal_bore, nominal_stroke, nominal_main_journal, nominal_rod_journal: DECIMAL(10,4). */
export const ENGINE_SIZE_PRECISION: ColumnPrecision = { digits: 10, places: 4 };
/** jobs.finished_bore, finished_main_journal, finished_rod_journal: DECIMAL(10,5). */
export const FINISHED_SIZE_PRECISION: ColumnPrecision = { digits: 10, places: 5 };
/** spec_limits and job_limits min, max, nominal, tolerances and per-inch figures: DECIMAL(14,6). */
export const LIMIT_PRECISION: ColumnPrecision = { digits: 14, places: 6 };
/** instruments.resolution, expanded_u, range_min, range_max: DECIMAL(12,6). */
export const GAUGE_FIGURE_PRECISION: ColumnPrecision = { digits: 12, places: 6 };

/** A superRefine for a figure kept in a column of precision `p`; `what` starts the words. */
export const keptBy =
  (p: ColumnPrecision, what: string) =>
  (x: number, ctx: z.RefinementCtx): void => {
    const problem = storedFigureProblem(x, p, what);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  };
