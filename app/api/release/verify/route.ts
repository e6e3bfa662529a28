import { publicVerifySchema } from "@/lib/schemas/release";
import { notFound, invalid } from "@/lib/server/core/errors";
import { verifyByHash } from "@/lib/server/release/hash-verify";
import { open } from "@/lib/server/core/route";

/**
 * Public: ?hash=<the fingerprint on the build record>[&job=<job code>]. Says only whether the record
 * still matches, the job code and the dates (see verifyByHash for what is withheld and why).
 */
export const GET = open(async ({ req }) => {
  const q = new URL(req.url).searchParams;
  const parsed = publicVerifySchema.safeParse({ hash: q.get("hash") ?? "", job: q.get("job") ?? undefined });
  if (!parsed.success) throw invalid(parsed.error, "Check the fingerprint");
  const result = await verifyByHash(parsed.data.hash, parsed.data.job);
  if (!result) throw notFound("A release with this fingerprint");
  return Response.json(result, { headers: { "Cache-Control": "no-store" } });
});
