import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import type { LatestStudyLine } from "@/lib/schemas/gauge-study-overview";
import type { InstrumentRecord } from "@/lib/schemas/instrument";
import { studyState } from "./study-tag";

// The gauges in use whose latest study is due again or failed: a reading such a study does not stand
// behind blocks its job's release, so the list sits above the gauge table.
export function StudiesToDo({ gauges, latest }: { gauges: InstrumentRecord[]; latest: Map<number, LatestStudyLine> }) {
  const today = new Date().toISOString().slice(0, 10);
  const todo = gauges
    .map((g) => ({ g, state: studyState(latest.get(g.id), today) }))
    .filter(({ state }) => state === "due" || state === "failed");
  if (todo.length === 0) return null;
  return (
    <Notice
      tone="caution"
      title={`${todo.length} gauge${todo.length === 1 ? "'s" : "s'"} study is due again or failed`}
    >
      <p>
        A reading taken with a gauge whose study is due, or fails for the reading&apos;s tolerance, blocks its
        job&apos;s release. Study each gauge again.
      </p>
      <ul className="mt-1 flex flex-col" data-testid="studies-to-do">
        {todo.map(({ g, state }) => (
          <li key={g.id}>
            <Link href={`/admin/gauges/${g.id}`} className="inline-flex min-h-11 items-center text-steel underline">
              {g.label} (serial {g.serial})
            </Link>
            : {state === "due" ? `study due since ${latest.get(g.id)?.summary.dueOn}` : "its latest study failed"}
          </li>
        ))}
      </ul>
    </Notice>
  );
}
