// Headers of the sync contract (lib/schemas/sync.ts), in a file without zod so the tablet's sync
// code can import them without pulling the schemas into the bench bundle.

/** Whose readings a push carries; the server refuses a push under anyone else's session. */
export const TAKEN_BY_HEADER = "x-tenthwise-taken-by";
