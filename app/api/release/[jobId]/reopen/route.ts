import { REOPEN_ROLES } from "@/lib/domain";
import { reopenSchema } from "@/lib/schemas/release";
import { reopenRelease } from "@/lib/server/release/sign";
import { authed, parseId, readJson } from "@/lib/server/core/route";

/**
 * A lead reopens a released job with a reason (from the release page or the job page): the
 * release is voided and a new one is needed. Who may, and when, is the core's reopen rule.
 */
export const POST = authed<{ jobId: string }>(REOPEN_ROLES, async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  const input = await readJson(req, reopenSchema);
  return { release: await reopenRelease(actor, jobId, input) };
});
