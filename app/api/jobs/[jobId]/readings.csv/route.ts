import { readingsCsv, textStream } from "@/lib/server/readings/csv-export-stream";
import { authed, parseId } from "@/lib/server/core/route";

/**
 * The job's readings and derived values as CSV (format choices in lib/server/readings/csv-export.ts),
 * written while it downloads. ?history=1 adds earlier readings.
 */
export const GET = authed<{ jobId: string }>(["lead", "inspector", "admin"], async ({ req, actor, params }) => {
  const history = new URL(req.url).searchParams.get("history") === "1";
  const { lines, code } = await readingsCsv(actor.shopId, parseId(params.jobId, "Job"), { history });
  const name = `${code.replace(/[^A-Za-z0-9._-]/g, "_")}-readings${history ? "-history" : ""}.csv`;
  return new Response(textStream(lines()), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8; header=present",
      "Content-Disposition": `attachment; filename="${name}"`,
      "Cache-Control": "no-store",
    },
  });
});
