import "server-only";
import type { GaugeStudySummary, StudyThresholds } from "@/lib/domain/gauge-studies/types";
import { STUDY_KINDS, type StudyKind } from "@/lib/schemas/enums";

// A gauge's latest study as one JSON column of a raw gauge query (the readings repo's hot path reads
// gauges by SQL on the transaction's driver connection). The index gauge_studies_latest answers
// it, and MariaDB's subquery cache asks it once per gauge, not once per reading.

/** SELECT list item: the latest study of the gauge aliased `alias`, as JSON, or NULL. */
export const latestStudySql = (alias: string) =>
  `(SELECT JSON_OBJECT('kind', s.kind, 'performedOn', s.performed_on, 'dueOn', s.due_on,
      'repeatSd', s.repeat_sd, 'bias', s.bias, 'grrSd', s.grr_sd, 'thresholds', JSON_EXTRACT(s.thresholds, '$'))
    FROM gauge_studies s WHERE s.instrument_id = ${alias}.id
    ORDER BY s.performed_on DESC, s.id DESC LIMIT 1)`;

const day = (x: unknown) => (x instanceof Date ? x.toISOString() : String(x)).slice(0, 10);

/** The column back as the verdict's summary (the driver may hand JSON back as text or parsed). */
export function studyFromSql(raw: unknown): GaugeStudySummary | null {
  if (raw === null || raw === undefined) return null;
  const o = (typeof raw === "string" ? JSON.parse(raw) : raw) as Record<string, unknown>;
  const kind = String(o.kind) as StudyKind;
  if (!STUDY_KINDS.includes(kind)) return null;
  const thresholds = typeof o.thresholds === "string" ? JSON.parse(o.thresholds) : o.thresholds;
  return {
    kind,
    performedOn: day(o.performedOn),
    dueOn: day(o.dueOn),
    repeatSd: Number(o.repeatSd),
    bias: Number(o.bias),
    ...(o.grrSd !== null && o.grrSd !== undefined ? { grrSd: Number(o.grrSd) } : {}),
    ...(thresholds ? { thresholds: thresholds as StudyThresholds } : {}),
  };
}
