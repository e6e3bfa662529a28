import type { FieldErrors } from "@/lib/schemas/errors";

// Browser fetch helper: JSON in, JSON out, and our error envelope turned into an ApiError
// whose message says what to fix and whose `fields` map field errors for forms.
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
    /** Seconds the server asked to wait (503 while it cannot reach its database, 429). */
    readonly retryAfter?: number,
  ) {
    super(message);
  }
}

export async function api<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, ...rest } = init;
  const res = await fetch(url, {
    ...rest,
    headers: { ...(json !== undefined ? { "Content-Type": "application/json" } : {}), ...rest.headers },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
    credentials: "same-origin",
  });
  if (res.status === 204) return undefined as T;
  const body = await res.json().catch(() => null);
  if (!res.ok) {
    const e = body?.error;
    throw new ApiError(
      res.status,
      e?.code ?? "http_error",
      e?.message ?? `The server answered ${res.status}`,
      e?.fields,
      typeof e?.retryAfter === "number" ? e.retryAfter : undefined,
    );
  }
  return body as T;
}
