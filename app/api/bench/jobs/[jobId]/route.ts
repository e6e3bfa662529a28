import { BENCH_ROLES } from "@/lib/schemas/enums";
import { jobPack } from "@/lib/server/bench/pack";
import { authed, parseId } from "@/lib/server/core/route";

// The job pack the tablet stores to work offline (shape documented in lib/schemas/sync.ts).
export const GET = authed<{ jobId: string }>(BENCH_ROLES, async ({ actor, params }) =>
  jobPack(actor, parseId(params.jobId, "Job")),
);
