import { BENCH_ROLES } from "@/lib/schemas/enums";
import { feedQuerySchema, pushBatchSchema, TAKEN_BY_HEADER } from "@/lib/schemas/sync";
import { AppError, invalid } from "@/lib/server/core/errors";
import { ingestBatch } from "@/lib/server/sync/ingest";
import { authed, readJson } from "@/lib/server/core/route";
import { syncFeed } from "@/lib/server/sync/feed";

// The bench sync endpoint; the contract is documented at the top of lib/schemas/sync.ts.

export const POST = authed(BENCH_ROLES, async ({ req, actor }) => {
  // A shared tablet sends each person's readings only under their own session (another tab may have
  // signed this browser in as someone else since the engine started).
  const takenBy = req.headers.get(TAKEN_BY_HEADER);
  if (takenBy !== null && takenBy !== String(actor.userId))
    throw new AppError(
      "conflict",
      `This browser is signed in as ${actor.name}, who did not take these readings; ` +
        "they wait on the tablet for the person who did to sign in",
    );
  const batch = await readJson(req, pushBatchSchema);
  const reply = await ingestBatch(actor, batch);
  return Response.json(reply.body, { status: reply.status });
});

export const GET = authed(BENCH_ROLES, async ({ req, actor }) => {
  const q = new URL(req.url).searchParams;
  const parsed = feedQuerySchema.safeParse({ since: q.get("since") ?? undefined, jobs: q.get("jobs") ?? undefined });
  if (!parsed.success) throw invalid(parsed.error, "Fix the query: since=CURSOR&jobs=1,2,3");
  return syncFeed(actor.shopId, parsed.data.since, parsed.data.jobs);
});
