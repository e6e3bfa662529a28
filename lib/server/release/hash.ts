import "server-only";
import { createHash } from "node:crypto";

/*
 * THE CANONICAL RELEASE DOCUMENT, VERSION 1
 * =========================================
 * A release's `hash` is the lower-case hex SHA-256 of the UTF-8 bytes of one JSON text, built
 * from the released record by `canonicalReleaseDocument` below. Anyone holding the same rows can
 * rebuild the text and the hash; nothing in it depends on query order, key order, the driver's
 * number handling or the server's time zone.
 *
 * The document is one object with these keys (written in sorted order, see rule 1):
 *   version       the integer 1
 *   release       { jobId, inspectorId, signedName, signedAt }  (who signed, and when)
 *   job           { id, shopId, code, customerId, engineId, unitSystem, specRevision, buildPlan }
 *   readings      EVERY reading of the job: current ones and the superseded history
 *   limits        the job's own limit snapshot (job_limits)
 *   flags         every flag of the job, with its latest disposition
 *   dispositions  every disposition decision of those flags (the full history)
 *   gauges        every instrument any of those readings was taken with, as it stood at signing
 * Field lists per record: readingRecord, limitRecord, … in hash-snapshot.ts; every
 * listed field is always present (null when the database has none).
 *
 * Rules:
 *  1. Object keys are sorted by UTF-16 code units (JavaScript's default sort, as RFC 8785);
 *     no whitespace anywhere; a property whose value is `undefined` is left out.
 *  2. Arrays are sorted by the record's stable id before writing: readings by their UUID (as a
 *     string), every other section by its integer id (numerically). So two queries that return
 *     the rows in different orders give the same text.
 *  3. DECIMAL columns are written as STRINGS with the column's own scale, exactly the digits the
 *     database stores: value_canonical DECIMAL(14,6) 101.6 → "101.600000", part_temp_c
 *     DECIMAL(6,2) → "21.50", resolution DECIMAL(12,6), coverage_k DECIMAL(4,2). See
 *     `decimalString`. A change of one digit in a stored value changes the text.
 *  4. Other numbers (ids, revisions, and numbers inside the free-form build plan) are written
 *     the way ECMAScript's Number-to-String does (JSON.stringify; RFC 8785 uses the same rule).
 *     NaN and ±Infinity are refused.
 *  5. Times are UTC ISO 8601 with milliseconds, e.g. "2026-12-01T14:03:07.250Z"; dates
 *     (calibration dates) are "YYYY-MM-DD". Booleans are true/false; missing values are null.
 *  6. Strings are written as JSON.stringify writes them.
 *
 * Gauges come from the snapshot stored in the release row at signing (releases.checklist.gauges),
 * not from the instruments table: a gauge is re-calibrated every year, which must not make an
 * old release look tampered with. Which gauge each reading used (instrument_id) is in the
 * readings and so is checked against the live rows.
 *
 * A new field, section or rule means a new version: keep version 1 building exactly this text.
 */
export const CANONICAL_VERSION = 1;

export type CanonicalValue =
  string | number | boolean | null | undefined | CanonicalValue[] | { [key: string]: CanonicalValue };
type Row = { [key: string]: CanonicalValue };

export type ReleaseSnapshot = {
  release: { jobId: number; inspectorId: number; signedName: string; signedAt: string };
  job: Row & { id: number };
  readings: (Row & { id: string })[];
  limits: (Row & { id: number })[];
  flags: (Row & { id: number })[];
  dispositions: (Row & { id: number })[];
  gauges: (Row & { id: number })[];
};

export const SECTIONS = ["readings", "limits", "flags", "dispositions", "gauges"] as const;
export type Section = (typeof SECTIONS)[number];

/** Rule 3: a DECIMAL as its stored digits. Exact for DECIMAL(p ≤ 15): such values survive a double. */
export function decimalString(value: number | string | null | undefined, scale: number): string | null {
  if (value === null || value === undefined) return null;
  const n = typeof value === "number" ? value : Number(value);
  if (!Number.isFinite(n)) throw new Error(`Not a decimal: ${String(value)}`);
  return n.toFixed(scale);
}

/** Rule 5. */
export function isoUtc(value: Date | string | null | undefined): string | null {
  if (value === null || value === undefined) return null;
  const d = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(d.getTime())) throw new Error(`Not a time: ${String(value)}`);
  return d.toISOString();
}

/** Rules 1, 4, 5, 6 for any value: the canonical JSON text. */
export function canonicalJson(value: CanonicalValue): string {
  if (value === null) return "null";
  if (typeof value === "boolean") return value ? "true" : "false";
  if (typeof value === "string") return JSON.stringify(value);
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new Error(`A canonical document cannot hold ${value}`);
    return JSON.stringify(value);
  }
  if (Array.isArray(value)) return `[${value.map((v) => (v === undefined ? "null" : canonicalJson(v))).join(",")}]`;
  if (typeof value === "object") {
    const keys = Object.keys(value)
      .filter((k) => value[k] !== undefined)
      .sort();
    return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(value[k])}`).join(",")}}`;
  }
  throw new Error(`A canonical document cannot hold a ${typeof value}`);
}

function byId<T extends { id: string | number }>(rows: T[]): T[] {
  return [...rows].sort((a, b) => {
    if (typeof a.id === "number" && typeof b.id === "number") return a.id - b.id;
    const x = String(a.id);
    const y = String(b.id);
    return x < y ? -1 : x > y ? 1 : 0;
  });
}

/** Rule 2 applied, then the whole document as canonical JSON text. */
export function canonicalReleaseDocument(s: ReleaseSnapshot): string {
  return canonicalJson({
    version: CANONICAL_VERSION,
    release: s.release,
    job: s.job,
    readings: byId(s.readings),
    limits: byId(s.limits),
    flags: byId(s.flags),
    dispositions: byId(s.dispositions),
    gauges: byId(s.gauges),
  });
}

export const sha256Hex = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");

/** The release hash: SHA-256 (hex) of the canonical document. */
export function releaseHash(s: ReleaseSnapshot): string {
  return sha256Hex(canonicalReleaseDocument(s));
}

export type ItemDigests = { job: string; release: string } & Record<Section, Record<string, string>>;

/**
 * One SHA-256 per record (same canonical rules), kept with the release so that verification can
 * say WHICH records changed. Not part of the hash: the hash alone decides match or not.
 */
export function itemDigests(s: ReleaseSnapshot): ItemDigests {
  const per = (rows: { id: string | number }[]) =>
    Object.fromEntries(rows.map((r) => [String(r.id), sha256Hex(canonicalJson(r as Row))]));
  return {
    job: sha256Hex(canonicalJson(s.job)),
    release: sha256Hex(canonicalJson(s.release)),
    readings: per(s.readings),
    limits: per(s.limits),
    flags: per(s.flags),
    dispositions: per(s.dispositions),
    gauges: per(s.gauges),
  };
}
