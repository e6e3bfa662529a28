import { signSchema } from "@/lib/schemas/release";
import { releaseView } from "@/lib/server/release/view";
import { signRelease } from "@/lib/server/release/sign";
import { authed, parseId, readJson } from "@/lib/server/core/route";

type P = { jobId: string };

/** The release page's data: checklist, reading counts, flags, releases (lib/schemas/release.ts). */
export const GET = authed<P>(["inspector", "lead"], async ({ actor, params }) =>
  releaseView(actor, parseId(params.jobId, "Job")),
);

/** The inspector signs: typed full name + password again; only when the checklist is empty. */
export const POST = authed<P>(["inspector"], async ({ req, actor, params }) => {
  const jobId = parseId(params.jobId, "Job");
  const input = await readJson(req, signSchema);
  return Response.json({ release: await signRelease(actor, jobId, input) }, { status: 201 });
});
