import { QueryClient, isServer } from "@tanstack/react-query";
import { ApiError } from "./api";

// New client per server request, one singleton in the browser.
function makeQueryClient() {
  return new QueryClient({
    defaultOptions: { queries: { staleTime: 30_000, retry: retryQuery, retryDelay, refetchOnWindowFocus: true } },
  });
}

/** Seconds-long waits while the server cannot reach its database (a restart): a few more tries. */
const OUTAGE_RETRIES = 4;

/** Once for anything, a few times while the server says it is briefly unavailable (503) or busy (429). */
export function retryQuery(failures: number, err: unknown): boolean {
  const waitable = err instanceof ApiError && (err.status === 503 || err.status === 429);
  return failures < (waitable ? OUTAGE_RETRIES : 1);
}

/** The server's Retry-After when it gave one, else TanStack's usual doubling from 1 s (capped at 30 s). */
export function retryDelay(failures: number, err: unknown): number {
  if (err instanceof ApiError && err.retryAfter) return err.retryAfter * 1000;
  return Math.min(1000 * 2 ** failures, 30_000);
}

let browserClient: QueryClient | undefined;

export function getQueryClient() {
  if (isServer) return makeQueryClient();
  browserClient ??= makeQueryClient();
  return browserClient;
}
