import { buildRecordPdf, pdfResponse } from "@/lib/server/record/pdf";
import { parseId, authed } from "@/lib/server/core/route";

// The build record PDF of a job (?release=<id> for one release, else the standing or latest one;
// a job not yet released prints as a DRAFT). ?download=1 asks the browser to save it.
export const GET = authed<{ jobId: string }>(["lead", "inspector", "admin"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  const q = new URL(req.url).searchParams;
  const releaseId = q.get("release") ? parseId(q.get("release") ?? undefined, "Release") : undefined;
  const { pdf, fileName } = await buildRecordPdf(actor.shopId, jobId, { releaseId });
  return pdfResponse(pdf, fileName, q.get("download") ? "attachment" : "inline");
});
