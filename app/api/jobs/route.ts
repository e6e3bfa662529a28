import { jobSchema } from "@/lib/schemas/job";
import { listJobBoard } from "@/lib/server/jobs/board";
import { createJob } from "@/lib/server/job-edit/repo";
import { authed, readJson } from "@/lib/server/core/route";

/** The jobs board: every job of the shop with progress and open flags. */
export const GET = authed(["lead", "admin"], async ({ actor }) => ({ jobs: await listJobBoard(actor.shopId) }));

/** A new job: customer (picked or new), engine, template snapshot. */
export const POST = authed(["lead"], async ({ req, actor }) => {
  const values = await readJson(req, jobSchema);
  return Response.json(await createJob(actor, values), { status: 201 });
});
