/**
 * What a refused request says about its fields: each field's path (e.g. "readings.3.value") with
 * what to fix there, in words. Error replies carry it as `error.fields`; forms show it beside
 * the field, and the tablet keeps it beside the reading it refused.
 */
export type FieldErrors = Record<string, string[]>;

/**
 * The digest a page's error carries when the server could not reach its database, so the error
 * screen (app/error.tsx) can say so calmly; Next keeps a digest the thrown error already has.
 */
export const DB_UNAVAILABLE_DIGEST = "tenthwise-db-unavailable";
