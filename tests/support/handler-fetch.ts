// A `fetch` for the tablet's code (lib/offline) that answers from the app's exported route
// handlers in this process, signed in as one user: the sync engine meets the real server (real
// MariaDB) without a built app. Every exchange is logged so a test can assert what was said.
import { GET as getPack } from "@/app/api/bench/jobs/[jobId]/route";
import { GET as pullFeed, POST as pushBatch } from "@/app/api/sync/route";
import type { Fetch } from "@/lib/offline/transport";
import type { TestUser } from "./factories";
import { cookieFor, pageRequest } from "./requests";

export type Exchange = { method: string; path: string; status: number; sent?: number };

export function handlerFetch(user: TestUser): { fetch: Fetch; log: Exchange[]; pushes: () => Exchange[] } {
  const log: Exchange[] = [];
  const fetch = (async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(String(input));
    const method = init.method ?? "GET";
    // Only what a browser would put on the wire: the engine's signal, cache and credentials
    // options mean nothing to a handler called in-process.
    const headers = new Headers(init.headers);
    headers.set("cookie", await cookieFor(user));
    const req = pageRequest(url, { method, headers, body: init.body ?? undefined });
    const pack = url.pathname.match(/^\/api\/bench\/jobs\/(\d+)$/);
    let res: Response;
    if (url.pathname === "/api/sync" && method === "POST") res = await pushBatch(req);
    else if (url.pathname === "/api/sync" && method === "GET") res = await pullFeed(req);
    else if (pack && method === "GET") res = await getPack(req, { params: Promise.resolve({ jobId: pack[1] }) });
    else res = Response.json({ error: { code: "not_found", message: "No such route in this test" } }, { status: 404 });
    const sent =
      typeof init.body === "string" ? (JSON.parse(init.body) as { readings?: unknown[] }).readings : undefined;
    log.push({ method, path: url.pathname, status: res.status, ...(sent ? { sent: sent.length } : {}) });
    return res;
  }) as Fetch;
  return { fetch, log, pushes: () => log.filter((e) => e.method === "POST" && e.path === "/api/sync") };
}
