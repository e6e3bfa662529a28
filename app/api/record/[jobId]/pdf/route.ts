import { pdfResponse } from "@/lib/server/record/pdf";
import { recordFile } from "@/lib/server/record/stored";
import { parseId, authed } from "@/lib/server/core/route";

// The build record PDF of a job (?release=<id> for one release, else the standing or latest one;
// a job not yet released prints as a DRAFT). A standing release is the file kept when it was
// signed, unless the database no longer gives its fingerprint. ?download=1 asks the browser to save it.
export const GET = authed<{ jobId: string }>(["lead", "inspector", "admin"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  const q = new URL(req.url).searchParams;
  const releaseId = q.get("release") ? parseId(q.get("release") ?? undefined, "Release") : undefined;
  const { pdf, fileName } = await recordFile(actor.shopId, jobId, { releaseId, liveCheck: true });
  return pdfResponse(pdf, fileName, q.get("download") ? "attachment" : "inline");
});
