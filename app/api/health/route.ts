import { open } from "@/lib/server/core/route";
import { checkHealth } from "@/lib/server/health/check";

// For load balancers and monitors: no sign-in, no details beyond up or not and why in one word.
export const dynamic = "force-dynamic";

export const GET = open(async () => {
  const health = await checkHealth();
  return Response.json(health, {
    status: health.status === "ok" ? 200 : 503,
    headers: { "cache-control": "no-store" },
  });
});
