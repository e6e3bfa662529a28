import "server-only";
import { ZodError } from "zod";
import type { FieldErrors } from "@/lib/schemas/errors";
import { classifyDbError, type DbFailure } from "@/lib/server/core/db-errors";
import { pathWords } from "@/lib/server/log/field-words";

// One error class, one code-to-status table, one converter.
export const ERROR_STATUS = {
  bad_json: 400,
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  job_locked: 409,
  gone: 410,
  payload_too_large: 413,
  unsupported_media: 415,
  invalid: 422,
  too_many_attempts: 429,
  internal: 500,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: FieldErrors,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = "AppError";
  }
  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export const notFound = (what = "Record") => new AppError("not_found", `${what} not found`);
export const forbidden = (message = "Your role cannot do this") => new AppError("forbidden", message);

/** zod issues → { "field.path": ["message"] }, the shape every 422 carries. */
export function fieldErrors(error: ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function invalid(error: ZodError, message = "Some fields need fixing") {
  return new AppError("invalid", message, fieldErrors(error));
}

/** Seconds a client waits before asking again while the database is out of reach. */
export const OUTAGE_RETRY_AFTER_S = 5;

export function unavailable(): AppError {
  return new AppError(
    "unavailable",
    "The server cannot reach its database just now; try again in a moment",
    undefined,
    { "Retry-After": String(OUTAGE_RETRY_AFTER_S) },
  );
}

/** A broken database constraint as the 422 the schema should have given, naming the field. */
function constraintError(f: Extract<DbFailure, { kind: "constraint" }>): AppError {
  const message = f.field === "_" ? f.words : `${pathWords(f.field)}: ${f.words}`;
  return new AppError("invalid", message, { [f.field]: [f.words] });
}

/** One structured line per failure (what and where, never the values sent). */
function logOnce(event: string, detail: Record<string, unknown>): void {
  console.error(JSON.stringify({ at: new Date().toISOString(), app: "tenthwise", event, ...detail }));
}

/** An error as a database failure's answer, or null when it is no database failure we know. */
export function dbFailureError(err: unknown): AppError | null {
  const f = classifyDbError(err);
  if (!f) return null;
  if (f.kind === "outage") {
    logOnce("db_unavailable", { errno: f.errno, code: f.code });
    return unavailable();
  }
  logOnce("db_constraint", { errno: f.errno, table: f.table, column: f.column, field: f.field });
  return constraintError(f);
}

export function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    const retryAfter = Number(err.headers?.["Retry-After"]);
    const body = {
      error: {
        code: err.code,
        message: err.message,
        ...(err.fields ? { fields: err.fields } : {}),
        ...(Number.isFinite(retryAfter) && retryAfter > 0 ? { retryAfter } : {}),
      },
    };
    return Response.json(body, { status: err.status, headers: err.headers });
  }
  if (err instanceof ZodError) return errorResponse(invalid(err));
  const known = dbFailureError(err);
  if (known) return errorResponse(known);
  logOnce("unhandled", {
    name: err instanceof Error ? err.name : typeof err,
    stack: err instanceof Error ? err.stack : String(err),
  });
  return Response.json({ error: { code: "internal", message: "Something went wrong on the server" } }, { status: 500 });
}
