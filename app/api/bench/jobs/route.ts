import { BENCH_ROLES } from "@/lib/schemas/enums";
import { listBenchJobs } from "@/lib/server/bench/pack";
import { authed } from "@/lib/server/core/route";

// Open jobs the bench can pick (intake, measuring, review; not locked), soonest due first.
export const GET = authed(BENCH_ROLES, async ({ actor }) => ({ jobs: await listBenchJobs(actor) }));
