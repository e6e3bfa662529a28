// What a change of a job's limits (or of the sizes they resolve from) will do, in words the lead
// reads before saving, and when the change is wide enough to ask again. The desk shows it and the
// server holds a wide change back until the lead has confirmed the number it opens, so the rule
// lives here once.

/** Counted by running the very save and rolling it back (lib/server/jobs/reevaluate.ts). */
export type Consequences = {
  flagsOpened: number;
  flagsClosed: number;
  /** Current readings whose verdict (in spec, marginal, out of spec) changes. */
  verdictsChanged: number;
  /** Stations required before or after whose state changes: required or not, or the verdict of its reading. */
  requiredStations: number;
};

/** More flags than this opened by one change asks the lead again, typing the number (rule of this product). */
export const WIDE_CHANGE_FLAGS = 5;

export const isWideChange = (c: Pick<Consequences, "flagsOpened">): boolean => c.flagsOpened > WIDE_CHANGE_FLAGS;

const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** "opens 46 flags, closes 2, changes 5 verdicts, affects 3 required stations"; "changes nothing" when so. */
export function consequenceWords(c: Consequences): string {
  const parts = [
    c.flagsOpened ? `opens ${count(c.flagsOpened, "flag")}` : "",
    c.flagsClosed ? `closes ${c.flagsOpened ? c.flagsClosed : count(c.flagsClosed, "flag")}` : "",
    c.verdictsChanged ? `changes ${count(c.verdictsChanged, "verdict")}` : "",
    c.requiredStations ? `affects ${count(c.requiredStations, "required station")}` : "",
  ].filter(Boolean);
  return parts.length ? parts.join(", ") : "changes no verdict and no flag";
}

/**
 * Required stations whose state changes: required before but not after (or the other way), or
 * required and their current reading's verdict changes.
 */
export function requiredStationsAffected(
  requiredBefore: ReadonlySet<string>,
  requiredAfter: ReadonlySet<string>,
  verdictChangedStations: Iterable<string>,
): number {
  const affected = new Set<string>();
  for (const id of requiredBefore) if (!requiredAfter.has(id)) affected.add(id);
  for (const id of requiredAfter) if (!requiredBefore.has(id)) affected.add(id);
  for (const id of verdictChangedStations) if (requiredBefore.has(id) || requiredAfter.has(id)) affected.add(id);
  return affected.size;
}
