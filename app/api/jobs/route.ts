import { jobSchema } from "@/lib/schemas/job";
import { boardQuerySchema } from "@/lib/schemas/job-board";
import { listJobBoard } from "@/lib/server/board/board";
import { createJob } from "@/lib/server/job-edit/repo";
import { authed, readJson } from "@/lib/server/core/route";
import { invalid } from "@/lib/server/core/errors";

/**
 * The jobs board, a page at a time: ?page=&pageSize=&status=&sort=&dir=&q=&flagged= (lib/schemas/job-board.ts)
 * → { jobs, total, page, pageSize, pageCount, shopJobs }. Bad parameters are 422 naming the parameter.
 */
export const GET = authed(["lead", "admin"], async ({ req, actor }) => {
  const parsed = boardQuerySchema.safeParse(Object.fromEntries(new URL(req.url).searchParams));
  if (!parsed.success) throw invalid(parsed.error, "Some filters need fixing");
  return listJobBoard(actor.shopId, parsed.data);
});

/** A new job: customer (picked or new), engine, template snapshot. */
export const POST = authed(["lead"], async ({ req, actor }) => {
  const values = await readJson(req, jobSchema);
  return Response.json(await createJob(actor, values), { status: 201 });
});
