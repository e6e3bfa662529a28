import "server-only";
import { ZodError } from "zod";
import type { FieldErrors } from "@/lib/schemas/errors";

// One error class, one code-to-status table, one converter.
export const ERROR_STATUS = {
  bad_json: 400,
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  job_locked: 409,
  payload_too_large: 413,
  unsupported_media: 415,
  invalid: 422,
  too_many_attempts: 429,
  internal: 500,
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

export function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    const body = { error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } };
    return Response.json(body, { status: err.status, headers: err.headers });
  }
  if (err instanceof ZodError) return errorResponse(invalid(err));
  console.error("[tenthwise] unhandled error", err);
  return Response.json({ error: { code: "internal", message: "Something went wrong on the server" } }, { status: 500 });
}
