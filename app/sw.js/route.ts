import { readFile } from "node:fs/promises";
import { join } from "node:path";
import { env } from "@/lib/server/core/env";

// Serves the service worker that `serwist build` wrote next to THIS server's build
// (serwist.config.js). A worker in public/ would be shared by every build of the checkout, and a
// precache list from another build would name chunks this server does not have, failing the
// install. Never cached by the browser's HTTP cache, so an update is seen at once.
export const dynamic = "force-dynamic";

export async function GET() {
  const file = join(process.cwd(), env().TW_DIST_DIR, "tw-sw", "sw.js");
  const body = await readFile(file, "utf8").catch(() => null);
  if (body === null) {
    return new Response("// This build has no service worker: run `serwist build` after `next build`.\n", {
      status: 404,
      headers: { "Content-Type": "text/javascript; charset=utf-8", "Cache-Control": "no-store" },
    });
  }
  return new Response(body, {
    headers: { "Content-Type": "text/javascript; charset=utf-8", "Cache-Control": "no-cache" },
  });
}
