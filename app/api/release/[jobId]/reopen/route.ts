import { reopenSchema } from "@/lib/schemas/release";
import { reopenRelease } from "@/lib/server/release/sign";
import { authed, parseId, readJson } from "@/lib/server/core/route";

/** The lead reopens a released job with a reason: the release is voided and a new one is needed. */
export const POST = authed<{ jobId: string }>(["lead"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  const input = await readJson(req, reopenSchema);
  return { release: await reopenRelease(actor, jobId, input) };
});
