"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import type { StudyDraftRow } from "@/lib/offline/db";
import { discardDraft } from "@/lib/offline/study-drafts";
import type { StudyDraft } from "@/lib/offline/study-draft-shape";
import { useBench } from "@/components/bench/bench-context";
import { STUDY_KIND_WORDS } from "./words";

const progressWords = (d: StudyDraft) => {
  if (d.kind === "type1") return `${d.readings.length} reading${d.readings.length === 1 ? "" : "s"} so far`;
  const cells = d.design ? d.design.appraisers.length * d.design.parts * d.design.trials : 0;
  return d.design ? `${d.measurements.length} of ${cells} figures` : "people and parts not yet chosen";
};

/** This person's runs kept on the tablet: carry on, or throw one away after saying what it holds. */
export function DraftList({ rows, onOpen }: { rows: StudyDraftRow[]; onOpen: (kind: string) => void }) {
  const { db, actor } = useBench();
  const [asking, setAsking] = useState<string>();
  return (
    <section className="flex flex-col gap-2" aria-labelledby="drafts-title" data-testid="study-drafts">
      <h2 id="drafts-title" className="text-xl font-semibold">
        Your studies in progress
      </h2>
      <ul className="flex flex-col gap-2">
        {rows.map(({ id, draft, updatedAt }) => (
          <li key={id} className="flex flex-wrap items-center gap-3 rounded-tool border-2 border-rule bg-panel p-3">
            <div className="min-w-0 flex-1">
              <p className="font-semibold">
                {STUDY_KIND_WORDS[draft.kind]} · {draft.gauge.label} ({draft.gauge.serial})
              </p>
              <p className="text-sm text-muted">
                {progressWords(draft)} · last figure {new Date(updatedAt).toLocaleString()}
              </p>
            </div>
            {asking === id ? (
              <>
                <span className="font-semibold text-fail">Throw away {progressWords(draft)}?</span>
                <Button tone="danger" onClick={() => void discardDraft(db, actor.userId, draft.kind)}>
                  Throw away
                </Button>
                <Button tone="quiet" onClick={() => setAsking(undefined)}>
                  Keep it
                </Button>
              </>
            ) : (
              <>
                <Button big onClick={() => onOpen(draft.kind)}>
                  Carry on
                </Button>
                <Button tone="quiet" onClick={() => setAsking(id)}>
                  Throw away…
                </Button>
              </>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
