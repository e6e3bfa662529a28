import { releaseJobs } from "@/lib/server/release/view";
import { authed } from "@/lib/server/core/route";

/** Jobs with their release readiness (contract: lib/schemas/release.ts). */
export const GET = authed(["inspector", "lead"], async ({ actor }) => ({ jobs: await releaseJobs(actor.shopId) }));
