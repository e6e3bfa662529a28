// The sizes a job machines to (finished bore, main and rod journal after any oversize or
// undersize), as the job form and POST/PATCH /api/jobs send them, in the job's units. Job-size
// limits, ISO 286 classes and per-inch rules follow them (lib/domain/job-sizes.ts). Each may be
// left empty; one that is given must be a size above zero. Whether a size is plausible for the
// engine is a separate check.
import { z } from "zod";
import { JOB_SIZE_WORDS, type ColumnPrecision, type JobSize } from "@/lib/domain";
import { ENGINE_SIZE_PRECISION, FINISHED_SIZE_PRECISION, keptBy } from "./stored-figure";

const optionalSize = (what: string, precision: ColumnPrecision) =>
  z
    .number({ error: `Enter the ${what} as a number, or leave it empty` })
    .positive(`The ${what} is a size above zero; enter it or leave it empty`)
    .max(10000, `Check the ${what}: it is too large`)
    .superRefine(keptBy(precision, `The ${what}`))
    .nullish();
const finishedSize = (size: JobSize) => optionalSize(JOB_SIZE_WORDS[size], FINISHED_SIZE_PRECISION);

export const finishedSizesSchema = z.strictObject({
  bore: finishedSize("bore"),
  mainJournal: finishedSize("mainJournal"),
  rodJournal: finishedSize("rodJournal"),
});
export type FinishedSizesInput = z.input<typeof finishedSizesSchema>;

/** A job's finished sizes as the server answers them: null where the job states none. */
export type FinishedSizes = Record<JobSize, number | null>;

/** The engine's standard journal sizes, when known (a finished journal is over or under them). */
export const engineJournalFields = {
  nominalMainJournal: optionalSize("standard main journal size", ENGINE_SIZE_PRECISION),
  nominalRodJournal: optionalSize("standard rod journal size", ENGINE_SIZE_PRECISION),
};
