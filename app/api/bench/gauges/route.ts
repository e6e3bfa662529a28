import { BENCH_ROLES } from "@/lib/schemas/enums";
import { benchGauges } from "@/lib/server/bench/gauges";
import { authed } from "@/lib/server/core/route";

// The shop's gauges in use, for a study on the tablet (no job needed to run one).
export const GET = authed(BENCH_ROLES, async ({ actor }) => ({ instruments: await benchGauges(actor.shopId) }));
