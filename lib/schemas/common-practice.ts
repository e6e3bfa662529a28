// When a limit keeps its "common practice" mark (COMMON_PRACTICE_WORDS in lib/domain/words.ts).
// A starter sheet's figures are typical values; the mark stays on a limit until someone changes
// that limit's figures (its type, unit or values), on the sheet or on a job's own copy. A new
// label, gauge or "required" does not make a typical figure the maker's, so the mark stays then.
import { LIMIT_FIELDS, type LimitValues } from "./spec";

const keyOf = (l: LimitValues) => `${l.characteristic}|${l.stationPattern.trim()}`;

function figuresOf(l: LimitValues): string {
  const values = LIMIT_FIELDS[l.limitType].map((f) => {
    const v = l[f];
    if (typeof v === "string") return v.trim() || null;
    return typeof v === "number" ? Number(v) : null;
  });
  return JSON.stringify([l.limitType, l.unit, ...values]);
}

/**
 * The mark each limit is saved with. `previous` is what was stored before this save (null for a
 * new sheet or an import: the limits say for themselves, so an exported starter sheet keeps its
 * marks). On an edit, a limit stays marked only where the stored limit for the same
 * characteristic and stations was marked and its figures are unchanged, unless the request says
 * `commonPractice: false` (the lead checked the figure against the maker's and it matched). A
 * request can take a mark off; it cannot put one back.
 */
export function commonPracticeMarks(limits: LimitValues[], previous: LimitValues[] | null): boolean[] {
  if (!previous) return limits.map((l) => l.commonPractice === true);
  const marked = new Map(previous.filter((p) => p.commonPractice).map((p) => [keyOf(p), figuresOf(p)]));
  return limits.map((l) => l.commonPractice !== false && marked.get(keyOf(l)) === figuresOf(l));
}
