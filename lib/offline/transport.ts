// HTTP for the sync engine: every call has a timeout (a hung request on bad Wi-Fi must not block
// the one sync run forever) and every answer is sorted into what the engine does next.
import type { PushErrorReply, PushReply, PushResult, SyncFeed } from "@/lib/schemas/sync";
import { TAKEN_BY_HEADER } from "@/lib/schemas/sync-headers";
import type { FieldErrors } from "@/lib/schemas/errors";

export type Fetch = typeof fetch;

/**
 * Worth retrying later, with backoff: no network, a timeout (the server not reached), a 5xx (503 while
 * the server cannot reach its database), or 429. `retryAfterMs` is the server's own Retry-After.
 */
export class TransientError extends Error {
  constructor(
    message: string,
    readonly reach: "unreachable" | "server_error",
    readonly retryAfterMs?: number,
  ) {
    super(message);
  }
}
/** Needs a person: signed out, wrong role, or a request the server cannot take as sent. */
export class ActionError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

export const REQUEST_TIMEOUT_MS = 20_000;

async function send(fetchFn: Fetch, url: string, init: RequestInit): Promise<Response> {
  const ctl = new AbortController();
  const timer = setTimeout(() => ctl.abort(), REQUEST_TIMEOUT_MS);
  try {
    return await fetchFn(url, { ...init, signal: ctl.signal, credentials: "same-origin", cache: "no-store" });
  } catch {
    throw new TransientError("No connection to the server", "unreachable");
  } finally {
    clearTimeout(timer);
  }
}

async function body(res: Response): Promise<Record<string, unknown> | null> {
  return (await res.json().catch(() => null)) as Record<string, unknown> | null;
}

/** Retry-After in seconds (the only form the server sends), as ms; undefined when absent or odd. */
export function retryAfterMs(res: Response): number | undefined {
  const s = Number(res.headers.get("Retry-After"));
  return Number.isFinite(s) && s > 0 ? Math.min(s, 3600) * 1000 : undefined;
}

function refuse(res: Response, json: Record<string, unknown> | null, what: string): never {
  const wait = retryAfterMs(res);
  if (res.status === 503)
    throw new TransientError(
      "The server cannot reach its database just now; trying again shortly",
      "server_error",
      wait,
    );
  if (res.status === 429)
    throw new TransientError("The server asks the tablet to wait; trying again shortly", "server_error", wait);
  if (res.status >= 500)
    throw new TransientError(`The server had a problem (${res.status}); trying again shortly`, "server_error", wait);
  if (res.status === 401) throw new ActionError(401, "Signed out: sign in again so the tablet can send its readings");
  const err = json?.error as { message?: string } | undefined;
  // The server's own words when it gave them (a password change owed); the readings stay queued.
  if (res.status === 403)
    throw new ActionError(
      403,
      err?.message ?? "This account cannot send bench readings; sign in as a machinist or lead",
    );
  throw new ActionError(res.status, `${what}: ${err?.message ?? `the server answered ${res.status}`}`);
}

/**
 * What a push came back with: per-reading results; "too large" (split and send again); or a refusal
 * of the batch as a whole that sending it again unchanged will never turn (400, 413 of one reading,
 * 415, 422 without per-reading results), with the server's words and field errors.
 */
export type PushAnswer =
  | { kind: "results"; results: PushResult[] }
  | { kind: "too_large" }
  | { kind: "refused"; status: number; code: string; message: string; fields: FieldErrors };

const PERMANENT = new Set([400, 413, 415, 422]);

/** Sends readings taken by `takenBy`; the server refuses them under anyone else's session. */
export async function pushBatch(
  fetchFn: Fetch,
  base: string,
  deviceId: string,
  readings: unknown[],
  takenBy: number,
): Promise<PushAnswer> {
  const res = await send(fetchFn, `${base}/api/sync`, {
    method: "POST",
    headers: { "Content-Type": "application/json", [TAKEN_BY_HEADER]: String(takenBy) },
    body: JSON.stringify({ deviceId, readings }),
  });
  const json = await body(res);
  if (res.ok) return { kind: "results", results: (json as PushReply | null)?.results ?? [] };
  if (res.status === 413) return { kind: "too_large" };
  const results = (json as PushErrorReply | null)?.results;
  if ((res.status === 422 || res.status === 409) && Array.isArray(results)) return { kind: "results", results };
  if (PERMANENT.has(res.status)) {
    const err = (json?.error ?? {}) as { code?: string; message?: string; fields?: FieldErrors };
    return {
      kind: "refused",
      status: res.status,
      code: err.code ?? String(res.status),
      message: err.message ?? `The server refused the readings (${res.status})`,
      fields: err.fields ?? {},
    };
  }
  refuse(res, json, "Sending readings failed");
}

export async function pullFeed(fetchFn: Fetch, base: string, since: string, jobs: number[]): Promise<SyncFeed> {
  const q = new URLSearchParams({ since, jobs: jobs.join(",") });
  const res = await send(fetchFn, `${base}/api/sync?${q}`, { method: "GET" });
  const json = await body(res);
  if (!res.ok) refuse(res, json, "Fetching changes failed");
  return json as unknown as SyncFeed;
}

export async function getJson<T>(fetchFn: Fetch, url: string): Promise<T> {
  const res = await send(fetchFn, url, { method: "GET" });
  const json = await body(res);
  if (!res.ok) refuse(res, json, "Loading failed");
  return json as T;
}

/** Photo upload; `unavailable` means the server has no upload route yet (404/501): keep waiting. */
export async function uploadFile(
  fetchFn: Fetch,
  base: string,
  form: FormData,
): Promise<"ok" | "unavailable" | { refused: string }> {
  const res = await send(fetchFn, `${base}/api/attachments`, { method: "POST", body: form });
  if (res.ok) return "ok";
  if (res.status === 404 || res.status === 501) return "unavailable";
  const json = await body(res);
  if (res.status >= 500 || res.status === 401 || res.status === 403) refuse(res, json, "Uploading a photo failed");
  const err = json?.error as { message?: string } | undefined;
  return { refused: err?.message ?? `The server refused the photo (${res.status})` };
}
