import { verifyRelease } from "@/lib/server/release/hash-verify";
import { authed, parseId } from "@/lib/server/core/route";

/** Recomputes the latest release's hash (or ?release=ID's) from the database now, with what differs. */
export const GET = authed<{ jobId: string }>(["inspector", "lead", "admin"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  const raw = new URL(req.url).searchParams.get("release");
  return verifyRelease(actor.shopId, jobId, raw ? parseId(raw, "Release") : undefined);
});
