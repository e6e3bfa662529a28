import { checkCustomerToken } from "@/lib/server/release/customer-link";
import { customerView } from "@/lib/server/release/customer-view";
import { open } from "@/lib/server/core/route";
import { pdfResponse } from "@/lib/server/record/pdf";
import { recordFile } from "@/lib/server/record/stored";

// Public: the customer's download of the one record their signed link names (the file kept when
// it was signed; a VOID copy once the release is withdrawn). A link that has expired or been
// altered goes back to /r/<token>, which says so in words and whom to ask.
export const GET = open<{ token: string }>(async ({ req, params }) => {
  const back = new URL(`/r/${encodeURIComponent(params.token)}`, req.url);
  if (!checkCustomerToken(params.token).ok) return Response.redirect(back, 303);
  const view = await customerView(params.token);
  if (view.status !== "ok") return Response.redirect(back, 303);
  const { pdf, fileName } = await recordFile(view.shopId, view.jobId, { releaseId: view.releaseId });
  return pdfResponse(pdf, fileName, "attachment");
});
